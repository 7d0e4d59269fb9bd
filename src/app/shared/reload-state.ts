import { ChangeDetectionStrategy, Component, ResourceRef, computed, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';

/**
 * A list's loading bar and failure notice while the list itself stays on screen (a reload after a
 * filter change keeps the last rows); the bar has its own 4 px slot so nothing jumps.
 */
@Component({
  selector: 'hl-reload-state',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (resource().error()) {
      <div class="hl-notice hl-notice-error" role="alert">
        <mat-icon aria-hidden="true">cloud_off</mat-icon>
        <p>The {{ what() }} could not be loaded. <button mat-button type="button" (click)="resource().reload()">Try again</button></p>
      </div>
    }
    <div class="loading-slot">
      @if (resource().isLoading()) {
        <mat-progress-bar mode="indeterminate" [attr.aria-label]="label()" />
      }
    </div>
  `,
  styles: `
    :host {
      display: block;
    }
    .loading-slot {
      height: 4px;
    }
  `,
})
export class ReloadState {
  /** The list's resource. */
  readonly resource = input.required<ResourceRef<unknown>>();
  /** What is loaded, in words ("readings", "queue"). */
  readonly what = input.required<string>();
  /** The loading bar's name for screen readers; "Loading <what>" unless given. */
  readonly loadingLabel = input<string>();

  protected readonly label = computed(() => this.loadingLabel() ?? `Loading ${this.what()}`);
}
