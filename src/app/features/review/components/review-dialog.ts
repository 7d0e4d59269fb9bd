import { ChangeDetectionStrategy, Component, ElementRef, computed, inject, signal, viewChild } from '@angular/core';
import { rxResource, takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';

import { ApiError } from '../../../core/http/api-error';
import { EarlierReadings } from '../../../shared/readings/earlier-readings';
import { PhotoCrop } from '../../../shared/photos/photo-crop';
import { ReadingMatch } from '../../../shared/readings/reading-match';
import { METHOD_WORDS, STATUS_WORDS, wordsFor } from '../../../shared/readings/reading-words';
import { ReadingsApi } from '../../../shared/readings/readings-api';
import { CUT_SECONDS_WARN, type ReadingDetail } from '../../../../../shared/api/reading-answers.js';
import { REVIEW_COMMENT_MAX, REVIEW_DECISION_LABELS, type ReviewAnswer, type ReviewDecision, type ReviewQueueQuery } from '../../../../../shared/api/review-answers.js';
import { DECISION_KEYS, decisionForKey } from '../data/review-keys';
import { ReviewsApi } from '../data/reviews-api';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';
import { ProblemNotice } from '../../../shared/problem-notice';
import { LightFacts } from '../../../shared/readings/light-facts';

/** What the queue page opens the dialog with. */
export interface ReviewDialogData {
  /** The readings of the queue page shown, in order. */
  ids: number[];
  /** Which of them to open first. */
  index: number;
  /** The queue's filters, to fetch more once these are worked through. */
  query: ReviewQueueQuery;
  /** Called after each decision, so the queue behind can refresh. */
  decided: (answer: ReviewAnswer) => void;
}

/** What each decision that needs words asks for. */
const COMMENT_LABELS: Record<Exclude<ReviewDecision, 'approve'>, { label: string; hint: string; send: string }> = {
  flag: { label: 'Why flag it?', hint: 'The recorder reads this in the e-mail and in the app.', send: 'Flag reading' },
  reread: { label: 'What should be read again, and how?', hint: 'e.g. “Read the petiole’s middle third again in open shade.” The recorder is e-mailed.', send: 'Ask for a re-read' },
};

/**
 * One reading to review: its colour, chips and photo crop, its conditions and notes; Approve, Flag
 * (reason required) or Ask for a re-read (what to re-read required), by button or by A / F / R.
 * After each decision the next reading of the queue opens.
 */
@Component({
  selector: 'hl-review-dialog',
  imports: [LightFacts, ProblemNotice, EarlierReadings, LocalDateTimePipe, MatButtonModule, MatDialogModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, PhotoCrop, ReactiveFormsModule, ReadingMatch, RouterLink],
  templateUrl: './review-dialog.html',
  styleUrl: './review-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewDialog {
  private readonly readingsApi = inject(ReadingsApi);
  private readonly reviewsApi = inject(ReviewsApi);
  private readonly dialogRef = inject(MatDialogRef<ReviewDialog, number>);
  private readonly data = inject<ReviewDialogData>(MAT_DIALOG_DATA);
  private readonly commentBox = viewChild<ElementRef<HTMLTextAreaElement>>('commentBox');

  private readonly ids = signal<number[]>(this.data.ids);
  private readonly index = signal(this.data.index);
  private readonly decidedIds = new Set<number>();

  protected readonly currentId = computed(() => this.ids()[this.index()] ?? null);
  protected readonly reading = rxResource({ params: () => this.currentId() ?? undefined, stream: ({ params }) => this.readingsApi.get(params) });
  protected readonly position = computed(() => `${this.index() + 1} of ${this.ids().length}`);
  protected readonly mode = signal<Exclude<ReviewDecision, 'approve'> | null>(null);
  protected readonly commentWords = computed(() => {
    const m = this.mode();
    return m ? COMMENT_LABELS[m] : null;
  });
  protected readonly comment = new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(REVIEW_COMMENT_MAX)] });
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);
  /** What the last decision did, shown above the next reading. */
  protected readonly done = signal<string | null>(null);
  /** How many decisions were made in this dialog. */
  protected readonly count = signal(0);

  protected readonly keys = DECISION_KEYS;
  protected readonly labels = REVIEW_DECISION_LABELS;
  protected readonly commentMax = REVIEW_COMMENT_MAX;
  /** Corm flesh and sap brown after the cut (our own threshold, not a standard). */
  protected readonly cutWarn = CUT_SECONDS_WARN;
  protected readonly methodWords = METHOD_WORDS;
  protected readonly statusWords = STATUS_WORDS;
  protected readonly wordsFor = wordsFor;

  constructor() {
    // The overlay's key events: the focus may be on the dialog's container, outside this component.
    this.dialogRef
      .keydownEvents()
      .pipe(takeUntilDestroyed())
      .subscribe((event) => this.shortcut(event));
  }

  /** A, F, R from anywhere in the dialog except while typing. */
  private shortcut(event: KeyboardEvent): void {
    const decision = decisionForKey(event);
    if (!decision || this.busy() || !this.reading.hasValue()) return;
    event.preventDefault();
    this.choose(decision);
  }

  /** Approve decides at once; Flag and Re-read first ask for their words. */
  protected choose(decision: ReviewDecision): void {
    this.problem.set(null);
    if (decision === 'approve') {
      this.send('approve', null);
      return;
    }
    if (this.mode() !== decision) this.comment.reset('');
    this.mode.set(decision);
    setTimeout(() => this.commentBox()?.nativeElement.focus());
  }

  protected cancelComment(): void {
    this.mode.set(null);
    this.comment.reset('');
  }

  protected sendComment(): void {
    const m = this.mode();
    if (!m) return;
    if (this.comment.invalid) {
      this.comment.markAsTouched();
      return;
    }
    this.send(m, this.comment.value.trim());
  }

  /** Ctrl+Enter (or ⌘+Enter) in the comment sends it. */
  protected sendOnCtrlEnter(event: KeyboardEvent): void {
    if (event.key === 'Enter' && (event.ctrlKey || event.metaKey)) {
      event.preventDefault();
      this.sendComment();
    }
  }

  protected skip(): void {
    const id = this.currentId();
    if (id !== null) this.decidedIds.add(id);
    this.done.set(null);
    this.next();
  }

  protected close(): void {
    this.dialogRef.close(this.count());
  }

  private send(decision: ReviewDecision, comment: string | null): void {
    const id = this.currentId();
    if (id === null) return;
    this.busy.set(true);
    this.reviewsApi.review(id, { decision, comment }).subscribe({
      next: (answer) => {
        this.busy.set(false);
        this.decidedIds.add(id);
        this.count.update((n) => n + 1);
        this.done.set(this.doneWords(id, decision, answer));
        this.data.decided(answer);
        this.next();
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.problem.set(error instanceof ApiError ? error.message : 'The decision could not be saved. Try again.');
      },
    });
  }

  private doneWords(id: number, decision: ReviewDecision, answer: ReviewAnswer): string {
    const what = decision === 'approve' ? 'approved' : decision === 'flag' ? 'flagged' : 'sent back for a re-read';
    return `Reading ${id} ${what}${answer.mailed ? '; the recorder was e-mailed' : ''}.`;
  }

  /** The next reading not yet worked: later on this page, else the first of the queue as it now stands, else close. */
  private next(): void {
    this.mode.set(null);
    this.comment.reset('');
    const ids = this.ids();
    const later = ids.findIndex((id, i) => i > this.index() && !this.decidedIds.has(id));
    if (later >= 0) {
      this.index.set(later);
      return;
    }
    this.reviewsApi.queue({ ...this.data.query, page: 1 }).subscribe({
      next: (list) => {
        const fresh = list.items.map((r) => r.id).filter((id) => !this.decidedIds.has(id));
        if (fresh.length === 0) this.dialogRef.close(this.count());
        else {
          this.ids.set(fresh);
          this.index.set(0);
        }
      },
      error: () => this.dialogRef.close(this.count()),
    });
  }

  protected photoOf(r: ReadingDetail) {
    const p = r.provenance;
    return p.photoId !== null && p.region && p.photoWidth && p.photoHeight ? { id: p.photoId, region: p.region, card: p.neutralRegion, size: { width: p.photoWidth, height: p.photoHeight } } : null;
  }
}
