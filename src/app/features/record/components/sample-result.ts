import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { PhotoSample } from '../../../../../shared/api/photo-answers.js';
import { UNIFORM_SPREAD_MAX_DE00 } from '../../../../../shared/photo/sampling-rules.js';
import { VERDICT_ICONS, betweenWords, correctionWords, nearerEnd, signed } from '../data/sample-words';

/** The server's reading of a region: the colour on a grey surround, its numbers, uniformity, nearest chips and "between". */
@Component({
  selector: 'hl-sample-result',
  imports: [MatIconModule],
  templateUrl: './sample-result.html',
  styleUrl: './sample-result.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SampleResult {
  readonly sample = input.required<PhotoSample>();

  protected readonly verdictIcons = VERDICT_ICONS;
  protected readonly uniformLimit = UNIFORM_SPREAD_MAX_DE00;
  protected readonly signed = signed;
  protected readonly between = computed(() => {
    const s = this.sample();
    if (!s.between) return null;
    const a = s.matches.find((m) => m.code === s.between!.a);
    const b = s.matches.find((m) => m.code === s.between!.b);
    return { words: betweenWords(s.between), nearer: nearerEnd(s.between), codeA: s.between.a, codeB: s.between.b, t: s.between.t, a, b };
  });
  protected readonly correction = computed(() => correctionWords(this.sample()));
}
