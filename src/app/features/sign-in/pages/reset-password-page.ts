import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';

import { AuthApi } from '../../../core/auth/auth-api';
import { NewPasswordFields } from '../../../core/auth/new-password-fields';
import { newPasswordGroup } from '../../../core/auth/password-rules';
import { ApiError } from '../../../core/http/api-error';
import { applyFieldErrors } from '../../../core/http/field-errors';
import { PublicFrame } from '../components/public-frame';
import { ProblemNotice } from '../../../shared/problem-notice';

/** Choose a new password from an e-mailed reset link. */
@Component({
  selector: 'hl-reset-password-page',
  imports: [ProblemNotice, MatButtonModule, MatIconModule, NewPasswordFields, PublicFrame, ReactiveFormsModule, RouterLink],
  templateUrl: './reset-password-page.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResetPasswordPage {
  private readonly authApi = inject(AuthApi);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  private readonly fb = inject(NonNullableFormBuilder);

  /** The link's token (route parameter). */
  readonly token = input.required<string>();

  protected readonly form = this.fb.group({ passwords: newPasswordGroup(this.fb) });
  protected readonly busy = signal(false);
  /** Whether the link itself was refused (bad, used or expired), as opposed to the password. */
  protected readonly linkRefused = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected savePassword(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.problem.set(null);
    const password = this.form.controls.passwords.controls.password.value;
    this.authApi.confirmPasswordReset({ token: this.token(), password }).subscribe({
      next: () => this.goToSignIn(),
      error: (error: unknown) => this.showRefusal(error),
    });
  }

  private goToSignIn(): void {
    this.snackBar.open('Your password is changed. Sign in with it now.', 'OK', { duration: 6000 });
    void this.router.navigate(['/sign-in']);
  }

  private showRefusal(error: unknown): void {
    this.busy.set(false);
    if (!(error instanceof ApiError)) {
      this.problem.set('Saving the password failed. Try again.');
      return;
    }
    const passwordRefused = error.messageFor('password') !== null;
    if (passwordRefused) {
      applyFieldErrors(this.form.controls.passwords, error);
      return;
    }
    if ([400, 404, 410].includes(error.status)) {
      this.linkRefused.set(true);
      return;
    }
    this.problem.set(error.message);
  }
}
