import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/**
 * Why the last attempt was refused, in words beside an icon, announced to screen readers; nothing
 * when there is no problem. The host takes no box, so the notice sits in its parent's layout.
 */
@Component({
  selector: 'hl-problem-notice',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (message(); as text) {
      <div class="hl-notice hl-notice-error" role="alert">
        <mat-icon aria-hidden="true">error</mat-icon>
        <p>{{ text }}</p>
      </div>
    }
  `,
  styles: `
    :host {
      display: contents;
    }
  `,
})
export class ProblemNotice {
  /** The problem in words, or null when there is none. */
  readonly message = input<string | null | undefined>(null);
}
