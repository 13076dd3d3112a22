/**
 * Trace plot of one sampler quantity: one line per chain over the iterations (burn-in
 * included), so an analyst sees whether the chains mix and settle on the same region.
 * Colours from the Okabe–Ito palette.
 */
import {
  Chart as ChartJS,
  Legend,
  LinearScale,
  LineController,
  LineElement,
  PointElement,
  Tooltip,
} from 'chart.js';
import { Chart } from 'react-chartjs-2';

ChartJS.register(LineController, LineElement, PointElement, LinearScale, Tooltip, Legend);

const CHAIN_COLOURS = ['#0072b2', '#d55e00', '#009e73', '#cc79a7', '#e69f00', '#56b4e9'];

export function TraceChart({
  title,
  series,
}: {
  title: string;
  series: { chain: number; iteration: number[]; values: number[] }[];
}) {
  return (
    <figure>
      <div className="h-56 sm:h-64">
        <Chart
          type="line"
          aria-label={`Trace plot: ${title}, one line per chain`}
          role="img"
          data={{
            datasets: series.map((s, i) => ({
              label: `Chain ${s.chain}`,
              data: s.iteration.map((x, j) => ({ x, y: s.values[j] })),
              borderColor: CHAIN_COLOURS[i % CHAIN_COLOURS.length],
              borderWidth: 1,
              pointRadius: 0,
            })),
          }}
          options={{
            responsive: true,
            maintainAspectRatio: false,
            animation: false,
            parsing: false,
            scales: {
              x: { type: 'linear', title: { display: true, text: 'Iteration' } },
              y: { type: 'linear', title: { display: true, text: title } },
            },
            plugins: {
              legend: { position: 'bottom', labels: { boxWidth: 12 } },
              tooltip: { enabled: false },
            },
          }}
        />
      </div>
      <figcaption className="mt-1 text-xs text-ink-muted">{title}; burn-in included.</figcaption>
    </figure>
  );
}
