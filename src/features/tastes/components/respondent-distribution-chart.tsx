/**
 * One coefficient for one respondent: the population density (from the run's estimates) and
 * the respondent's conditional distribution, drawn from their conditional mean and SD on the
 * coefficient's own scale (src/utils/taste-density.ts). Okabe–Ito colours.
 */
import { Line } from 'react-chartjs-2';
import { baseChartOptions } from '@/components/charts/chart-setup';
import type { TasteCoefficient } from '@shared/schemas/tastes';
import { getPlotRange } from '../utils/densities';
import {
  conditionalCurveLabel,
  conditionalDensity,
  populationDensity,
} from '@shared/results/taste-density';
import { formatNumber } from '@/utils/format';
import { okabeIto, withAlpha } from '@/components/charts/palette';

export function RespondentDistributionChart({
  coefficient,
  mean,
  sd,
}: {
  coefficient: TasteCoefficient;
  mean: number;
  sd: number;
}) {
  const [lo, hi] = getPlotRange(coefficient, mean, sd);
  const xs = Array.from({ length: 121 }, (_, i) => lo + ((hi - lo) * i) / 120);
  const fixed = coefficient.distribution === 'fixed';
  return (
    <figure className="rounded-lg border border-line bg-white p-3">
      <figcaption className="mb-1 text-sm font-medium text-ink">
        {coefficient.label}
        <span className="ml-2 font-mono text-xs text-ink-muted tabular-nums">
          {formatNumber(mean)} ± {formatNumber(sd)}
        </span>
      </figcaption>
      {fixed ? (
        <p className="text-xs text-ink-muted">
          Fixed coefficient: everybody shares {formatNumber(coefficient.populationMean)}.
        </p>
      ) : (
        <div className="h-44">
          <Line
            aria-label={`Population and this respondent's distribution of ${coefficient.label}`}
            role="img"
            data={{
              datasets: [
                {
                  label: 'Population',
                  data: xs.map((x) => ({ x, y: populationDensity(coefficient, x) })),
                  borderColor: okabeIto[5],
                  borderWidth: 2,
                  pointRadius: 0,
                },
                {
                  label: conditionalCurveLabel(coefficient.distribution),
                  data: xs.map((x) => ({
                    x,
                    y: conditionalDensity(coefficient.distribution, mean, sd, x),
                  })),
                  borderColor: okabeIto[0],
                  backgroundColor: withAlpha(okabeIto[0], 0.2),
                  fill: true,
                  borderWidth: 2,
                  pointRadius: 0,
                },
              ],
            }}
            options={{
              ...baseChartOptions,
              parsing: false,
              scales: {
                x: { type: 'linear', min: lo, max: hi, ticks: { maxTicksLimit: 6 } },
                y: { type: 'linear', beginAtZero: true, display: false },
              },
              plugins: {
                legend: { position: 'bottom', labels: { boxWidth: 10, font: { size: 11 } } },
              },
            }}
          />
        </div>
      )}
    </figure>
  );
}
