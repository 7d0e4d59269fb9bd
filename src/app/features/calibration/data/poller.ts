import { DestroyRef, signal } from '@angular/core';
import { Observable, Subscription, catchError, interval, of, startWith, switchMap, takeWhile } from 'rxjs';

/** How often live results are asked for while a session is open (our own: "every few seconds"). */
export const RESULTS_POLL_MS = 4000;

/**
 * Asks for something now and then every `periodMs`, keeping the latest answer in a signal, until
 * an answer says to stop (a closed session), `stop()` is called, or the owner is destroyed (the
 * page is left). A failed request is kept as `error` and the next tick tries again.
 */
export class Poller<T> {
  private readonly latest = signal<T | null>(null);
  private readonly failure = signal<unknown>(null);
  private readonly active = signal(false);
  private subscription: Subscription | null = null;

  /** The latest answer, or null before the first. */
  readonly value = this.latest.asReadonly();
  /** The latest request's error, or null once one succeeds. */
  readonly error = this.failure.asReadonly();
  /** Whether it is still polling. */
  readonly running = this.active.asReadonly();

  constructor(
    private readonly load: () => Observable<T>,
    private readonly keepGoing: (answer: T) => boolean,
    private readonly periodMs = RESULTS_POLL_MS,
    destroyRef?: DestroyRef,
  ) {
    destroyRef?.onDestroy(() => this.stop());
  }

  /** Starts (or restarts) polling, asking at once. */
  start(): void {
    this.stop();
    this.active.set(true);
    this.subscription = interval(this.periodMs)
      .pipe(
        startWith(-1),
        switchMap(() =>
          this.load().pipe(
            catchError((error: unknown) => {
              this.failure.set(error);
              return of(null);
            }),
          ),
        ),
        takeWhile((answer) => answer === null || this.accept(answer), true),
      )
      .subscribe({ complete: () => this.active.set(false) });
  }

  /** Stops asking; the latest answer stays. */
  stop(): void {
    this.subscription?.unsubscribe();
    this.subscription = null;
    this.active.set(false);
  }

  private accept(answer: T): boolean {
    this.failure.set(null);
    this.latest.set(answer);
    return this.keepGoing(answer);
  }
}
