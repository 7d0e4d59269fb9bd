import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { RouterLink } from '@angular/router';

import { AuthStore } from '../../../core/auth/auth-store';
import { ApiError } from '../../../core/http/api-error';
import { deltaEText, labText } from '../../../shared/chips/chip-words';
import { ReferenceSetTabs } from '../components/reference-set-tabs';
import { PrintBatchesApi } from '../data/print-batches-api';
import { parsePatchLines, patchRefusals } from '../data/print-patch-lines';
import { PRINT_KIND_WORDS, printDay, summaryText } from './prints-page';

/**
 * One print batch: each re-measured patch beside its chip on the grey surround with ΔE00 and its
 * verdict, furthest first, the median and largest; admins paste or type measured patches.
 */
@Component({
  selector: 'hl-print-batch-page',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressSpinnerModule, ReferenceSetTabs, RouterLink],
  templateUrl: './print-batch-page.html',
  styleUrl: './print-batch-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PrintBatchPage {
  private readonly api = inject(PrintBatchesApi);
  private readonly auth = inject(AuthStore);

  /** The batch id, from the address. */
  readonly id = input.required<string>();

  protected readonly batch = rxResource({ params: () => Number(this.id()), stream: ({ params }) => this.api.get(params) });
  protected readonly isAdmin = computed(() => this.auth.currentUser()?.role === 'admin');
  protected readonly kindWords = PRINT_KIND_WORDS;
  protected readonly summaryText = summaryText;
  protected readonly printDay = printDay;
  protected readonly de = deltaEText;
  protected readonly labText = labText;

  protected readonly lines = signal('');
  protected readonly saving = signal(false);
  protected readonly problems = signal<string[]>([]);
  protected readonly added = signal<number | null>(null);

  protected save(): void {
    this.added.set(null);
    const { patches, problems } = parsePatchLines(this.lines());
    if (problems.length || patches.length === 0) {
      this.problems.set(problems.length ? problems : ['Type or paste at least one patch (required): a chip code and L* a* b* per line.']);
      return;
    }
    this.problems.set([]);
    this.saving.set(true);
    this.api.addPatches(Number(this.id()), patches.map((p) => ({ chipCode: p.chipCode, lab: p.lab }))).subscribe({
      next: (detail) => {
        this.saving.set(false);
        this.lines.set('');
        this.added.set(patches.length);
        this.batch.set(detail);
      },
      error: (error: unknown) => {
        this.saving.set(false);
        if (error instanceof ApiError) this.problems.set(['Nothing was saved.', ...patchRefusals(error.fieldErrors, patches)]);
        else this.problems.set(['Something went wrong; nothing was saved. Try again.']);
      },
    });
  }
}
