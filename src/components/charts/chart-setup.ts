/**
 * Chart.js set up once for every chart of the app. Chart.js is tree-shaken, so each controller,
 * element, scale and plugin must be registered before a chart uses it: all that the app's charts
 * use are registered here, on import. The options every chart shares live here too.
 */
import {
  BarController,
  BarElement,
  CategoryScale,
  Chart,
  Filler,
  Legend,
  LinearScale,
  LineController,
  LineElement,
  PointElement,
  ScatterController,
  Tooltip,
} from 'chart.js';

// Bars, lines and points; their scales, the area fill, the legend and the tooltip.
Chart.register(BarController, BarElement, LineController, LineElement, PointElement);
Chart.register(ScatterController, CategoryScale, LinearScale, Filler, Legend, Tooltip);

/**
 * The chart fills its box (the box sets the height) and draws at once: no animation to wait for
 * before a screenshot, a PNG download or a printed report.
 */
export const baseChartOptions = {
  responsive: true,
  maintainAspectRatio: false,
  animation: false,
} as const;

/** The legend under the chart, with small colour boxes (long series names need the width). */
export const bottomLegend = { position: 'bottom', labels: { boxWidth: 12 } } as const;
