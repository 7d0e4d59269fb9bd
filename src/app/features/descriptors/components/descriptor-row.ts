import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatChipsModule } from '@angular/material/chips';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';

import type { Descriptor, Unit } from '../../../../../shared/api/descriptor-answers.js';
import { KIND_QUANTITY } from '../../../../../shared/api/descriptor-answers.js';
import { type RowEntry, entryUnits, ratioText, siOf, switchUnit, typeInto } from '../data/descriptor-entry';

/** Unit names as the toggle says them. */
const UNIT_WORDS: Partial<Record<Unit, string>> = { cm: 'cm', in: 'in', kg: 'kg', lb: 'lb' };

/**
 * One descriptor of the entry form: a number with its unit toggle, a count, category chips in our
 * own words, or — for a ratio — the value computed live from its parts, read-only.
 */
@Component({
  selector: 'hl-descriptor-row',
  imports: [MatButtonToggleModule, MatChipsModule, MatFormFieldModule, MatIconModule, MatInputModule],
  templateUrl: './descriptor-row.html',
  styleUrl: './descriptor-row.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DescriptorRow {
  /** The descriptor of this row. */
  readonly descriptor = input.required<Descriptor>();
  /** What the row holds now. */
  readonly entry = input.required<RowEntry>();
  /** For a ratio: its value from the parts typed so far, or null. */
  readonly ratio = input<number | null>(null);
  /** For a ratio: which parts it is computed from, in words. */
  readonly ratioSource = input('');
  /** The row's new state after typing, a unit switch or a chip. */
  readonly entryChange = output<RowEntry>();

  protected readonly units = computed(() => entryUnits(this.descriptor().kind));
  protected readonly unitWords = UNIT_WORDS;
  protected readonly fieldId = computed(() => `descriptor-${this.descriptor().id}`);
  protected readonly ratioShown = computed(() => ratioText(this.ratio()));
  /** "stored as 1.016 m" under a measured value, so the SI value is never a surprise. */
  protected readonly storedAs = computed(() => {
    const typed = this.entry().typed;
    const quantity = KIND_QUANTITY[this.descriptor().kind];
    if (!typed || !quantity || quantity === 'count') return null;
    const si = siOf(typed);
    return `stored as ${quantity === 'length' ? `${si} m` : `${si} kg`} · typed ${typed.value} ${typed.unit}`;
  });

  protected typeValue(text: string): void {
    this.entryChange.emit(typeInto(this.entry(), text, this.descriptor()));
  }

  protected chooseUnit(unit: Unit): void {
    this.entryChange.emit(switchUnit(this.entry(), unit, this.descriptor()));
  }

  protected chooseCategory(category: string | null): void {
    this.entryChange.emit({ ...this.entry(), category: category ?? null });
  }
}
