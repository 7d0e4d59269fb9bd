// Chart.js with only what the drift charts draw: scatter points, lines through them (means,
// ellipses), linear axes, the legend and tooltips. Loaded on demand by ChartCanvas, so the
// library reaches the browser only when a chart is first shown.
import { Chart, Legend, LineElement, LinearScale, PointElement, ScatterController, Tooltip } from 'chart.js';

Chart.register(ScatterController, PointElement, LineElement, LinearScale, Legend, Tooltip);

export { Chart };
