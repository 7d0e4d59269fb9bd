import { ChangeDetectionStrategy, Component, inject, signal, viewChild } from '@angular/core';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSnackBar } from '@angular/material/snack-bar';

import { AuthApi } from '../../../core/auth/auth-api';
import { AuthStore } from '../../../core/auth/auth-store';
import { NewPasswordFields } from '../../../core/auth/new-password-fields';
import { newPasswordGroup } from '../../../core/auth/password-rules';
import { ROLE_DESCRIPTIONS } from '../../../core/auth/role-descriptions';
import { ApiError } from '../../../core/http/api-error';
import { applyFieldErrors } from '../../../core/http/field-errors';
import { UnitPreference, type UnitSystem } from '../../../core/units/unit-preference';
import { ProblemNotice } from '../../../shared/problem-notice';

/** Who is signed in, the units lengths and masses are shown in, and changing one's own password. */
@Component({
  selector: 'hl-account-page',
  imports: [ProblemNotice, MatButtonModule, MatButtonToggleModule, MatFormFieldModule, MatIconModule, MatInputModule, NewPasswordFields, ReactiveFormsModule],
  templateUrl: './account-page.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
  styles: `
    .units {
      margin-bottom: 8px;
    }
    .units .mat-button-toggle {
      min-height: 48px;
    }
  `,
})
export class AccountPage {
  private readonly authApi = inject(AuthApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly formDirective = viewChild.required(FormGroupDirective);
  private readonly unitPreference = inject(UnitPreference);

  protected readonly user = inject(AuthStore).currentUser;
  protected readonly roleDescriptions = ROLE_DESCRIPTIONS;
  protected readonly form = this.fb.group({
    currentPassword: ['', Validators.required],
    passwords: newPasswordGroup(this.fb),
  });
  protected readonly units = this.unitPreference.system;
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  constructor() {
    this.unitPreference.loadFromServer();
  }

  protected chooseUnits(system: UnitSystem): void {
    this.unitPreference.chooseAndKeep(system);
  }

  protected changePassword(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { currentPassword, passwords } = this.form.getRawValue();
    this.busy.set(true);
    this.problem.set(null);
    this.authApi.changePassword({ currentPassword, newPassword: passwords.password }).subscribe({
      next: () => this.confirmChange(),
      error: (error: unknown) => this.showRefusal(error),
    });
  }

  private confirmChange(): void {
    this.busy.set(false);
    this.formDirective().resetForm();
    this.snackBar.open('Your password is changed.', 'OK', { duration: 5000 });
  }

  private showRefusal(error: unknown): void {
    this.busy.set(false);
    if (!(error instanceof ApiError)) {
      this.problem.set('Changing the password failed. Try again.');
      return;
    }
    if (error.status === 400 && error.fieldErrors.length === 0) {
      this.form.controls.currentPassword.setErrors({ wrong: true });
      return;
    }
    const unmatched = applyFieldErrors(this.form, error, { newPassword: 'passwords.password' });
    if (error.fieldErrors.length === 0 || unmatched.length > 0) this.problem.set([error.message, ...unmatched].join(' '));
  }
}
