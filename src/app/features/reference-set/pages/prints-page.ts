import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';

import { PRINT_CAUTION, PRINT_KINDS, PRINT_NOTE_MAX, type PrintKind, type PrintSummary } from '../../../../../shared/api/print-batch-answers.js';
import { AuthStore } from '../../../core/auth/auth-store';
import { ApiError } from '../../../core/http/api-error';
import { formatDateTime, localToday } from '../../../core/format/local-date-time';
import { deltaEText } from '../../../shared/chips/chip-words';
import { ReferenceSetApi } from '../../../shared/chips/reference-set-api';
import { ReferenceSetTabs } from '../components/reference-set-tabs';
import { PrintBatchesApi } from '../data/print-batches-api';

/** What was printed, in words. */
export const PRINT_KIND_WORDS: Record<PrintKind, string> = { card: 'Field card', booklet: 'Fine-chip booklet' };

/** "median ΔE00 0.84, largest 2.31, 1 of 12 beyond 1.8", or that nothing is measured yet. */
export function summaryText(s: PrintSummary): string {
  if (s.n === 0 || s.medianDeltaE00 === null || s.maxDeltaE00 === null) return 'No patches measured yet';
  return `${s.n} ${s.n === 1 ? 'patch' : 'patches'}: median ΔE00 ${deltaEText(s.medianDeltaE00)}, largest ${deltaEText(s.maxDeltaE00)}, ${s.overAcceptable} beyond 1.8`;
}

/** A print day "YYYY-MM-DD" in the reader's date style (read at noon, so no time zone moves the day). */
export function printDay(day: string): string {
  return formatDateTime(`${day}T12:00:00`, 'date');
}

/**
 * Reference set → Printed cards: every print batch of a card or booklet with how far its
 * re-measured patches are from the chips; admins record a new batch here.
 */
@Component({
  selector: 'hl-prints-page',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressSpinnerModule, MatSelectModule, ReferenceSetTabs, RouterLink],
  templateUrl: './prints-page.html',
  styleUrl: './prints-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PrintsPage {
  private readonly api = inject(PrintBatchesApi);
  private readonly router = inject(Router);
  private readonly auth = inject(AuthStore);
  private readonly referenceSets = inject(ReferenceSetApi);

  protected readonly caution = PRINT_CAUTION;
  protected readonly kinds = PRINT_KINDS;
  protected readonly kindWords = PRINT_KIND_WORDS;
  protected readonly noteMax = PRINT_NOTE_MAX;
  protected readonly summaryText = summaryText;
  protected readonly printDay = printDay;
  protected readonly isAdmin = computed(() => this.auth.currentUser()?.role === 'admin');
  protected readonly batches = rxResource({ stream: () => this.api.list() });
  protected readonly sets = rxResource({ stream: () => this.referenceSets.sets() });

  protected readonly setId = signal<string | null>(null);
  protected readonly kind = signal<PrintKind>('card');
  protected readonly printedOn = signal(localToday());
  protected readonly note = signal('');
  protected readonly saving = signal(false);
  protected readonly errors = signal<Record<string, string>>({});
  protected readonly problem = signal<string | null>(null);

  protected record(): void {
    const missing: Record<string, string> = {};
    if (!this.setId()) missing['setId'] = 'Choose the set that was printed (required).';
    if (!this.printedOn()) missing['printedOn'] = 'Give the day it was printed (required).';
    if (!this.note().trim()) missing['note'] = 'Name the printer and paper (required).';
    this.errors.set(missing);
    this.problem.set(null);
    if (Object.keys(missing).length) return;
    this.saving.set(true);
    this.api.create({ setId: this.setId()!, kind: this.kind(), printedOn: this.printedOn(), note: this.note().trim() }).subscribe({
      next: (batch) => void this.router.navigate(['/reference-set/prints', batch.id]),
      error: (error: unknown) => {
        this.saving.set(false);
        if (error instanceof ApiError) {
          this.errors.set(Object.fromEntries(error.fieldErrors.map((e) => [e.field, e.message])));
          this.problem.set(error.detail ?? error.title);
        } else this.problem.set('Something went wrong. Try again.');
      },
    });
  }
}
