import { ChangeDetectionStrategy, Component, input, signal } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

import { NewPasswordGroup, PASSWORD_MIN_LENGTH } from './password-rules';
import { PasswordVisibility } from './password-visibility';

/** "New password" and "Repeat it", with the length rule and a mismatch message in words. */
@Component({
  selector: 'hl-new-password-fields',
  imports: [MatFormFieldModule, MatInputModule, PasswordVisibility, ReactiveFormsModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="fields" [formGroup]="group()">
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>{{ label() }}</mat-label>
        <input matInput [type]="hidden() ? 'password' : 'text'" formControlName="password" autocomplete="new-password" />
        <hl-password-visibility matSuffix [(hidden)]="hidden" what="passwords" />
        <mat-hint>At least {{ minLength }} characters. A few words are easier to type than symbols.</mat-hint>
        @if (group().controls.password.hasError('required')) {
          <mat-error>Choose a password.</mat-error>
        } @else if (group().controls.password.hasError('minlength')) {
          <mat-error>Use at least {{ minLength }} characters.</mat-error>
        } @else if (group().controls.password.hasError('maxlength')) {
          <mat-error>Use at most 200 characters.</mat-error>
        } @else if (group().controls.password.getError('server'); as message) {
          <mat-error>The password {{ message }}.</mat-error>
        }
      </mat-form-field>
      <mat-form-field>
        <mat-label>Repeat it</mat-label>
        <input matInput [type]="hidden() ? 'password' : 'text'" formControlName="repeat" autocomplete="new-password" />
        @if (group().controls.repeat.hasError('required')) {
          <mat-error>Type the password again.</mat-error>
        }
      </mat-form-field>
      @if (group().hasError('passwordsDiffer') && group().controls.repeat.touched) {
        <p class="mismatch" role="alert">The two passwords differ.</p>
      }
    </div>
  `,
  styles: `
    .fields {
      display: flex;
      flex-direction: column;
      gap: 16px;
      margin-bottom: 8px;
    }
    mat-form-field {
      width: 100%;
    }
    .mismatch {
      margin: -4px 0 8px 16px;
      color: var(--mat-sys-error);
      font: var(--mat-sys-body-small);
    }
  `,
})
export class NewPasswordFields {
  /** The group holding `password` and `repeat`. */
  readonly group = input.required<NewPasswordGroup>();
  /** The first field's label. */
  readonly label = input('New password');

  protected readonly minLength = PASSWORD_MIN_LENGTH;
  protected readonly hidden = signal(true);
}
