import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';

import { AuthStore } from '../../../core/auth/auth-store';
import { PlantSheetApi } from '../../../shared/collection/plant-sheet-api';
import { plantSheetPath } from '../../../shared/collection/sheet-link';
import { progressWords, settledPercent } from '../../../shared/collection/sheet-progress';

/** Words of each progress state, with an icon so the state never rests on colour alone. */
export const STATE_WORDS = {
  complete: { label: 'Fully characterised', icon: 'task_alt' },
  partial: { label: 'Partly characterised', icon: 'pending' },
  'not-started': { label: 'Not started', icon: 'radio_button_unchecked' },
} as const;

/** This season's progress of each plant of an accession, each opening its plant sheet. */
@Component({
  selector: 'hl-plant-progress-list',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (progress.hasValue()) {
      @let plants = progress.value();
      <ul class="list">
        @for (p of plants; track p.plantId) {
          <li>
            <a class="plant" [routerLink]="sheetPath(p.plantId)" [attr.aria-label]="'Plant sheet of ' + p.plantLabel">
              <span class="head">
                <strong>Plant {{ p.plantLabel }}</strong>
                <span class="state"><mat-icon inline aria-hidden="true">{{ words[p.state].icon }}</mat-icon> {{ words[p.state].label }} · {{ p.seasonLabel ?? 'no season ' + p.seasonYear }}</span>
              </span>
              <span class="counts">{{ countWords(p) }}</span>
              <mat-progress-bar mode="determinate" [value]="percent(p)" [attr.aria-label]="percent(p) + ' % done or skipped'" />
            </a>
          </li>
        } @empty {
          <li class="hl-muted">No plants to characterise.</li>
        }
      </ul>
    } @else if (progress.error()) {
      <p class="hl-muted" role="alert">Progress could not be loaded. <button mat-button type="button" (click)="progress.reload()">Try again</button></p>
    }
  `,
  styles: `
    .list {
      list-style: none;
      margin: 0;
      padding: 0;
    }
    .plant {
      display: flex;
      flex-direction: column;
      gap: 4px;
      padding: 12px 0;
      min-height: 48px;
      color: inherit;
      text-decoration: none;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .head {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
      justify-content: space-between;
    }
    .state,
    .counts {
      font: var(--mat-sys-body-small);
      font-variant-numeric: tabular-nums;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class PlantProgressList {
  private readonly api = inject(PlantSheetApi);
  private readonly auth = inject(AuthStore);

  readonly accessionId = input.required<number>();
  /** Bumped by the page when plants change, to load again. */
  readonly reload = input(0);

  protected readonly words = STATE_WORDS;
  protected readonly progress = rxResource({ params: () => ({ id: this.accessionId(), n: this.reload() }), stream: ({ params }) => this.api.accessionProgress(params.id) });

  /** Recorders open the sheet to fill in; reviewers the same sheet read-only. */
  protected sheetPath(plantId: number): (string | number)[] {
    return plantSheetPath(this.auth.role(), plantId);
  }

  protected countWords(p: Parameters<typeof progressWords>[0]): string {
    return progressWords(p);
  }

  protected percent(p: Parameters<typeof settledPercent>[0]): number {
    return settledPercent(p);
  }
}
