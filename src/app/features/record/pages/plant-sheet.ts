import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';

import type { SheetRow } from '../../../../../shared/api/plant-sheet-answers.js';
import { ApiError } from '../../../core/http/api-error';
import { UnitPreference } from '../../../core/units/unit-preference';
import { METHOD_WORDS } from '../../../shared/readings/reading-words';
import { PlantSheetApi, type NewSkip } from '../../../shared/collection/plant-sheet-api';
import { firstTodo, progressWords, settledPercent } from '../../../shared/collection/sheet-progress';

/** Which half of a row a skip is being written for. */
interface SkipTarget {
  key: string;
  body: Omit<NewSkip, 'reason'>;
  label: string;
}

/**
 * One plant, the whole walk: every colour character and descriptor in walk order, each done this
 * season (chip on grey, code, ΔE00), to do, or skipped with its reason. Tapping a row opens its
 * entry with accession, plant and site carried, and saving comes back here.
 */
@Component({
  selector: 'hl-plant-sheet',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatProgressSpinnerModule, RouterLink],
  templateUrl: './plant-sheet.html',
  styleUrl: './plant-sheet.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlantSheetPage {
  private readonly api = inject(PlantSheetApi);
  private readonly snackBar = inject(MatSnackBar);

  /** The plant's id from the route. */
  readonly plantId = input.required<string>();
  /** Whether the sheet is only looked at (Collection's copy, open to reviewers): no entry, no skips (from the route's data). */
  readonly readOnly = input(false);

  protected readonly system = inject(UnitPreference).system;
  protected readonly methodWords = METHOD_WORDS;
  protected readonly sheet = rxResource({ params: () => Number(this.plantId()), stream: ({ params }) => this.api.sheet(params) });
  protected readonly words = computed(() => {
    const s = this.sheet.value();
    return s ? progressWords(s.progress) : '';
  });
  protected readonly percent = computed(() => {
    const s = this.sheet.value();
    return s ? settledPercent(s.progress) : 0;
  });
  protected readonly next = computed(() => {
    const s = this.sheet.value();
    return s ? firstTodo(s) : null;
  });
  protected readonly skipping = signal<SkipTarget | null>(null);
  protected readonly skipReason = signal('');
  protected readonly skipProblem = signal<string | null>(null);

  /** Query parameters that open the reading form on this plant and character, coming back here after saving. */
  protected colourLink(row: SheetRow): Record<string, number> {
    return { sheet: Number(this.plantId()), character: row.colour!.characterId };
  }

  /** Query parameters that open descriptor entry on this plant, at this descriptor. */
  protected descriptorLink(row: SheetRow): Record<string, number> {
    const s = this.sheet.value()!;
    return { accession: s.accession.id, plant: s.plant.id, descriptor: row.descriptor!.descriptorId, sheet: s.plant.id };
  }

  protected startSkip(row: SheetRow, half: 'colour' | 'descriptor'): void {
    const body = half === 'colour' ? { characterId: row.colour!.characterId } : { descriptorId: row.descriptor!.descriptorId };
    this.skipping.set({ key: `${row.key}:${half}`, body, label: half === 'colour' ? row.colour!.label : row.descriptor!.label });
    this.skipReason.set('');
    this.skipProblem.set(null);
  }

  protected saveSkip(): void {
    const target = this.skipping();
    const reason = this.skipReason().trim();
    if (!target) return;
    if (!reason) {
      this.skipProblem.set('Say why it is skipped (required).');
      return;
    }
    this.api.skip(Number(this.plantId()), { ...target.body, reason } as NewSkip).subscribe({
      next: () => {
        this.skipping.set(null);
        this.snackBar.open(`${target.label}: skipped this season.`, 'OK', { duration: 3000 });
        this.sheet.reload();
      },
      error: (error: unknown) => this.skipProblem.set(error instanceof ApiError ? error.message : 'The server could not be reached.'),
    });
  }
}
