import { ChangeDetectionStrategy, Component, ElementRef, computed, inject, input, output } from '@angular/core';

import type { ChipDto } from '../../../../shared/api/reference-set-answers.js';

/**
 * Chips as buttons on the neutral grey surround, each with its code beneath. Tab reaches the grid,
 * arrow keys move within it, Enter or Space opens a chip.
 */
@Component({
  selector: 'hl-swatch-grid',
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './swatch-grid.html',
  styleUrl: './swatch-grid.scss',
  host: { '(keydown)': 'moveFocus($event)' },
})
export class SwatchGrid {
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);

  /** The chips to show, in order. */
  readonly chips = input.required<readonly ChipDto[]>();
  /** The code shown as chosen, if any. */
  readonly selected = input<string | null>(null);
  /** What the grid holds, for screen readers ("red field chips"). */
  readonly label = input.required<string>();
  /** A chip was opened. */
  readonly chosen = output<string>();

  /** Whether the grid holds fine chips, whose longer codes need wider cells. */
  protected readonly fine = computed(() => this.chips().some((chip) => chip.parent !== null));

  protected choose(code: string): void {
    this.chosen.emit(code);
  }

  /** Arrow keys, Home and End move focus between the grid's swatches. */
  protected moveFocus(event: KeyboardEvent): void {
    const steps: Record<string, number> = { ArrowRight: 1, ArrowDown: 1, ArrowLeft: -1, ArrowUp: -1 };
    const buttons = Array.from(this.host.nativeElement.querySelectorAll<HTMLButtonElement>('button.chip'));
    const index = buttons.indexOf(document.activeElement as HTMLButtonElement);
    if (index < 0) return;
    let next: number;
    if (event.key in steps) next = index + steps[event.key];
    else if (event.key === 'Home') next = 0;
    else if (event.key === 'End') next = buttons.length - 1;
    else return;
    event.preventDefault();
    buttons[Math.max(0, Math.min(buttons.length - 1, next))]?.focus();
  }
}
