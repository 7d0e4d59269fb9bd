import { BreakpointObserver, Breakpoints } from '@angular/cdk/layout';
import { Injectable, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { map } from 'rxjs';

/** What kind of screen the app is on, as signals for layouts that change between phone and desk. */
@Injectable({ providedIn: 'root' })
export class Viewport {
  private readonly breakpoints = inject(BreakpointObserver);

  /** Whether the screen is a phone held either way (Material's Handset breakpoints). */
  readonly handset = toSignal(this.breakpoints.observe(Breakpoints.Handset).pipe(map((state) => state.matches)), {
    initialValue: this.breakpoints.isMatched(Breakpoints.Handset),
  });
}
