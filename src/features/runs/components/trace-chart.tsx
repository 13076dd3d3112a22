/**
 * Trace plot of one sampler quantity: one line per chain over the iterations (burn-in
 * included), so an analyst sees whether the chains mix and settle on the same region.
 * Colours from the Okabe–Ito palette.
 */
import { Chart } from 'react-chartjs-2';
import { baseChartOptions, bottomLegend } from '@/components/charts/chart-setup';
import { okabeIto } from '@/components/charts/palette';

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
              borderColor: okabeIto[i % okabeIto.length],
              borderWidth: 1,
              pointRadius: 0,
            })),
          }}
          options={{
            ...baseChartOptions,
            parsing: false,
            scales: {
              x: { type: 'linear', title: { display: true, text: 'Iteration' } },
              y: { type: 'linear', title: { display: true, text: title } },
            },
            plugins: {
              legend: bottomLegend,
              tooltip: { enabled: false },
            },
          }}
        />
      </div>
      <figcaption className="mt-1 text-xs text-ink-muted">{title}; burn-in included.</figcaption>
    </figure>
  );
}
