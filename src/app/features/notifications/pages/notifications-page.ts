import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import type { NotificationDto, NotificationKind } from '../../../../../shared/api/review-answers.js';
import { calibrationSessionPath } from '../../../../../shared/api/calibration-answers.js';
import { readingUrl } from '../../../../../shared/api/reading-answers.js';
import { NotificationFeed } from '../../../core/notifications/notification-feed';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';

/** Each kind of notice as a heading and an icon. */
const KIND_WORDS: Record<NotificationKind, { title: string; icon: string }> = {
  'reading-flagged': { title: 'Reading flagged', icon: 'flag' },
  'reread-requested': { title: 'Re-read asked for', icon: 'replay' },
  'calibration-invited': { title: 'Invited to calibrate', icon: 'groups' },
  'calibration-results': { title: 'Calibration results out', icon: 'workspace_premium' },
};

/** The signed-in person's notices, newest first; opening one marks it read and goes to the reading, where it can be corrected. */
@Component({
  selector: 'hl-notifications-page',
  imports: [LocalDateTimePipe, MatButtonModule, MatIconModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="hl-page hl-narrow wide">
      <h1>Notifications</h1>
      @if (feed.current() === null) {
        <p class="hl-muted" role="status">Loading notifications…</p>
      } @else if (items().length === 0) {
        <div class="hl-empty">
          <mat-icon aria-hidden="true">notifications_off</mat-icon>
          <p>No notifications. When a reviewer flags one of your readings or asks for a re-read, or a trainer invites you to calibrate or closes your session, it shows here and comes by e-mail.</p>
        </div>
      } @else {
        <p class="hl-muted" role="status">{{ feed.unread() }} unread of {{ items().length }}</p>
        <ul class="list">
          @for (n of items(); track n.id) {
            <li class="item" [class.unread]="!n.readAt">
              <mat-icon class="kind" aria-hidden="true">{{ kind(n).icon }}</mat-icon>
              <div class="body">
                <p class="title">
                  <strong>{{ kind(n).title }}</strong> · {{ subject(n) }}
                  @if (!n.readAt) {
                    <span class="new"><mat-icon aria-hidden="true">fiber_new</mat-icon>unread</span>
                  }
                </p>
                <p class="message">{{ n.message }}</p>
                <p class="hl-muted when"><time [attr.datetime]="n.createdAt">{{ n.createdAt | localDateTime }}</time></p>
                <div class="actions">
                  <a mat-flat-button [routerLink]="url(n)" (click)="open(n)"><mat-icon aria-hidden="true">open_in_new</mat-icon> Open {{ subject(n) }}</a>
                  @if (!n.readAt) {
                    <button mat-button type="button" (click)="feed.markRead(n.id)"><mat-icon aria-hidden="true">done</mat-icon> Mark read</button>
                  }
                </div>
              </div>
            </li>
          }
        </ul>
      }
    </section>
  `,
  styles: `
    .wide {
      max-width: 720px;
    }
    .list {
      list-style: none;
      margin: 0;
      padding: 0;
      display: flex;
      flex-direction: column;
      gap: 12px;
    }
    .item {
      display: flex;
      gap: 12px;
      padding: 12px 16px;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 8px;
    }
    .item.unread {
      border: 2px solid var(--mat-sys-primary);
      background: var(--mat-sys-surface-container-low);
    }
    .kind {
      flex: none;
      margin-top: 2px;
    }
    .body {
      min-width: 0;
    }
    .body p {
      margin: 0 0 6px;
    }
    .title {
      font: var(--mat-sys-title-medium);
    }
    .new {
      display: inline-flex;
      align-items: center;
      gap: 2px;
      font: var(--mat-sys-label-large);
      color: var(--mat-sys-primary);
      mat-icon {
        font-size: 20px;
        width: 20px;
        height: 20px;
      }
    }
    .message {
      overflow-wrap: anywhere;
    }
    .actions {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
    }
  `,
})
export class NotificationsPage {
  protected readonly feed = inject(NotificationFeed);
  protected readonly items = this.feed.items;

  protected kind(n: NotificationDto): { title: string; icon: string } {
    return KIND_WORDS[n.kind] ?? { title: 'Notice', icon: 'notifications' };
  }

  protected url(n: NotificationDto): string {
    return n.readingId !== null ? readingUrl(n.readingId) : calibrationSessionPath(n.sessionId!);
  }

  /** What the notice is about, as a link label: "reading 12" or "session 3". */
  protected subject(n: NotificationDto): string {
    return n.readingId !== null ? `reading ${n.readingId}` : `session ${n.sessionId}`;
  }

  /** Opening a notice marks it read; the link itself navigates. */
  protected open(n: NotificationDto): void {
    this.feed.markRead(n.id);
  }
}
