import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';

import type { ObserverResult } from '../../../../../shared/api/calibration-answers.js';
import { formatNumber } from '../../../shared/chips/chip-words';
import { biasWords } from '../data/bias-words';
import { biasPlot, plotCoordinate, PLOT_MARGIN, PLOT_SIZE } from '../data/bias-plot';

/** Distinct strokes for the arrows; each arrow also carries its number, so colour is never the only key. */
const STROKES = ['#1b5e20', '#6a1b9a', '#0d47a1', '#bf360c', '#37474f', '#827717', '#ad1457', '#00695c'];

/**
 * Each observer's bias as an arrow on the a*b* plane from the reference (the origin) to their mean
 * (Δa*, Δb*), with a table of the same numbers one toggle away.
 */
@Component({
  selector: 'hl-bias-chart',
  imports: [MatButtonToggleModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './bias-chart.html',
  styleUrls: ['../../../shared/chart-head.scss', './bias-chart.scss'],
})
export class BiasChart {
  readonly observers = input.required<readonly ObserverResult[]>();

  protected readonly view = signal<'chart' | 'table'>('chart');
  protected readonly plot = computed(() => biasPlot(this.observers()));
  protected readonly size = PLOT_SIZE;
  protected readonly margin = PLOT_MARGIN;
  protected readonly strokes = STROKES;
  protected readonly at = (value: number) => plotCoordinate(value, this.plot().extent);
  protected readonly atUp = (value: number) => plotCoordinate(-value, this.plot().extent);
  protected readonly number = formatNumber;
  protected readonly biasWords = biasWords;
  protected readonly answered = computed(() => this.observers().filter((o) => o.bias !== null));
  protected readonly markOf = (o: ObserverResult) => String(this.observers().indexOf(o) + 1);
}
