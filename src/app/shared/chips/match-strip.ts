import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { RouterLink } from '@angular/router';

import type { MatchedChip } from '../../../../shared/api/reference-set-answers.js';
import { deltaEText } from './chip-words';
import { VerdictMark } from './verdict-mark';

/** The nearest chips as a strip on the grey surround: swatch, code beneath, ΔE00 and the verdict beside. */
@Component({
  selector: 'hl-match-strip',
  imports: [RouterLink, VerdictMark],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <ol class="strip hl-swatch-surround" aria-label="Nearest chips, nearest first">
      @for (match of matches(); track match.code) {
        <li class="match">
          <a class="chip" [routerLink]="['/reference-set/browse']" [queryParams]="{ chip: match.code }" [attr.aria-label]="'Open ' + match.code + ' in the chip browser'">
            <span class="swatch" [style.background-color]="match.hex"></span>
            <span class="code">{{ match.code }}</span>
          </a>
          <div class="figures">
            <span class="delta-e"><abbr title="CIEDE2000 colour difference">ΔE00</abbr> {{ deltaEText(match.deltaE00) }}</span>
            <hl-verdict-mark [verdict]="match.verdict" />
            <span class="name">{{ match.name }}</span>
          </div>
        </li>
      }
    </ol>
  `,
  styleUrl: './match-strip.scss',
})
export class MatchStrip {
  /** The matches, nearest first. */
  readonly matches = input.required<readonly MatchedChip[]>();

  protected readonly deltaEText = deltaEText;
}
