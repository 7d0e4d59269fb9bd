import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';

import type { InvitationRow } from '../../../../../shared/api/auth.js';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';

/** Invitations not yet accepted, with expired ones marked in words. */
@Component({
  selector: 'hl-invitation-list',
  imports: [LocalDateTimePipe, MatIconModule, MatListModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (pending().length === 0) {
      <p class="hl-empty"><mat-icon aria-hidden="true">mail</mat-icon> No invitations are waiting to be accepted.</p>
    } @else {
      <mat-list>
        @for (invitation of pending(); track invitation.id) {
          <mat-list-item lines="3">
            <mat-icon matListItemIcon aria-hidden="true">{{ invitation.expired ? 'schedule' : 'forward_to_inbox' }}</mat-icon>
            <span matListItemTitle>{{ invitation.name }} · {{ invitation.role }}</span>
            <span matListItemLine>{{ invitation.email }}</span>
            <span matListItemLine>
              @if (invitation.expired) {
                <strong>Expired</strong> {{ invitation.expiresAt | localDateTime }} — invite again to send a new link
              } @else {
                Waiting, link valid until {{ invitation.expiresAt | localDateTime }}
              }
              · sent by {{ invitation.invitedBy }}
            </span>
          </mat-list-item>
        }
      </mat-list>
    }
  `,
})
export class InvitationList {
  /** All invitations the server listed. */
  readonly invitations = input.required<readonly InvitationRow[]>();
  /** When "now" is, for marking expiry; a parameter so the list can be checked at a fixed time. */
  readonly now = input<Date>(new Date());

  protected readonly pending = computed(() =>
    this.invitations()
      .filter((invitation) => invitation.acceptedAt === null)
      .map((invitation) => ({ ...invitation, expired: Date.parse(invitation.expiresAt) < this.now().getTime() })),
  );
}
