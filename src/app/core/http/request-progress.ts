import { Injectable, computed, signal } from '@angular/core';

/** How long a request may run before the progress bar shows; quick answers should not flicker it. */
export const PROGRESS_DELAY_MS = 300;

/** Counts HTTP requests in flight and says when a slow one deserves a progress bar. */
@Injectable({ providedIn: 'root' })
export class RequestProgress {
  private readonly inFlightCount = signal(0);
  private readonly slow = signal(false);
  private timer: ReturnType<typeof setTimeout> | null = null;

  /** How many requests are running now. */
  readonly inFlight = this.inFlightCount.asReadonly();
  /** Whether the progress bar should show: a request has been running longer than {@link PROGRESS_DELAY_MS}. */
  readonly visible = computed(() => this.slow() && this.inFlightCount() > 0);

  /** Marks a request as started. */
  start(): void {
    this.inFlightCount.update((n) => n + 1);
    if (this.timer === null && !this.slow()) {
      this.timer = setTimeout(() => {
        this.timer = null;
        this.slow.set(this.inFlightCount() > 0);
      }, PROGRESS_DELAY_MS);
    }
  }

  /** Marks a request as finished, whether it succeeded, failed or was cancelled. */
  end(): void {
    this.inFlightCount.update((n) => Math.max(0, n - 1));
    if (this.inFlightCount() === 0) this.reset();
  }

  private reset(): void {
    if (this.timer !== null) clearTimeout(this.timer);
    this.timer = null;
    this.slow.set(false);
  }
}
