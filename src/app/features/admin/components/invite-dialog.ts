import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import type { InvitationRow, Role } from '../../../../../shared/api/auth.js';
import { ROLE_CHOICES, ROLE_DESCRIPTIONS } from '../../../core/auth/role-descriptions';
import { refusalMessage } from '../../../core/http/field-errors';
import { AdminApi } from '../data/admin-api';
import { ProblemNotice } from '../../../shared/problem-notice';

/** Invite a person by e-mail with a role; closes with the new invitation once the server has sent it. */
@Component({
  selector: 'hl-invite-dialog',
  imports: [ProblemNotice, MatButtonModule, MatDialogModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './invite-dialog.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InviteDialog {
  private readonly api = inject(AdminApi);
  private readonly dialogRef = inject(MatDialogRef<InviteDialog, InvitationRow>);

  protected readonly roles = ROLE_CHOICES;
  protected readonly roleDescriptions = ROLE_DESCRIPTIONS;
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
    name: ['', [Validators.required, Validators.maxLength(120)]],
    role: ['recorder' as Role, Validators.required],
  });
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected sendInvitation(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.problem.set(null);
    this.api.invite(this.form.getRawValue()).subscribe({
      next: (invitation) => this.dialogRef.close(invitation),
      error: (error: unknown) => this.showRefusal(error),
    });
  }

  private showRefusal(error: unknown): void {
    this.busy.set(false);
    const message = refusalMessage(this.form, error, 'Sending the invitation failed. Try again.');
    if (message !== null) this.problem.set(message);
  }
}
