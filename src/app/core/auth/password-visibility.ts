import { ChangeDetectionStrategy, Component, input, model } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

/**
 * The eye button at the end of a password field (put it in as `matSuffix`): shows what was typed,
 * or hides it again. The field binds its input's type to `hidden`.
 */
@Component({
  selector: 'hl-password-visibility',
  imports: [MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  // The button sits in the field's suffix as if it were written there.
  host: { style: 'display: contents' },
  template: `
    <button mat-icon-button type="button" (click)="toggle()" [attr.aria-label]="(hidden() ? 'Show ' : 'Hide ') + what()" [attr.aria-pressed]="!hidden()">
      <mat-icon>{{ hidden() ? 'visibility' : 'visibility_off' }}</mat-icon>
    </button>
  `,
})
export class PasswordVisibility {
  /** Whether the password shows as dots. */
  readonly hidden = model(true);
  /** What the button shows or hides, for its accessible name ("password", "passwords"). */
  readonly what = input('password');

  protected toggle(): void {
    this.hidden.update((hidden) => !hidden);
  }
}
