// Chart.js configurations of the drift charts, built from the series (types only from Chart.js:
// the library itself loads with the first chart). Big legend text and markers for a phone.
import type { ChartConfiguration, ChartDataset, LegendItem, TooltipItem } from 'chart.js';

import { formatNumber } from '../../../shared/chips/chip-words';
import { dayText, monthText, squareRange, type GroupSeries, type TimeQuantity } from './drift-series';
import { ELLIPSE_SIGMAS } from './spread-ellipse';

type Scatter = ChartConfiguration<'scatter'>;
type Dataset = ChartDataset<'scatter'>;

const LEGEND_FONT = { size: 14 };
const AXIS_FONT = { size: 13 };

/** What a dataset is, so the legend shows only one entry per group and a click hides all of a group. */
type Part = 'readings' | 'mean' | 'ellipse' | 'means-line';

function tagged(dataset: Dataset, part: Part, group: number): Dataset {
  return Object.assign(dataset, { hlPart: part, hlGroup: group });
}

function partOf(dataset: unknown): { part: Part; group: number } {
  const d = dataset as { hlPart?: Part; hlGroup?: number };
  return { part: d.hlPart ?? 'readings', group: d.hlGroup ?? -1 };
}

/** A legend that lists readings (and the means line) only, with big text and point-style keys. */
function legend(): NonNullable<NonNullable<Scatter['options']>['plugins']>['legend'] {
  return {
    position: 'bottom',
    labels: {
      usePointStyle: true,
      padding: 14,
      font: LEGEND_FONT,
      filter: (item: LegendItem, data) => {
        const { part } = partOf(data.datasets[item.datasetIndex ?? 0]);
        return part === 'readings' || part === 'means-line';
      },
    },
    // A click on a group's entry hides or shows its readings, mean and ellipse together.
    onClick: (_event, item, legendObject) => {
      const chart = legendObject.chart;
      const clicked = partOf(chart.data.datasets[item.datasetIndex ?? 0]);
      const show = !chart.isDatasetVisible(item.datasetIndex ?? 0);
      chart.data.datasets.forEach((d, i) => {
        const p = partOf(d);
        if (i === item.datasetIndex || (clicked.part === 'readings' && p.group === clicked.group)) chart.setDatasetVisibility(i, show);
      });
      chart.update();
    },
  };
}

/** The a*b* plane: each group's readings, its mean as a large marker with a black edge, and its 2σ ellipse dashed. */
export function abPlaneConfig(series: GroupSeries[]): Scatter {
  const range = squareRange(series);
  const datasets: Dataset[] = [];
  series.forEach((s, g) => {
    const { colour, marker, label } = s.style;
    datasets.push(
      tagged({ label, data: s.points.map((p) => ({ x: p.lab[1], y: p.lab[2] })), pointStyle: marker, pointRadius: 6, pointHoverRadius: 8, backgroundColor: colour, borderColor: colour }, 'readings', g),
      tagged({ label: `${label} mean`, data: [{ x: s.group.meanLab[1], y: s.group.meanLab[2] }], pointStyle: marker, pointRadius: 12, pointHoverRadius: 13, backgroundColor: colour, borderColor: '#000000', borderWidth: 2 }, 'mean', g),
    );
    if (s.outline.length) {
      datasets.push(tagged({ label: `${label} ${ELLIPSE_SIGMAS}σ ellipse`, data: s.outline, showLine: true, pointRadius: 0, pointHitRadius: 0, borderColor: colour, borderWidth: 2, borderDash: [6, 4] }, 'ellipse', g));
    }
  });
  return {
    type: 'scatter',
    data: { datasets },
    options: {
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      scales: {
        x: { type: 'linear', min: range.a[0], max: range.a[1], title: { display: true, text: 'a*  (− green · red +)', font: AXIS_FONT }, ticks: { font: AXIS_FONT } },
        y: { type: 'linear', min: range.b[0], max: range.b[1], title: { display: true, text: 'b*  (− blue · yellow +)', font: AXIS_FONT }, ticks: { font: AXIS_FONT } },
      },
      plugins: {
        legend: legend(),
        tooltip: {
          filter: (item) => partOf(item.dataset).part !== 'ellipse',
          callbacks: { label: (item: TooltipItem<'scatter'>) => `${item.dataset.label}: a* ${formatNumber(item.parsed.x ?? 0, 2)}, b* ${formatNumber(item.parsed.y ?? 0, 2)}` },
        },
      },
    },
  };
}

/** One quantity (L*, C* or h°) against time: each group's readings, and a black line through the season means. */
export function timeConfig(series: GroupSeries[], quantity: TimeQuantity): Scatter {
  const datasets: Dataset[] = series.map((s, g) =>
    tagged(
      {
        label: s.style.label,
        data: s.points.map((p) => ({ x: Date.parse(p.observedAt), y: p.lch[quantity.index] })),
        pointStyle: s.style.marker,
        pointRadius: 5,
        backgroundColor: s.style.colour,
        borderColor: s.style.colour,
      },
      'readings',
      g,
    ),
  );
  datasets.push(
    tagged(
      {
        label: 'Season means',
        data: series.map((s) => ({ x: s.midTime, y: s.group.meanLch[quantity.index] })),
        showLine: true,
        pointStyle: 'rectRot',
        pointRadius: 7,
        borderColor: '#000000',
        backgroundColor: '#ffffff',
        borderWidth: 2,
      },
      'means-line',
      -1,
    ),
  );
  return {
    type: 'scatter',
    data: { datasets },
    options: {
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      scales: {
        x: { type: 'linear', title: { display: true, text: 'Observed', font: AXIS_FONT }, ticks: { font: AXIS_FONT, maxTicksLimit: 4, callback: (v) => monthText(Number(v)) } },
        y: { type: 'linear', title: { display: true, text: `${quantity.label} (${quantity.words})`, font: AXIS_FONT }, ticks: { font: AXIS_FONT } },
      },
      plugins: {
        legend: legend(),
        tooltip: { callbacks: { label: (item: TooltipItem<'scatter'>) => `${item.dataset.label}: ${quantity.label} ${formatNumber(item.parsed.y ?? 0, quantity.index === 2 ? 0 : 2)}, ${dayText(item.parsed.x ?? 0)}` } },
      },
    },
  };
}
