import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';

import type { OutboxMessage } from '../../../../../shared/api/auth.js';
import { MailText } from '../components/mail-text';
import { AdminApi } from '../data/admin-api';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';

/** Mails the built-in test mail server caught: a list, and the chosen one's text with working links. */
@Component({
  selector: 'hl-outbox-page',
  imports: [LocalDateTimePipe, MailText, MatButtonModule, MatIconModule, MatListModule, MatProgressSpinnerModule],
  templateUrl: './outbox-page.html',
  styleUrl: './outbox-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OutboxPage {
  private readonly api = inject(AdminApi);
  private readonly chosenId = signal<number | null>(null);

  protected readonly messages = rxResource({ stream: () => this.api.outbox(), defaultValue: [] });
  /** The chosen mail, or the newest when none is chosen. */
  protected readonly selected = computed<OutboxMessage | null>(() => {
    const messages = this.messages.value();
    return messages.find((message) => message.id === this.chosenId()) ?? messages[0] ?? null;
  });

  protected showMessage(id: number): void {
    this.chosenId.set(id);
  }

  protected refresh(): void {
    this.messages.reload();
  }
}
