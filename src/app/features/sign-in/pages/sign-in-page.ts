import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';

import { AuthStore } from '../../../core/auth/auth-store';
import { PasswordVisibility } from '../../../core/auth/password-visibility';
import { ApiError } from '../../../core/http/api-error';
import { PublicFrame } from '../components/public-frame';
import { safeReturnUrl } from '../data/return-url';
import { ProblemNotice } from '../../../shared/problem-notice';
import { EmailField } from '../components/email-field';

/** Sign in with e-mail and password, then go where the person was heading. */
@Component({
  selector: 'hl-sign-in-page',
  imports: [EmailField, ProblemNotice, MatButtonModule, MatFormFieldModule, MatInputModule, PasswordVisibility, PublicFrame, ReactiveFormsModule, RouterLink],
  templateUrl: './sign-in-page.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignInPage {
  private readonly authStore = inject(AuthStore);
  private readonly router = inject(Router);

  /** Where to go after signing in (query parameter, bound by the router). */
  readonly returnUrl = input<string>();

  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
    password: ['', Validators.required],
  });
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly passwordHidden = signal(true);

  protected signIn(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { email, password } = this.form.getRawValue();
    this.busy.set(true);
    this.problem.set(null);
    this.authStore.signIn(email, password).subscribe({
      next: () => void this.router.navigateByUrl(safeReturnUrl(this.returnUrl())),
      error: (error: unknown) => {
        this.busy.set(false);
        this.problem.set(signInProblem(error));
      },
    });
  }
}

/** The words for a failed sign-in. */
export function signInProblem(error: unknown): string {
  if (!(error instanceof ApiError)) return 'Signing in failed. Try again.';
  if (error.status === 401) return 'That e-mail and password do not match an active account.';
  if (error.status === 429) return 'Too many sign-in attempts. Wait a few minutes, then try again.';
  return error.detail ? `${error.title} ${error.detail}` : error.title;
}
