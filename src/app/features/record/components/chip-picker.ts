import { ChangeDetectionStrategy, Component, ElementRef, Injector, afterNextRender, computed, inject, input, output, signal, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';

import { ScreenCaution } from '../../../shared/chips/screen-caution';
import { SwatchGrid } from '../../../shared/chips/swatch-grid';
import { ChipCatalogue } from '../../../shared/chips/chip-catalogue';
import { familyLabel, normaliseCode } from '../../../shared/chips/chip-words';

/**
 * The chip picked by eye on the printed field card: the field chips as a large grid of swatches
 * by hue family (or the code read off the card), then the fine chips of the chosen one.
 */
@Component({
  selector: 'hl-chip-picker',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressSpinnerModule, ScreenCaution, SwatchGrid],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './chip-picker.html',
  styleUrl: './chip-picker.scss',
})
export class ChipPicker {
  private readonly injector = inject(Injector);
  private readonly finesHeading = viewChild<ElementRef<HTMLElement>>('finesHeading');

  /** The chosen code (field or fine), or null. */
  readonly value = input<string | null>(null);
  /** What the picker is for, as its heading ("Chip picked by eye"). */
  readonly label = input('Chip picked by eye');
  /** A chip was chosen, or the choice cleared (null). */
  readonly valueChange = output<string | null>();

  protected readonly catalogue = inject(ChipCatalogue);
  protected readonly familyLabel = familyLabel;
  protected readonly codeProblem = signal<string | null>(null);

  private readonly family = computed(() => {
    const code = this.value();
    return code ? (this.catalogue.set()?.family(code) ?? null) : null;
  });
  protected readonly chosen = computed(() => this.family()?.chip ?? null);
  /** The field chip whose fine chips are offered: the chosen chip or its parent. */
  protected readonly field = computed(() => this.family()?.field ?? null);
  protected readonly fines = computed(() => this.family()?.fines ?? []);

  constructor() {
    this.catalogue.load();
  }

  /** A field chip opens its fine chips (scrolled into view); a fine chip is the final choice. */
  protected choose(code: string): void {
    this.codeProblem.set(null);
    const chip = this.catalogue.set()?.chip(code);
    this.valueChange.emit(code);
    // Once the fine chips are drawn, bring them under the thumb.
    if (chip?.parent === null) afterNextRender(() => this.finesHeading()?.nativeElement.scrollIntoView?.({ block: 'start' }), { injector: this.injector });
  }

  /** The code read off the printed card ("87.14" is F-087.014). */
  protected chooseCode(text: string): void {
    const code = normaliseCode(text);
    const set = this.catalogue.set();
    if (!set) return;
    if (code && set.chip(code)) this.choose(code);
    else this.codeProblem.set(code ? `There is no chip ${code} in set ${set.summary.id}.` : 'Type a code such as F-087 or F-087.014.');
  }

  protected clear(): void {
    this.codeProblem.set(null);
    this.valueChange.emit(null);
  }
}
