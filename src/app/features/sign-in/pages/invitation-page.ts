import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { Router, RouterLink } from '@angular/router';
import { switchMap } from 'rxjs';

import { AuthApi } from '../../../core/auth/auth-api';
import { AuthStore } from '../../../core/auth/auth-store';
import { NewPasswordFields } from '../../../core/auth/new-password-fields';
import { newPasswordGroup } from '../../../core/auth/password-rules';
import { ROLE_DESCRIPTIONS } from '../../../core/auth/role-descriptions';
import { ApiError } from '../../../core/http/api-error';
import { applyFieldErrors } from '../../../core/http/field-errors';
import { PublicFrame } from '../components/public-frame';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';
import { ProblemNotice } from '../../../shared/problem-notice';

/** Accept an invitation: see who it is for, choose a password, and be signed in. */
@Component({
  selector: 'hl-invitation-page',
  imports: [ProblemNotice, LocalDateTimePipe, 
    MatButtonModule,
    MatIconModule,
    MatProgressSpinnerModule,
    NewPasswordFields,
    PublicFrame,
    ReactiveFormsModule,
    RouterLink,
  ],
  templateUrl: './invitation-page.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InvitationPage {
  private readonly authApi = inject(AuthApi);
  private readonly authStore = inject(AuthStore);
  private readonly router = inject(Router);
  private readonly fb = inject(NonNullableFormBuilder);

  /** The invitation's token (route parameter). */
  readonly token = input.required<string>();

  protected readonly invitation = rxResource({
    params: () => this.token(),
    stream: ({ params: token }) => this.authApi.invitation(token),
  });
  /** Why the invitation cannot be used, in words, or null. */
  protected readonly refusal = computed(() => invitationRefusal(this.invitation.error()));
  protected readonly roleDescriptions = ROLE_DESCRIPTIONS;
  protected readonly form = this.fb.group({ passwords: newPasswordGroup(this.fb) });
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected acceptInvitation(): void {
    const invitation = this.invitation.value();
    if (!invitation || this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const password = this.form.controls.passwords.controls.password.value;
    this.busy.set(true);
    this.problem.set(null);
    this.authApi
      .acceptInvitation({ token: this.token(), password })
      .pipe(switchMap((user) => this.authStore.signIn(user.email, password)))
      .subscribe({
        next: () => void this.router.navigate(['/']),
        error: (error: unknown) => this.showRefusal(error),
      });
  }

  private showRefusal(error: unknown): void {
    this.busy.set(false);
    if (error instanceof ApiError && error.messageFor('password') !== null) {
      applyFieldErrors(this.form.controls.passwords, error);
      return;
    }
    this.problem.set(invitationRefusal(error) ?? 'Accepting the invitation failed. Try again.');
  }
}

/** The words for an invitation the server refused (unknown, used or expired), or null if there was no error. */
export function invitationRefusal(error: unknown): string | null {
  if (!error) return null;
  if (error instanceof ApiError && error.status === 404) {
    return 'This invitation link is not valid. Check that the whole link was copied from the e-mail.';
  }
  if (error instanceof ApiError && error.status === 410) {
    return 'This invitation has expired or was already accepted. Ask an admin to send a new one.';
  }
  return error instanceof ApiError ? error.message : 'The invitation could not be loaded. Try again.';
}
