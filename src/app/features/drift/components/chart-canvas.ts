import { ChangeDetectionStrategy, Component, DestroyRef, ElementRef, effect, inject, input, viewChild } from '@angular/core';
import type { Chart, ChartConfiguration } from 'chart.js';

/** One Chart.js chart on a canvas; redrawn whenever its configuration changes, destroyed with the component. */
@Component({
  selector: 'hl-chart-canvas',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `<div class="box" [class.square]="square()"><canvas #canvas role="img" [attr.aria-label]="label()"></canvas></div>`,
  styles: `
    :host {
      display: block;
    }
    .box {
      position: relative;
      height: 300px;
    }
    // The a*b* plane is square so that one ΔE unit is as long across as up.
    .box.square {
      height: auto;
      aspect-ratio: 1;
      min-height: 300px;
      max-width: 640px;
    }
  `,
})
export class ChartCanvas {
  readonly config = input.required<ChartConfiguration<'scatter'>>();
  /** What the chart shows, for a screen reader (the table beside it has the numbers). */
  readonly label = input.required<string>();
  /** Whether the chart is square (the a*b* plane). */
  readonly square = input(false);

  private readonly canvas = viewChild.required<ElementRef<HTMLCanvasElement>>('canvas');
  private chart: Chart<'scatter'> | null = null;

  constructor() {
    effect((onCleanup) => {
      const config = this.config();
      const canvas = this.canvas().nativeElement;
      let stale = false;
      onCleanup(() => (stale = true));
      void import('./chart-setup').then(({ Chart }) => {
        if (stale) return;
        this.chart?.destroy();
        this.chart = new Chart(canvas, config);
      });
    });
    inject(DestroyRef).onDestroy(() => this.chart?.destroy());
  }
}
