import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { type FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

/** The e-mail address someone signs in with, with what is wrong with it in words. */
@Component({
  selector: 'hl-email-field',
  imports: [MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  // Its error shows once the form is submitted, a state that is no signal: checked with its form.
  changeDetection: ChangeDetectionStrategy.Default,
  host: { style: 'display: contents' },
  template: `
    <mat-form-field>
      <mat-label>E-mail</mat-label>
      <input matInput type="email" [formControl]="control()" [attr.autocomplete]="autocomplete()" inputmode="email" />
      @if (control().hasError('required')) {
        <mat-error>Enter your e-mail address.</mat-error>
      } @else if (control().hasError('email')) {
        <mat-error>That is not an e-mail address.</mat-error>
      }
    </mat-form-field>
  `,
})
export class EmailField {
  readonly control = input.required<FormControl<string>>();
  /** The browser's autofill hint: "username" when signing in, "email" elsewhere. */
  readonly autocomplete = input('email');
}
