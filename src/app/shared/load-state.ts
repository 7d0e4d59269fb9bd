import { ChangeDetectionStrategy, Component, ResourceRef, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';

/** Shows a resource's loading and failure in words; projects its content once the value is there. */
@Component({
  selector: 'hl-load-state',
  imports: [MatButtonModule, MatIconModule, MatProgressSpinnerModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (resource().error()) {
      <div class="hl-notice hl-notice-error" role="alert">
        <mat-icon aria-hidden="true">cloud_off</mat-icon>
        <p>
          The {{ what() }} could not be loaded.
          <button mat-button type="button" (click)="resource().reload()">Try again</button>
        </p>
      </div>
    } @else if (resource().hasValue()) {
      <ng-content />
    } @else {
      <div class="hl-empty" role="status"><mat-spinner diameter="24" /> Loading {{ what() }}…</div>
    }
  `,
})
export class LoadState {
  /** The resource being waited for. */
  readonly resource = input.required<ResourceRef<unknown>>();
  /** What is loading, in words ("sites"). */
  readonly what = input.required<string>();
}
