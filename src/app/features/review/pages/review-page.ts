import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatTableModule } from '@angular/material/table';
import { Router } from '@angular/router';

import { Viewport } from '../../../core/layout/viewport';
import { CollectionApi } from '../../../shared/collection/collection-api';
import { METHOD_WORDS, STATUS_WORDS, wordsFor } from '../../../shared/readings/reading-words';
import { VerdictMark } from '../../../shared/chips/verdict-mark';
import { deltaEText } from '../../../shared/chips/chip-words';
import type { ReviewQueueQuery } from '../../../../../shared/api/review-answers.js';
import { QueueFilters } from '../components/queue-filters';
import { ReviewDialog, type ReviewDialogData } from '../components/review-dialog';
import { QUEUE_DEFAULT_STATUS, QUEUE_PAGE_SIZES, paramsFromQueue, queueFromParams } from '../data/review-filters';
import { ReviewsApi } from '../data/reviews-api';
import { ReadingListParams } from '../../../shared/readings/reading-list-params';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';
import { ReloadState } from '../../../shared/reload-state';
import { ConfirmDialog, type ConfirmDialogData } from '../../../shared/confirm-dialog';
import { ApiError } from '../../../core/http/api-error';

/**
 * Review: the queue of readings to review (submitted unless another status is picked), oldest
 * first, with server-side filters and pages kept in the URL; cards on a phone, a table at a desk.
 * Opening one starts the review dialog, which moves on to the next after each decision.
 */
@Component({
  selector: 'hl-review-page',
  imports: [LocalDateTimePipe, ReloadState, MatButtonModule, MatIconModule, MatPaginatorModule, MatTableModule, QueueFilters, VerdictMark],
  templateUrl: './review-page.html',
  styleUrls: ['../../../shared/readings/reading-table.scss', './review-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewPage extends ReadingListParams {
  private readonly api = inject(ReviewsApi);
  private readonly collection = inject(CollectionApi);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);

  protected readonly handset = inject(Viewport).handset;
  protected readonly columns = ['swatch', 'observedAt', 'accession', 'character', 'site', 'method', 'deltaE00', 'observer', 'status', 'open'];
  protected readonly pageSizes = QUEUE_PAGE_SIZES;
  protected readonly methodWords = METHOD_WORDS;
  protected readonly statusWords = STATUS_WORDS;
  protected readonly wordsFor = wordsFor;
  protected readonly deltaE = deltaEText;

  protected readonly query = computed(() => queueFromParams(this.listParams()));
  protected readonly statusLabel = computed(() => STATUS_WORDS[this.query().status ?? QUEUE_DEFAULT_STATUS].label.toLowerCase());
  protected readonly filtersOpen = signal(false);

  protected readonly queue = rxResource({ params: () => this.query(), stream: ({ params }) => this.api.queue(params) });
  protected readonly rows = computed(() => (this.queue.hasValue() ? this.queue.value().items : []));
  protected readonly total = computed(() => (this.queue.hasValue() ? this.queue.value().total : 0));
  protected readonly accessions = rxResource({ stream: () => this.collection.accessions() });
  protected readonly characters = rxResource({ stream: () => this.collection.characters() });
  protected readonly sites = rxResource({ stream: () => this.collection.sites() });
  protected readonly observerName = signal<string | null>(null);
  protected readonly approving = signal(false);
  /** What the last bulk approval did, or why it was refused. */
  protected readonly bulkDone = signal<string | null>(null);

  /** Approves every reading shown (the filtered page) after one confirmation, all or nothing. */
  protected approveShown(): void {
    const ids = this.rows().map((r) => r.id);
    if (!ids.length) return;
    const data: ConfirmDialogData = {
      title: `Approve ${ids.length} ${ids.length === 1 ? 'reading' : 'readings'}?`,
      message: `Every reading shown with the current filters is approved at once (readings ${ids.slice(0, 5).join(', ')}${ids.length > 5 ? ` and ${ids.length - 5} more` : ''}). If any of them can no longer be approved, none is.`,
      confirmLabel: `Approve ${ids.length}`,
    };
    this.dialog
      .open(ConfirmDialog, { data })
      .afterClosed()
      .subscribe((yes) => {
        if (!yes) return;
        this.approving.set(true);
        this.api.approveAll(ids).subscribe({
          next: ({ approved }) => {
            this.approving.set(false);
            this.bulkDone.set(`${approved} ${approved === 1 ? 'reading' : 'readings'} approved.`);
            this.queue.reload();
          },
          error: (error: unknown) => {
            this.approving.set(false);
            this.bulkDone.set(error instanceof ApiError ? `Nothing was approved: ${error.message}` : 'Nothing was approved. Try again.');
          },
        });
      });
  }

  protected filter(change: Partial<ReviewQueueQuery>): void {
    if ('observerId' in change && change.observerId === undefined) this.observerName.set(null);
    this.go({ ...this.query(), ...change, page: 1 });
  }

  protected clearFilters(): void {
    this.observerName.set(null);
    this.go({ pageSize: this.query().pageSize, page: 1 });
  }

  protected filterByObserver(observerId: number, name: string): void {
    this.observerName.set(name);
    this.filter({ observerId });
  }

  protected turnPage(event: PageEvent): void {
    this.go({ ...this.query(), page: event.pageIndex + 1, pageSize: event.pageSize });
  }

  /** Opens the review dialog on one reading of this page; the queue refreshes after each decision. */
  protected review(index: number): void {
    const data: ReviewDialogData = { ids: this.rows().map((r) => r.id), index, query: this.query(), decided: () => this.queue.reload() };
    this.dialog
      .open(ReviewDialog, { data, autoFocus: 'dialog', maxWidth: '96vw', width: this.handset() ? '96vw' : '920px' })
      .afterClosed()
      .subscribe(() => this.queue.reload());
  }

  private go(query: ReviewQueueQuery): void {
    void this.router.navigate([], { queryParams: paramsFromQueue(query) });
  }
}
