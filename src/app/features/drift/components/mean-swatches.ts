import { ChangeDetectionStrategy, Component, input } from '@angular/core';

import { deltaEText, formatNumber } from '../../../shared/chips/chip-words';

/** One mean colour in the strip. */
export interface MeanSwatch {
  /** What the mean is of: "wet 2025", or a site code. */
  label: string;
  hex: string;
  lab: readonly [number, number, number];
  n: number;
  spreadDeltaE00: number;
  /** Whether the group has too few readings to be compared. */
  small?: boolean;
}

/** A strip of mean colours on the neutral grey surround, each with what it is, n and spread written under it. */
@Component({
  selector: 'hl-mean-swatches',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <ul class="strip hl-swatch-surround" [attr.aria-label]="caption()">
      @for (s of swatches(); track s.label) {
        <li>
          <span class="swatch" [style.background-color]="s.hex" role="img" [attr.aria-label]="'Mean of ' + s.label + ', ' + lab(s.lab)"></span>
          <strong class="label">{{ s.label }}</strong>
          <span class="line hl-number">n {{ s.n }}{{ s.small ? ' · too few' : '' }}</span>
          <span class="line hl-number">spread {{ de(s.spreadDeltaE00) }}</span>
        </li>
      }
    </ul>
    <p class="hl-muted note">{{ caption() }}. Spread: mean ΔE00 of the readings from their mean. Screen colours are approximate; trust the numbers.</p>
  `,
  styles: `
    .strip {
      display: flex;
      flex-wrap: wrap;
      gap: 16px;
      list-style: none;
      margin: 0;
    }
    li {
      display: flex;
      flex-direction: column;
      align-items: center;
      gap: 2px;
      min-width: 84px;
    }
    .swatch {
      width: 72px;
      height: 72px;
      border: 1px solid #5e5e5e;
      border-radius: 4px;
      margin-bottom: 4px;
    }
    .label {
      font-size: 15px;
    }
    .line {
      font-size: 13px;
    }
    .note {
      font: var(--mat-sys-body-small);
      margin: 6px 0 0;
    }
  `,
})
export class MeanSwatches {
  readonly swatches = input.required<readonly MeanSwatch[]>();
  readonly caption = input('Mean colours');

  protected readonly de = deltaEText;
  protected lab(lab: readonly [number, number, number]): string {
    return `L* ${formatNumber(lab[0], 1)}, a* ${formatNumber(lab[1], 1)}, b* ${formatNumber(lab[2], 1)}`;
  }
}
