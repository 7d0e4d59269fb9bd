import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';

import { AuthApi } from '../../../core/auth/auth-api';
import { ApiError } from '../../../core/http/api-error';
import { PublicFrame } from '../components/public-frame';
import { ProblemNotice } from '../../../shared/problem-notice';
import { EmailField } from '../components/email-field';

/** Ask for a password reset link by e-mail. The answer never says whether the address has an account. */
@Component({
  selector: 'hl-forgot-password-page',
  imports: [EmailField, ProblemNotice, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, PublicFrame, ReactiveFormsModule, RouterLink],
  templateUrl: './forgot-password-page.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ForgotPasswordPage {
  private readonly authApi = inject(AuthApi);

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
  });
  protected readonly busy = signal(false);
  protected readonly sent = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected requestLink(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.problem.set(null);
    this.authApi.requestPasswordReset(this.form.getRawValue().email).subscribe({
      next: () => {
        this.busy.set(false);
        this.sent.set(true);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.problem.set(error instanceof ApiError ? error.message : 'The request failed. Try again.');
      },
    });
  }
}
