import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

import type { ChipDto } from '../../../../../shared/api/reference-set-answers.js';
import { labFromTuple, labToLch } from '../../../../../shared/colour/lab.js';
import type { ChipMatch } from '../../../../../shared/colour/nearest.js';
import { deltaEText, labText, lchText } from '../../../shared/chips/chip-words';
import { GamutMark } from './gamut-mark';

/** One chip: its swatch on the grey surround, CIELAB, LCh, display hex, gamut, parent and nearest neighbours. */
@Component({
  selector: 'hl-chip-detail',
  imports: [GamutMark, MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './chip-detail.html',
  styleUrl: './chip-detail.scss',
})
export class ChipDetail {
  readonly chip = input.required<ChipDto>();
  /** Its nearest other chips by ΔE00, nearest first. */
  readonly neighbours = input.required<readonly ChipMatch<ChipDto>[]>();
  /** How many fine chips refine it (field chips only). */
  readonly fineCount = input<number | null>(null);
  /** Another chip was opened from here (the parent or a neighbour). */
  readonly chosen = output<string>();

  protected readonly lab = computed(() => labText(this.chip().lab));
  protected readonly lch = computed(() => {
    const lch = labToLch(labFromTuple(this.chip().lab));
    return lchText([lch.l, lch.c, lch.h]);
  });
  protected readonly deltaEText = deltaEText;

  protected choose(code: string): void {
    this.chosen.emit(code);
  }
}
