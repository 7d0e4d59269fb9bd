import { ChangeDetectionStrategy, Component, ErrorHandler, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { catchError, filter, of } from 'rxjs';

import { AuthStore } from '../../../core/auth/auth-store';
import { OfflineQueue } from '../../../core/offline/offline-queue';
import type { PendingReading } from '../../../core/offline/queue-item';
import { ConfirmDialog, type ConfirmDialogData } from '../../../shared/confirm-dialog';
import { CollectionApi } from '../../../shared/collection/collection-api';
import { QueuedReading, type ReadingChange } from '../components/queued-reading';
import { savedAt, waitingWords } from '../data/queue-words';

/**
 * Waiting to send: every reading (and photo) saved on this phone that has not reached the server
 * yet, with "Send now", a way to fix what the server refused, and discarding after a question.
 */
@Component({
  selector: 'hl-queue-page',
  imports: [MatButtonModule, MatIconModule, QueuedReading, RouterLink],
  templateUrl: './queue-page.html',
  styleUrl: './queue-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class QueuePage {
  private readonly queue = inject(OfflineQueue);
  private readonly dialog = inject(MatDialog);
  private readonly errors = inject(ErrorHandler);
  private readonly collection = inject(CollectionApi);
  private readonly auth = inject(AuthStore);

  protected readonly items = this.queue.items;
  protected readonly photos = computed(() => this.queue.photos().filter((p) => !this.items().some((r) => r.body.photo && 'localPhotoId' in r.body.photo && r.body.photo.localPhotoId === p.id)));
  protected readonly sending = this.queue.sending;
  protected readonly userId = computed(() => this.auth.currentUser()?.id ?? null);
  protected readonly heading = computed(() => waitingWords(this.items().length));
  protected readonly attention = this.queue.needsAttention;
  /** What the last "Send now" achieved, in words. */
  protected readonly outcome = signal<string | null>(null);
  protected readonly savedAt = savedAt;

  // Cached by the service worker, so a refused reading can be corrected out of range too.
  protected readonly accessions = rxResource({ stream: () => this.collection.accessions().pipe(catchError(() => of([]))) });
  protected readonly characters = rxResource({ stream: () => this.collection.characters().pipe(catchError(() => of([]))) });

  constructor() {
    void this.queue.refresh();
  }

  protected async sendNow(): Promise<void> {
    this.outcome.set(null);
    try {
      const report = await this.queue.sendNow();
      this.outcome.set(report.offline ? 'No connection yet: everything stays on this phone and goes when it can.' : report.sent.length ? `${report.sent.length} sent.` : report.failed ? 'Nothing could be sent; see each reading below.' : 'Nothing was due to send.');
    } catch (error) {
      this.errors.handleError(error);
    }
  }

  protected async resend(item: PendingReading, change: ReadingChange): Promise<void> {
    try {
      const report = await this.queue.resend(item.id, change.changes, change.summary);
      this.outcome.set(report.sent.length ? 'Sent.' : report.offline ? 'Saved; it goes when the phone is back in range.' : null);
    } catch (error) {
      this.errors.handleError(error);
    }
  }

  protected discard(item: PendingReading): void {
    const data: ConfirmDialogData = {
      title: 'Discard this reading?',
      message: `${item.summary.accession}, ${item.summary.character} (saved ${savedAt(item.createdAt)}) has not reached the server. Discarding deletes it from this phone for good.`,
      confirmLabel: 'Discard',
    };
    this.openConfirm(data, () => this.queue.discard(item.id));
  }

  protected discardPhoto(id: string): void {
    this.openConfirm({ title: 'Discard this photo?', message: 'No reading uses it yet. Discarding deletes it from this phone for good.', confirmLabel: 'Discard' }, () => this.queue.discard(id));
  }

  private openConfirm(data: ConfirmDialogData, then: () => Promise<void>): void {
    this.dialog
      .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data })
      .afterClosed()
      .pipe(filter((yes) => yes === true))
      .subscribe(() => void then().catch((error: unknown) => this.errors.handleError(error)));
  }
}
