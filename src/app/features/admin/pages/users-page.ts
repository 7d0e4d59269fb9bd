import { ChangeDetectionStrategy, Component, ErrorHandler, effect, inject, viewChild } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { filter, switchMap } from 'rxjs';

import type { InvitationRow, Role, UpdateUserBody, UserRow } from '../../../../../shared/api/auth.js';
import { AuthStore } from '../../../core/auth/auth-store';
import { ROLE_CHOICES } from '../../../core/auth/role-descriptions';
import { ConfirmDialog, ConfirmDialogData } from '../../../shared/confirm-dialog';
import { InvitationList } from '../components/invitation-list';
import { InviteDialog } from '../components/invite-dialog';
import { AdminApi } from '../data/admin-api';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';

/** People with access: roles, active or not, last sign-in; invitations waiting below. */
@Component({
  selector: 'hl-users-page',
  imports: [
    LocalDateTimePipe,
    InvitationList,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatProgressSpinnerModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
  ],
  templateUrl: './users-page.html',
  styleUrl: './users-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UsersPage {
  private readonly api = inject(AdminApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly errorHandler = inject(ErrorHandler);
  private readonly sort = viewChild(MatSort);
  private readonly paginator = viewChild(MatPaginator);

  protected readonly me = inject(AuthStore).currentUser;
  protected readonly roles = ROLE_CHOICES;
  protected readonly columns = ['name', 'email', 'role', 'active', 'lastLoginAt', 'actions'];
  protected readonly users = rxResource({ stream: () => this.api.users() });
  protected readonly invitations = rxResource({ stream: () => this.api.invitations() });
  protected readonly table = new MatTableDataSource<UserRow>([]);

  constructor() {
    effect(() => {
      this.table.data = this.users.value() ?? [];
    });
    effect(() => {
      this.table.sort = this.sort() ?? null;
      this.table.paginator = this.paginator() ?? null;
    });
  }

  protected filterRows(text: string): void {
    this.table.filter = text.trim().toLowerCase();
    this.table.paginator?.firstPage();
  }

  protected openInviteDialog(): void {
    this.dialog
      .open<InviteDialog, void, InvitationRow>(InviteDialog, { width: '520px', maxWidth: '95vw' })
      .afterClosed()
      .pipe(filter((invitation): invitation is InvitationRow => invitation !== undefined))
      .subscribe((invitation) => {
        this.invitations.reload();
        this.snackBar.open(`Invitation sent to ${invitation.email}. Caught mails show in the Outbox.`, 'OK', { duration: 6000 });
      });
  }

  protected changeRole(user: UserRow, role: Role): void {
    this.saveChange(user, { role }, `${user.name} is now ${role}.`);
  }

  protected toggleActive(user: UserRow): void {
    const activate = !user.active;
    const data: ConfirmDialogData = activate
      ? { title: `Reactivate ${user.name}?`, message: `${user.email} will be able to sign in again.`, confirmLabel: 'Reactivate' }
      : {
          title: `Deactivate ${user.name}?`,
          message: `${user.email} will no longer be able to sign in. Their readings and history stay.`,
          confirmLabel: 'Deactivate',
        };
    this.dialog
      .open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data })
      .afterClosed()
      .pipe(
        filter((confirmed) => confirmed === true),
        switchMap(() => this.api.updateUser(user.id, { active: activate })),
      )
      .subscribe({
        next: (updated) => this.replaceRow(updated, `${updated.name} is ${updated.active ? 'active' : 'deactivated'}.`),
        error: (error: unknown) => this.errorHandler.handleError(error),
      });
  }

  private saveChange(user: UserRow, changes: UpdateUserBody, done: string): void {
    this.api.updateUser(user.id, changes).subscribe({
      next: (updated) => this.replaceRow(updated, done),
      error: (error: unknown) => {
        // A fresh copy of the row makes the table redraw it, putting the select back to the saved role.
        this.users.update((rows) => rows?.map((row) => (row.id === user.id ? { ...row } : row)));
        this.errorHandler.handleError(error);
      },
    });
  }

  private replaceRow(updated: UserRow, message: string): void {
    this.users.update((rows) => rows?.map((row) => (row.id === updated.id ? updated : row)));
    this.snackBar.open(message, 'OK', { duration: 4000 });
  }
}
