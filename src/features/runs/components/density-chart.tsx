/**
 * One random coefficient: the estimated population density (line) with the histogram of
 * respondents' conditional means laid over it (bars, scaled as a density). Conditional means
 * are shrunk toward the population, so their spread is narrower than the population's.
 * Colours from the Okabe–Ito palette.
 */
import { Chart } from 'react-chartjs-2';
import { baseChartOptions, bottomLegend } from '@/components/charts/chart-setup';
import { okabeIto, withAlpha } from '@/components/charts/palette';
import type { EstimationResult } from '@shared/schemas/estimation-spec';
import { densityHistogram, plotRange } from '../utils/stats';
import { populationDensity } from '@shared/results/taste-density';
import { formatNumber } from '@/utils/format';

const [BLUE, , , , SKY_BLUE, VERMILLION] = okabeIto;
const SKY = withAlpha(SKY_BLUE, 0.55);

export function DensityChart({
  moment,
  label,
  means,
}: {
  moment: EstimationResult['population'][number];
  label: string;
  means: number[];
}) {
  const [lo, hi] = plotRange(moment, means);
  const bins = Math.max(8, Math.min(30, Math.round(Math.sqrt(means.length))));
  const histogram = densityHistogram(means, lo, hi, bins);
  const curve = Array.from({ length: 121 }, (_, i) => {
    const x = lo + ((hi - lo) * i) / 120;
    return { x, y: populationDensity(moment, x) };
  });
  return (
    <figure>
      <div className="h-56 sm:h-64">
        <Chart
          type="bar"
          aria-label={`Population density and respondents' conditional means of ${label}`}
          role="img"
          data={{
            datasets: [
              {
                type: 'line' as const,
                label: 'Estimated population density',
                data: curve,
                borderColor: VERMILLION,
                borderWidth: 2,
                pointRadius: 0,
                tension: 0.2,
              },
              {
                type: 'bar' as const,
                label: "Respondents' conditional means",
                data: histogram,
                backgroundColor: SKY,
                borderColor: BLUE,
                borderWidth: 1,
                barPercentage: 1,
                categoryPercentage: 1,
              },
            ],
          }}
          options={{
            ...baseChartOptions,
            parsing: false,
            scales: {
              x: {
                // Without min/max the axis extends to round numbers around [lo, hi].
                type: 'linear',
                title: { display: true, text: 'Coefficient' },
                ticks: { maxTicksLimit: 7 },
              },
              y: { type: 'linear', beginAtZero: true, title: { display: true, text: 'Density' } },
            },
            plugins: {
              legend: bottomLegend,
              tooltip: { enabled: false },
            },
          }}
        />
      </div>
      <figcaption className="mt-1 text-xs text-ink-muted">
        Population mean {formatNumber(moment.mean)}, spread (SD) {formatNumber(moment.sd)} (
        {moment.distribution}
        ); {means.length} respondents&apos; conditional means.
      </figcaption>
    </figure>
  );
}
