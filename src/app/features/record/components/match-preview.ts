import { ChangeDetectionStrategy, Component, computed, effect, inject, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import { DEFAULT_DRIFT_THRESHOLD } from '../../../../../shared/api/collection-answers.js';
import { deltaE00 } from '../../../../../shared/colour/delta-e.js';
import { labFromTuple, type Lab } from '../../../../../shared/colour/lab.js';
import { ChipCatalogue } from '../../../shared/chips/chip-catalogue';

/** ΔE00 above which an eye-picked chip is called far from the measured colour: the acceptability threshold (Paravina et al. 2015). */
export const EYE_PICK_WARN = DEFAULT_DRIFT_THRESHOLD;

/**
 * The nearest chip, its words and ΔE00, shown before saving (matched here with the same code the
 * server runs); and a warning, not a refusal, when the chip picked by eye is far from the colour.
 */
@Component({
  selector: 'hl-match-preview',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (nearest(); as m) {
      <div class="preview" role="status" aria-live="polite">
        <span class="hl-swatch-surround surround"><span class="swatch" [style.background]="m.hex" role="img" [attr.aria-label]="'Nearest chip ' + m.code"></span></span>
        <span class="text">
          <span>Nearest chip <strong class="code">{{ m.code }}</strong> · {{ m.name }}</span>
          <span class="hl-muted">ΔE00 {{ m.deltaE00.toFixed(2) }}, {{ m.verdict }} · before saving; the server's match is the one kept</span>
        </span>
      </div>
    }
    @if (eyeGap(); as gap) {
      <p class="hl-notice warn" role="alert">
        <mat-icon aria-hidden="true">warning</mat-icon>
        <span>The chip picked by eye, {{ eyeChipCode() }}, is ΔE00 {{ gap.toFixed(1) }} from the measured colour, more than {{ warnAt }} (the acceptability threshold). Check the pick or the reading; it can still be saved.</span>
      </p>
    }
  `,
  styles: `
    .preview {
      display: flex;
      align-items: center;
      gap: 12px;
      margin: 8px 0;
    }
    .surround {
      padding: 6px;
      display: flex;
    }
    .swatch {
      display: block;
      width: 40px;
      height: 40px;
      border: 1px solid #5e5e5e;
    }
    .text {
      display: flex;
      flex-direction: column;
      font-variant-numeric: tabular-nums;
    }
    .warn {
      margin: 8px 0;
    }
  `,
})
export class MatchPreview {
  private readonly chips = inject(ChipCatalogue);

  /** The colour to match; null while it is not complete. */
  readonly lab = input<Lab | null>(null);
  /** The chip also picked by eye, if any. */
  readonly eyeChipCode = input<string | null>(null);

  protected readonly warnAt = EYE_PICK_WARN;
  protected readonly nearest = computed(() => {
    const lab = this.lab();
    const set = this.chips.set();
    return lab && set ? (set.match(lab, 1).matches[0] ?? null) : null;
  });
  protected readonly eyeGap = computed(() => {
    const lab = this.lab();
    const code = this.eyeChipCode();
    const chip = code ? this.chips.set()?.chip(code) : undefined;
    if (!lab || !chip) return null;
    const gap = deltaE00(labFromTuple(chip.lab), lab);
    return gap > EYE_PICK_WARN ? gap : null;
  });

  constructor() {
    // The chips load once there is a colour to match, not for every visit to the form.
    effect(() => {
      if (this.lab()) this.chips.load();
    });
  }
}
