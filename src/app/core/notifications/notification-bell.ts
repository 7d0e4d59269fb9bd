import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject } from '@angular/core';
import { MatBadgeModule } from '@angular/material/badge';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import { NotificationFeed } from './notification-feed';

/** The toolbar's bell: the unread count as a badge and in its name, linking to the notices; polls while shown. */
@Component({
  selector: 'hl-notification-bell',
  imports: [MatBadgeModule, MatButtonModule, MatIconModule, RouterLink],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <!-- The link's name carries the count, so the badge itself stays out of the accessibility tree. -->
    <a mat-icon-button routerLink="/notifications" [attr.aria-label]="words()" [title]="words()" [matBadge]="unread() ? badge() : null" matBadgeColor="warn" matBadgeSize="medium">
      <mat-icon aria-hidden="true">{{ unread() ? 'notifications_unread' : 'notifications' }}</mat-icon>
    </a>
  `,
  styles: `
    a {
      color: inherit;
    }
  `,
})
export class NotificationBell {
  private readonly feed = inject(NotificationFeed);

  protected readonly unread = this.feed.unread;
  protected readonly badge = computed(() => (this.unread() > 99 ? '99+' : String(this.unread())));
  protected readonly words = computed(() => {
    const n = this.unread();
    return n === 0 ? 'Notifications: none unread' : `Notifications: ${n} unread`;
  });

  constructor() {
    this.feed.start();
    inject(DestroyRef).onDestroy(() => this.feed.stop());
  }
}
