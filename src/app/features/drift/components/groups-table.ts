import { ChangeDetectionStrategy, Component, input } from '@angular/core';

import type { DriftGroup } from '../../../../../shared/api/analysis-answers.js';
import { deltaEText, formatNumber } from '../../../shared/chips/chip-words';
import { hueText, tooSmall } from '../data/drift-words';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';

/** The season groups: season, year, n, mean CIELAB, C*, h°, spread ΔE00 and the dates they span. */
@Component({
  selector: 'hl-groups-table',
  imports: [LocalDateTimePipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="scroll">
      <table>
        <caption>Mean CIELAB (D65) of each season group's readings; spread is the mean ΔE00 of the readings from that mean. Groups under {{ minGroupSize() }} readings are shown but never compared for drift.</caption>
        <thead>
          <tr>
            <th scope="col">Season</th>
            <th scope="col" class="num">n</th>
            <th scope="col" class="num">L*</th>
            <th scope="col" class="num">a*</th>
            <th scope="col" class="num">b*</th>
            <th scope="col" class="num">C*</th>
            <th scope="col" class="num">h°</th>
            <th scope="col" class="num">Spread ΔE00</th>
            <th scope="col">Readings from – to</th>
          </tr>
        </thead>
        <tbody>
          @for (g of groups(); track g.season + g.seasonYear) {
            <tr>
              <th scope="row"><span class="mini" [style.background-color]="g.meanHex" aria-hidden="true"></span>{{ g.seasonLabel }}</th>
              <td class="num">{{ g.n }}@if (small(g)) {<span class="hl-muted"> (too few)</span>}</td>
              <td class="num">{{ f(g.meanLab[0]) }}</td>
              <td class="num">{{ f(g.meanLab[1]) }}</td>
              <td class="num">{{ f(g.meanLab[2]) }}</td>
              <td class="num">{{ f(g.meanLch[1]) }}</td>
              <td class="num">{{ hue(g.meanLch[1], g.meanLch[2]) }}</td>
              <td class="num">{{ de(g.spreadDeltaE00) }}</td>
              <td>{{ g.firstObservedAt | localDateTime: 'date' }} – {{ g.lastObservedAt | localDateTime: 'date' }}</td>
            </tr>
          }
        </tbody>
      </table>
    </div>
  `,
  styleUrl: './drift-table.scss',
})
export class GroupsTable {
  readonly groups = input.required<readonly DriftGroup[]>();
  readonly minGroupSize = input.required<number>();

  protected readonly de = deltaEText;
  protected readonly hue = hueText;
  protected readonly f = (v: number) => formatNumber(v, 2);
  protected small(g: DriftGroup): boolean {
    return tooSmall(g, this.minGroupSize());
  }
}
