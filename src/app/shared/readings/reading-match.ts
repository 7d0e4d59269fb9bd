import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { BetweenBar } from '../chips/between-bar';
import { MatchStrip } from '../chips/match-strip';
import { VerdictMark } from '../chips/verdict-mark';
import { deltaEText, formatNumber } from '../chips/chip-words';
import type { ReadingDetail } from '../../../../shared/api/reading-answers.js';

/**
 * A reading's colour and its match: the colour on the grey surround with its hex, the best chip,
 * ΔE00 and the verdict in words, the nearest chips as a strip and where it lies between the two nearest.
 */
@Component({
  selector: 'hl-reading-match',
  imports: [BetweenBar, MatchStrip, VerdictMark],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let r = reading();
    <div class="head hl-swatch-surround">
      <span class="pair">
        <span class="swatch" [style.background-color]="r.hex" role="img" [attr.aria-label]="'Reading ' + r.id + ', shown as ' + r.hex" [attr.title]="'display colour ' + r.hex"></span>
        <span class="code">reading {{ r.id }}</span>
      </span>
      <span class="pair">
        <span class="swatch" [style.background-color]="r.bestChipHex" role="img" [attr.aria-label]="'Best chip ' + r.bestChip"></span>
        <span class="code">{{ r.bestChip }}</span>
      </span>
      <span class="words">
        <strong class="best">{{ r.bestChip }}</strong>
        <span class="name">{{ r.bestChipName }}</span>
        <span class="de"><abbr title="CIEDE2000 colour difference">ΔE00</abbr> {{ deltaE(r.deltaE00) }}</span>
        <hl-verdict-mark [verdict]="r.verdict" />
      </span>
    </div>
    <p class="numbers hl-number">L* {{ f(r.lab[0]) }} · a* {{ f(r.lab[1]) }} · b* {{ f(r.lab[2]) }} · C* {{ f(r.lch[1]) }} · h° {{ r.lch[1] < 0.5 ? '—' : r.lch[2].toFixed(0) }}</p>
    @if (!r.inGamut) {
      <p class="hl-muted">The swatch is shown approximately: this colour lies outside what a screen shows.</p>
    }
    @if (r.eyeChipCode && r.method !== 'chip') {
      <p>
        Chip picked by eye: <strong>{{ r.eyeChipCode }}</strong>
        @if (r.eyeDeltaE00 !== null) {
          <span class="hl-number">, ΔE00 {{ deltaE(r.eyeDeltaE00) }} from the {{ r.method === 'photo' ? 'photo' : 'instrument' }}</span>
        }
      </p>
    }
    @if (showStrip() && r.matches.length) {
      <h3>Nearest chips{{ r.setId ? ' in set ' + r.setId + ', the set it was matched against' : '' }}</h3>
      <hl-match-strip [matches]="r.matches" />
    }
    @if (showStrip() && between(); as b) {
      <hl-between-bar [between]="b.between" [fromHex]="b.fromHex" [toHex]="b.toHex" />
    }
    @if (showStrip()) {
      @for (other of r.otherSets ?? []; track other.setId) {
        @if (other.matches[0]; as best) {
          <h3 [attr.data-testid]="'other-set-' + other.setId">In set {{ other.setId }}{{ other.current ? ' (current)' : '' }}: {{ best.code }}, {{ best.name }}, ΔE00 {{ deltaE(best.deltaE00) }}</h3>
          <hl-match-strip [matches]="other.matches" />
        }
      }
    }
    <p class="hl-muted caution">Screen colours are approximate; trust the numbers and codes, and judge against the physical chip in good light.</p>
  `,
  styles: `
    :host {
      display: block;
    }
    .head {
      display: flex;
      align-items: center;
      gap: 12px;
      flex-wrap: wrap;
    }
    .pair {
      display: flex;
      flex-direction: column;
      align-items: center;
      gap: 4px;
    }
    .swatch {
      width: 72px;
      height: 72px;
      border: 1px solid #5e5e5e;
      border-radius: 4px;
    }
    .code {
      font-size: 12px;
      font-variant-numeric: tabular-nums;
    }
    .words {
      display: flex;
      flex-direction: column;
      gap: 4px;
    }
    .best {
      font-size: 22px;
      font-variant-numeric: tabular-nums;
    }
    .name {
      font-size: 13px;
    }
    .de {
      font-size: 18px;
      font-weight: 600;
      font-variant-numeric: tabular-nums;
      abbr {
        text-decoration: none;
        font-size: 13px;
      }
    }
    .numbers {
      margin: 8px 0;
    }
    .caution {
      font: var(--mat-sys-body-small);
    }
  `,
})
export class ReadingMatch {
  readonly reading = input.required<
    Pick<ReadingDetail, 'id' | 'hex' | 'lab' | 'lch' | 'inGamut' | 'bestChip' | 'bestChipName' | 'bestChipHex' | 'deltaE00' | 'verdict' | 'eyeChipCode' | 'eyeDeltaE00' | 'method' | 'matches' | 'between'> &
      Partial<Pick<ReadingDetail, 'setId' | 'otherSets'>>
  >();
  /** Whether to show the nearest chips and the between bar (the detail does; the saved panel keeps it short). */
  readonly showStrip = input(true);

  protected readonly deltaE = deltaEText;
  protected readonly f = (v: number) => formatNumber(v, 1);
  protected readonly between = computed(() => {
    const r = this.reading();
    if (!r.between) return null;
    const from = r.matches.find((m) => m.code === r.between!.a);
    const to = r.matches.find((m) => m.code === r.between!.b);
    return from && to ? { between: r.between, fromHex: from.hex, toHex: to.hex } : null;
  });
}
