import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { RouterLink } from '@angular/router';

import { formatNumber } from '../../../shared/chips/chip-words';
import { timeConfig } from '../data/drift-charts';
import { TIME_QUANTITIES, dayText, type GroupSeries } from '../data/drift-series';
import { hueText } from '../data/drift-words';
import { ChartCanvas } from './chart-canvas';
import { ViewToggle } from './view-toggle';

/** L*, C* and h° against time, three small charts side by side at a desk and stacked on a phone; or one table. */
@Component({
  selector: 'hl-time-charts',
  imports: [ChartCanvas, RouterLink, ViewToggle],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="head">
      <h3>L*, C*, h° against time</h3>
      <hl-view-toggle [(table)]="table" />
    </div>
    <p class="hl-muted caption">Markers: readings, one colour and shape per season group. Black line: the season means, each placed half-way through its group's readings.</p>
    @if (!table()) {
      <div class="charts">
        @for (c of charts(); track c.key) {
          <figure>
            <figcaption>{{ c.title }}</figcaption>
            <hl-chart-canvas [config]="c.config" [label]="c.title + ' of each reading against time; the Table button lists the same numbers.'" />
          </figure>
        }
      </div>
    } @else {
      <div class="scroll">
        <table>
          <caption>Season means, placed at the middle of each group's readings.</caption>
          <thead>
            <tr><th scope="col">Group</th><th scope="col">Middle</th><th scope="col" class="num">L*</th><th scope="col" class="num">C*</th><th scope="col" class="num">h°</th></tr>
          </thead>
          <tbody>
            @for (s of series(); track s.style.label) {
              <tr>
                <th scope="row">{{ s.style.label }}</th>
                <td>{{ day(s.midTime) }}</td>
                <td class="num">{{ f(s.group.meanLch[0]) }}</td>
                <td class="num">{{ f(s.group.meanLch[1]) }}</td>
                <td class="num">{{ hue(s.group.meanLch[1], s.group.meanLch[2]) }}</td>
              </tr>
            }
          </tbody>
        </table>
      </div>
      <div class="scroll">
        <table>
          <caption>Every reading drawn on the charts.</caption>
          <thead>
            <tr><th scope="col">Reading</th><th scope="col">Group</th><th scope="col">Observed</th><th scope="col" class="num">L*</th><th scope="col" class="num">C*</th><th scope="col" class="num">h°</th></tr>
          </thead>
          <tbody>
            @for (row of readings(); track row.point.readingId) {
              <tr>
                <th scope="row"><a [routerLink]="['/readings', row.point.readingId]">{{ row.point.readingId }}</a></th>
                <td>{{ row.group }}</td>
                <td>{{ day(row.time) }}</td>
                <td class="num">{{ f(row.point.lch[0]) }}</td>
                <td class="num">{{ f(row.point.lch[1]) }}</td>
                <td class="num">{{ hue(row.point.lch[1], row.point.lch[2]) }}</td>
              </tr>
            }
          </tbody>
        </table>
      </div>
    }
  `,
  styleUrls: ['./drift-table.scss', '../../../shared/chart-head.scss', './chart-panel.scss'],
  styles: `
    .charts {
      display: grid;
      grid-template-columns: repeat(auto-fit, minmax(300px, 1fr));
      gap: 16px;
    }
    figure {
      margin: 0;
      min-width: 0;
    }
    figcaption {
      font: var(--mat-sys-title-small);
      margin-bottom: 4px;
    }
  `,
})
export class TimeCharts {
  readonly series = input.required<GroupSeries[]>();

  protected readonly table = signal(false);
  protected readonly charts = computed(() => TIME_QUANTITIES.map((q) => ({ key: q.key, title: `${q.label}, ${q.words}`, config: timeConfig(this.series(), q) })));
  protected readonly readings = computed(() =>
    this.series()
      .flatMap((s) => s.points.map((point) => ({ point, group: s.style.label, time: Date.parse(point.observedAt) })))
      .sort((x, y) => x.time - y.time),
  );
  protected readonly f = (v: number) => formatNumber(v, 2);
  protected readonly hue = hueText;
  protected readonly day = dayText;
}
