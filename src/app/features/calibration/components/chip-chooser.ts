import { ChangeDetectionStrategy, Component, ElementRef, Injector, afterNextRender, computed, effect, inject, input, output, signal, untracked, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

import type { ChipDto } from '../../../../../shared/api/reference-set-answers.js';
import { SwatchGrid } from '../../../shared/chips/swatch-grid';
import type { ChipSet } from '../../../shared/chips/chip-catalogue';
import { familyLabel } from '../../../shared/chips/chip-words';

/**
 * Two steps to one chip: the field chips by hue family, then the fine chips of the field chip
 * chosen (or that field chip itself), then a confirm button. Nothing is sent until confirmed.
 */
@Component({
  selector: 'hl-chip-chooser',
  imports: [MatButtonModule, MatIconModule, SwatchGrid],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './chip-chooser.html',
  styleUrl: './chip-chooser.scss',
})
export class ChipChooser {
  private readonly injector = inject(Injector);
  private readonly top = viewChild<ElementRef<HTMLElement>>('top');

  /** The chips to choose from. */
  readonly set = input.required<ChipSet>();
  /** What is being matched (a specimen's id, a practice round): a new key starts the chooser afresh. */
  readonly key = input<unknown>(null);
  /** The chip confirmed earlier (the observer's current pick), or null. */
  readonly value = input<string | null>(null);
  /** The confirm button's words. */
  readonly confirmLabel = input('Confirm this chip');
  /** Whether a confirm is on its way (the button waits). */
  readonly busy = input(false);
  /** Whether choosing is allowed (false once a session closes). */
  readonly enabled = input(true);
  /** A chip was confirmed. */
  readonly confirmed = output<string>();

  /** The field chip whose fine chips are shown, or null on the first step. */
  protected readonly fieldCode = signal<string | null>(null);
  /** The chip chosen but not yet confirmed. */
  protected readonly pickCode = signal<string | null>(null);
  protected readonly familyLabel = familyLabel;

  protected readonly field = computed(() => chipOf(this.set(), this.fieldCode()));
  protected readonly pick = computed(() => chipOf(this.set(), this.pickCode()));
  protected readonly fines = computed(() => (this.fieldCode() ? this.set().finesOf(this.fieldCode()!) : []));
  /** Whether the chosen chip is already the confirmed one. */
  protected readonly unchanged = computed(() => this.pickCode() !== null && this.pickCode() === this.value());

  constructor() {
    // A confirmed pick (or a new specimen) starts the chooser at that pick's field chip.
    effect(() => {
      this.key();
      const code = this.value();
      const set = this.set();
      untracked(() => this.showPick(set, code));
    });
  }

  /** Back to an empty first step (the next specimen). */
  reset(): void {
    this.fieldCode.set(null);
    this.pickCode.set(null);
  }

  protected chooseField(code: string): void {
    this.fieldCode.set(code);
    this.pickCode.set(code);
    this.scrollToTop();
  }

  protected chooseFine(code: string): void {
    this.pickCode.set(code);
  }

  protected backToFields(): void {
    this.fieldCode.set(null);
    this.pickCode.set(null);
    this.scrollToTop();
  }

  protected confirm(): void {
    const code = this.pickCode();
    if (code && this.enabled()) this.confirmed.emit(code);
  }

  private showPick(set: ChipSet, code: string | null): void {
    const chip = chipOf(set, code);
    if (!chip) return this.reset();
    this.fieldCode.set(chip.parent ?? chip.code);
    this.pickCode.set(chip.code);
  }

  private scrollToTop(): void {
    afterNextRender(() => this.top()?.nativeElement.scrollIntoView?.({ block: 'start' }), { injector: this.injector });
  }
}

function chipOf(set: ChipSet, code: string | null): ChipDto | null {
  return code ? (set.chip(code) ?? null) : null;
}
