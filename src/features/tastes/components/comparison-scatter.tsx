/**
 * One coefficient's individual means under two runs, one point per respondent, with the line
 * of equality: points on it mean both models give the respondent the same taste. Colours from
 * the Okabe–Ito palette.
 */
import { Chart } from 'react-chartjs-2';
import { baseChartOptions, bottomLegend } from '@/components/charts/chart-setup';
import { okabeIto, withAlpha } from '@/components/charts/palette';

/** Points half see-through (overlaps show as darker), the line of equality solid. */
const POINT = withAlpha(okabeIto[0], 0.55);
const LINE = okabeIto[5];

export function ComparisonScatter({
  label,
  xTitle,
  yTitle,
  pairs,
}: {
  label: string;
  xTitle: string;
  yTitle: string;
  pairs: [number, number][];
}) {
  const values = pairs.flat().filter(Number.isFinite);
  const lo = values.length ? Math.min(...values) : 0;
  const hi = values.length ? Math.max(...values) : 1;
  return (
    <div className="h-64 sm:h-80">
      <Chart
        type="scatter"
        aria-label={`${label}: each respondent's mean under ${xTitle} against ${yTitle}`}
        role="img"
        data={{
          datasets: [
            {
              type: 'scatter' as const,
              label: 'Respondents',
              data: pairs.map(([x, y]) => ({ x, y })),
              backgroundColor: POINT,
              pointRadius: 2.5,
            },
            {
              type: 'line' as const,
              label: 'Equal under both runs',
              data: [
                { x: lo, y: lo },
                { x: hi, y: hi },
              ],
              borderColor: LINE,
              borderWidth: 1.5,
              borderDash: [5, 4],
              pointRadius: 0,
            },
          ],
        }}
        options={{
          ...baseChartOptions,
          parsing: false,
          scales: {
            x: { type: 'linear', title: { display: true, text: xTitle } },
            y: { type: 'linear', title: { display: true, text: yTitle } },
          },
          plugins: {
            legend: bottomLegend,
            tooltip: { enabled: false },
          },
        }}
      />
    </div>
  );
}
