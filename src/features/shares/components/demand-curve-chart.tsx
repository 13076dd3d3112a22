/**
 * A demand curve: one alternative's share (line) and its 95 % interval (shaded band) as one
 * attribute moves; values on a linear axis for a numeric sweep, level labels otherwise.
 */
import type { RefObject } from 'react';
import type { Chart } from 'chart.js';
import { Line } from 'react-chartjs-2';
import { baseChartOptions } from '@/components/charts/chart-setup';
import type { DemandCurve } from '@shared/engine/shares/demand-curve';
import { okabeIto, withAlpha } from '@/components/charts/palette';
import { whiteBackground } from '@/components/charts/chart-png';
import { formatPercent } from '@/utils/format';

export function DemandCurveChart({
  curve,
  labels,
  axisTitle,
  alternativeName,
  chartRef,
}: {
  curve: DemandCurve;
  /** One label per point (formatted value or level label). */
  labels: string[];
  axisTitle: string;
  alternativeName: string;
  chartRef: RefObject<Chart | null>;
}) {
  const colour = okabeIto[0];
  const pts = curve.points;
  const hasInterval = pts.every((p) => p.lower !== null && p.upper !== null);
  const summary = pts.map((p, i) => `${labels[i]}: ${formatPercent(p.share, 1)}`).join(', ');
  return (
    <div className="h-72">
      <Line
        ref={chartRef as never}
        plugins={[whiteBackground]}
        role="img"
        aria-label={`Demand curve of ${alternativeName} by ${axisTitle}: ${summary}`}
        data={{
          labels,
          datasets: [
            ...(hasInterval
              ? [
                  {
                    label: '95 % interval, lower',
                    data: pts.map((p) => p.lower! * 100),
                    borderWidth: 0,
                    pointRadius: 0,
                    fill: false,
                  },
                  {
                    label: '95 % interval',
                    data: pts.map((p) => p.upper! * 100),
                    borderWidth: 0,
                    pointRadius: 0,
                    backgroundColor: withAlpha(colour, 0.2),
                    fill: '-1' as const,
                  },
                ]
              : []),
            {
              label: `Share of ${alternativeName}`,
              data: pts.map((p) => p.share * 100),
              borderColor: colour,
              backgroundColor: colour,
              pointRadius: 3,
              fill: false,
            },
          ],
        }}
        options={{
          ...baseChartOptions,
          scales: {
            x: { title: { display: true, text: axisTitle } },
            y: { min: 0, title: { display: true, text: `Share of ${alternativeName} (%)` } },
          },
          plugins: { legend: { display: false } },
        }}
      />
    </div>
  );
}
