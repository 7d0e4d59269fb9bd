import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import type { MatchBetween } from '../../../../shared/api/reference-set-answers.js';
import { betweenWords, formatNumber, isHalfWay } from './chip-words';

/** Where a colour falls between its two nearest chips: in words, and as a mark on a bar from one to the other. */
@Component({
  selector: 'hl-between-bar',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <p class="words" [attr.aria-label]="'The colour lies ' + words() + '.'">
      The colour lies
      @if (halfWay()) {
        about half-way between <span class="code-text">{{ between().a }}</span> and <span class="code-text">{{ between().b }}</span>.
      } @else {
        between <span class="code-text">{{ between().a }}</span> and <span class="code-text">{{ between().b }}</span>, nearer
        <span class="code-text">{{ nearer() }}</span>.
      }
    </p>
    <div class="bar hl-swatch-surround" role="img" [attr.aria-label]="'Position ' + tText() + ' of the way from ' + between().a + ' to ' + between().b">
      <span class="end">
        <span class="swatch" [style.background-color]="fromHex()"></span>
        <span class="code">{{ between().a }}</span>
      </span>
      <span class="track">
        <span class="line"></span>
        <span class="mark" [style.left.%]="between().t * 100"></span>
      </span>
      <span class="end">
        <span class="swatch" [style.background-color]="toHex()"></span>
        <span class="code">{{ between().b }}</span>
      </span>
    </div>
    <p class="hl-muted t">t = {{ tText() }} (0 at {{ between().a }}, 1 at {{ between().b }})</p>
  `,
  styleUrl: './between-bar.scss',
})
export class BetweenBar {
  readonly between = input.required<MatchBetween>();
  /** Display hex of chip `a`. */
  readonly fromHex = input.required<string>();
  /** Display hex of chip `b`. */
  readonly toHex = input.required<string>();

  protected readonly words = computed(() => betweenWords(this.between()));
  protected readonly halfWay = computed(() => isHalfWay(this.between().t));
  protected readonly nearer = computed(() => (this.between().t < 0.5 ? this.between().a : this.between().b));
  protected readonly tText = computed(() => formatNumber(this.between().t, 2));
}
