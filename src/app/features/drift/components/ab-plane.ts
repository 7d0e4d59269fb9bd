import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { RouterLink } from '@angular/router';

import { formatNumber } from '../../../shared/chips/chip-words';
import { abPlaneConfig } from '../data/drift-charts';
import type { GroupSeries } from '../data/drift-series';
import { ELLIPSE_SIGMAS, ellipseCoverage } from '../data/spread-ellipse';
import { ChartCanvas } from './chart-canvas';
import { ViewToggle } from './view-toggle';
import { LocalDateTimePipe } from '../../../core/format/local-date-time';

/** The a*b* plane: each season group's readings, mean and 2σ spread ellipse; or the same numbers as tables. */
@Component({
  selector: 'hl-ab-plane',
  imports: [ChartCanvas, LocalDateTimePipe, RouterLink, ViewToggle],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="head">
      <h3>a*b* plane</h3>
      <hl-view-toggle [(table)]="table" />
    </div>
    <p class="hl-muted caption">{{ caption }}</p>
    @if (!table()) {
      <hl-chart-canvas [config]="config()" [label]="label()" [square]="true" />
    } @else {
      <div class="scroll">
        <table>
          <caption>Season means and {{ sigmas }}σ ellipses (axes are semi-axes in CIELAB units; the angle is the major axis's from +a*, anticlockwise).</caption>
          <thead>
            <tr><th scope="col">Group</th><th scope="col">Marker</th><th scope="col" class="num">n</th><th scope="col" class="num">Mean a*</th><th scope="col" class="num">Mean b*</th><th scope="col" class="num">Major</th><th scope="col" class="num">Minor</th><th scope="col" class="num">Angle °</th></tr>
          </thead>
          <tbody>
            @for (s of series(); track s.style.label) {
              <tr>
                <th scope="row">{{ s.style.label }}</th>
                <td>{{ s.style.markerWords }}</td>
                <td class="num">{{ s.group.n }}</td>
                <td class="num">{{ f(s.group.meanLab[1]) }}</td>
                <td class="num">{{ f(s.group.meanLab[2]) }}</td>
                @if (s.ellipse; as e) {
                  <td class="num">{{ f(e.major) }}</td>
                  <td class="num">{{ f(e.minor) }}</td>
                  <td class="num">{{ degrees(e.angle) }}</td>
                } @else {
                  <td class="num" colspan="3">too few for an ellipse</td>
                }
              </tr>
            }
          </tbody>
        </table>
      </div>
      <div class="scroll">
        <table>
          <caption>Every reading drawn on the plane.</caption>
          <thead>
            <tr><th scope="col">Reading</th><th scope="col">Group</th><th scope="col">Observed</th><th scope="col" class="num">a*</th><th scope="col" class="num">b*</th></tr>
          </thead>
          <tbody>
            @for (row of readings(); track row.point.readingId) {
              <tr>
                <th scope="row"><a [routerLink]="['/readings', row.point.readingId]">{{ row.point.readingId }}</a></th>
                <td>{{ row.group }}</td>
                <td>{{ row.point.observedAt | localDateTime: 'date' }}</td>
                <td class="num">{{ f(row.point.lab[1]) }}</td>
                <td class="num">{{ f(row.point.lab[2]) }}</td>
              </tr>
            }
          </tbody>
        </table>
      </div>
    }
  `,
  styleUrls: ['./drift-table.scss', '../../../shared/chart-head.scss', './chart-panel.scss'],
})
export class AbPlane {
  readonly series = input.required<GroupSeries[]>();

  protected readonly table = signal(false);
  protected readonly sigmas = ELLIPSE_SIGMAS;
  protected readonly caption =
    `Small markers: readings, one colour and shape per season group. Large markers with a black edge: each group's mean. ` +
    `Dashed: the ${ELLIPSE_SIGMAS}σ spread ellipse from the group's a*/b* covariance (about ${Math.round(ellipseCoverage(ELLIPSE_SIGMAS) * 100)} % of readings fall inside if they scatter normally); none for groups under 3. Tap a legend entry to hide a group.`;
  protected readonly config = computed(() => abPlaneConfig(this.series()));
  protected readonly label = computed(() => `a*b* plane of ${this.series().length} season groups; the Table button lists the same numbers.`);
  protected readonly readings = computed(() => this.series().flatMap((s) => s.points.map((point) => ({ point, group: s.style.label }))));
  protected readonly f = (v: number) => formatNumber(v, 2);

  protected degrees(radians: number): string {
    return formatNumber((radians * 180) / Math.PI, 0);
  }
}
