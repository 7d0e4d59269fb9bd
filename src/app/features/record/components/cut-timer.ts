import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';

import { CUT_TICK_MS, cutWarning, elapsedSeconds, stopwatchText } from '../../../shared/readings/cut-clock';

/**
 * Seconds since cut for corm and sap: a big "Cut now" button that counts up from the cut into the
 * field (typing a number stops it), and a warning past the limit.
 */
@Component({
  selector: 'hl-cut-timer',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="row">
      @if (running()) {
        <button mat-flat-button type="button" class="timer running" (click)="stop()" aria-live="off">
          <mat-icon aria-hidden="true">timer</mat-icon> <span class="hl-number">{{ clock() }}</span> · Stop
        </button>
      } @else {
        <button mat-stroked-button type="button" class="timer" (click)="start()">
          <mat-icon aria-hidden="true">content_cut</mat-icon> Cut now: start timer
        </button>
      }
      <mat-form-field class="seconds" subscriptSizing="dynamic">
        <mat-label>Seconds since cut</mat-label>
        <input matInput type="number" inputmode="numeric" min="0" step="1" [formControl]="control()" (input)="typed()" />
        @if (control().hasError('server')) {
          <mat-error>{{ control().getError('server') }}</mat-error>
        } @else if (control().invalid) {
          <mat-error>Seconds from 0 up, whole numbers.</mat-error>
        }
      </mat-form-field>
    </div>
    @if (warning(); as message) {
      <p class="hl-notice hl-notice-error warn" role="alert"><mat-icon aria-hidden="true">hourglass_bottom</mat-icon><span>{{ message }}</span></p>
    }
  `,
  styles: `
    .row {
      display: flex;
      flex-wrap: wrap;
      gap: 12px;
      align-items: center;
    }
    .timer {
      min-height: 56px;
      flex: 1 1 100%;
      font-size: 16px;
    }
    .seconds {
      flex: 1 1 100%;
    }
    .warn {
      margin: 8px 0 0;
    }
  `,
})
export class CutTimer {
  /** The form's seconds-since-cut field. */
  readonly control = input.required<FormControl<number | null>>();
  /** Past this many seconds the warning shows (`CUT_SECONDS_WARN`). */
  readonly warnAfter = input.required<number>();

  private readonly startedAt = signal<number | null>(null);
  private timer: ReturnType<typeof setInterval> | null = null;
  private readonly value = signal<number | null>(null);

  protected readonly running = computed(() => this.startedAt() !== null);
  protected readonly clock = computed(() => stopwatchText(this.value() ?? 0));
  protected readonly warning = computed(() => cutWarning(this.value(), this.warnAfter()));

  constructor() {
    inject(DestroyRef).onDestroy(() => this.clearTimer());
    // Follows the field whoever sets it; a field cleared (the next plant) stops the count.
    effect((onCleanup) => {
      const control = this.control();
      this.value.set(control.value);
      const subscription = control.valueChanges.subscribe((value) => {
        this.value.set(value);
        if (value === null && this.running()) this.halt();
      });
      onCleanup(() => subscription.unsubscribe());
    });
  }

  /** Starts counting from now, writing the count into the field each second. */
  start(): void {
    this.clearTimer();
    const startedAt = Date.now();
    this.startedAt.set(startedAt);
    this.write(0);
    this.timer = setInterval(() => this.write(elapsedSeconds(startedAt, Date.now())), CUT_TICK_MS);
  }

  /** Stops the count; the field keeps the seconds reached. */
  stop(): void {
    const startedAt = this.startedAt();
    if (startedAt !== null) this.write(elapsedSeconds(startedAt, Date.now()));
    this.halt();
  }

  /** Whether the timer is counting. */
  isRunning(): boolean {
    return this.running();
  }

  /** A typed number wins over the timer. */
  protected typed(): void {
    this.halt();
  }

  private halt(): void {
    this.clearTimer();
    this.startedAt.set(null);
  }

  private write(seconds: number): void {
    this.control().setValue(seconds);
    this.control().markAsDirty();
  }

  private clearTimer(): void {
    if (this.timer !== null) clearInterval(this.timer);
    this.timer = null;
  }
}
