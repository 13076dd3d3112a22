/**
 * Segments as overlaid histograms (share of each group per bin, so groups of different sizes
 * compare) or as box plots (whiskers min–max, box quartiles, a line at the median), drawn with
 * chart.js floating bars. Okabe–Ito colours, one per group.
 */
import { Bar } from 'react-chartjs-2';
import { baseChartOptions, bottomLegend } from '@/components/charts/chart-setup';
import type { Segments } from '@shared/schemas/tastes';
import { formatNumber } from '@/utils/format';
import { chartInk, okabeIto, withAlpha } from '@/components/charts/palette';

export type SegmentsView = 'histogram' | 'box';

const colour = (i: number) => okabeIto[i % okabeIto.length];

function HistogramChart({ data }: { data: Segments }) {
  const centres = data.edges.slice(0, -1).map((e, i) => (e + data.edges[i + 1]) / 2);
  return (
    <Bar
      aria-label={`Histograms of ${data.coefficient.label} by ${data.groupLabel}`}
      role="img"
      data={{
        labels: centres.map((c) => formatNumber(c, 2)),
        datasets: data.groups.map((g, i) => ({
          label: `${g.label} (n = ${g.count})`,
          data: g.histogram.map((h) => h / g.count),
          backgroundColor: withAlpha(colour(i), 0.45),
          borderColor: colour(i),
          borderWidth: 1,
          grouped: false,
          barPercentage: 1,
          categoryPercentage: 1,
        })),
      }}
      options={{
        ...baseChartOptions,
        scales: {
          x: {
            title: { display: true, text: `Conditional mean of ${data.coefficient.label}` },
            ticks: { maxTicksLimit: 8 },
          },
          y: { beginAtZero: true, title: { display: true, text: 'Share of the group' } },
        },
        plugins: { legend: bottomLegend },
      }}
    />
  );
}

function BoxChart({ data }: { data: Segments }) {
  const lo = Math.min(...data.groups.map((g) => g.min));
  const hi = Math.max(...data.groups.map((g) => g.max));
  const tick = (hi - lo || 1) / 250;
  const colours = data.groups.map((_, i) => colour(i));
  return (
    <Bar
      aria-label={`Box plots of ${data.coefficient.label} by ${data.groupLabel}`}
      role="img"
      data={{
        labels: data.groups.map((g) => `${g.label} (n = ${g.count})`),
        datasets: [
          {
            label: 'Minimum to maximum',
            data: data.groups.map((g) => [g.min, g.max] as [number, number]),
            backgroundColor: colours,
            barPercentage: 0.06,
            grouped: false,
          },
          {
            label: 'Quartiles (middle half)',
            data: data.groups.map((g) => [g.q1, g.q3] as [number, number]),
            backgroundColor: colours.map((c) => withAlpha(c, 0.35)),
            borderColor: colours,
            borderWidth: 1.5,
            barPercentage: 0.55,
            grouped: false,
          },
          {
            label: 'Median',
            data: data.groups.map((g) => [g.median - tick, g.median + tick] as [number, number]),
            backgroundColor: chartInk,
            barPercentage: 0.55,
            grouped: false,
          },
        ],
      }}
      options={{
        indexAxis: 'y',
        ...baseChartOptions,
        scales: {
          x: {
            min: lo - tick * 10,
            max: hi + tick * 10,
            title: { display: true, text: `Conditional mean of ${data.coefficient.label}` },
          },
        },
        plugins: {
          legend: bottomLegend,
          tooltip: { enabled: false },
        },
      }}
    />
  );
}

export function SegmentsChart({ data, view }: { data: Segments; view: SegmentsView }) {
  const height = view === 'box' ? Math.max(160, 70 + 48 * data.groups.length) : 288;
  return (
    <div style={{ height }}>
      {view === 'box' ? <BoxChart data={data} /> : <HistogramChart data={data} />}
    </div>
  );
}
