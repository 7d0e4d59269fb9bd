import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import { ILLUMINANT_LABELS, type InstrumentIlluminant, type LIGHTS } from '../../../../shared/api/reading-answers.js';
import type { LabTuple } from '../../../../shared/colour/lab.js';
import { LIGHT_WORDS, wordsFor } from './reading-words';

/**
 * A reading's light, or the illuminant/observer its instrument reported (with the L*a*b* it
 * reported before adaptation), as term–description pairs. Put on a `div` inside a `dl`: the div
 * takes no box, so the pairs sit in the list's grid.
 */
@Component({
  selector: 'div[hlLightFacts]',
  imports: [MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { style: 'display: contents' },
  template: `
    @if (light(); as l) {
      <dt>Light</dt>
      <dd class="with-icon"><mat-icon aria-hidden="true">{{ wordsFor(lightWords, l).icon }}</mat-icon>{{ wordsFor(lightWords, l).label }}</dd>
    }
    @if (illuminant(); as ill) {
      <dt>Illuminant / observer</dt>
      <dd>
        {{ illuminantLabels[ill] }} as the instrument reported
        @if (reportedLab(); as rep) {
          <span class="hl-muted">· reported L*a*b* {{ rep[0] }}, {{ rep[1] }}, {{ rep[2] }}, adapted to D65 / 2° (Bradford)</span>
        }
      </dd>
    }
  `,
  styles: `
    .with-icon {
      display: inline-flex;
      align-items: center;
      gap: 4px;

      mat-icon {
        font-size: 20px;
        width: 20px;
        height: 20px;
      }
    }
  `,
})
export class LightFacts {
  readonly light = input<(typeof LIGHTS)[number] | null>(null);
  readonly illuminant = input<InstrumentIlluminant | null>(null);
  readonly reportedLab = input<LabTuple | null>(null);

  protected readonly lightWords = LIGHT_WORDS;
  protected readonly illuminantLabels = ILLUMINANT_LABELS;
  protected readonly wordsFor = wordsFor;
}
