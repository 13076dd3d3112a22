/** Starts and completes per day (Okabe–Ito sky blue and bluish green). */
import { Bar } from 'react-chartjs-2';
import { baseChartOptions, bottomLegend } from '@/components/charts/chart-setup';
import { okabeIto } from '@/components/charts/palette';
import type { FieldworkStats } from '@shared/schemas/fieldwork';

const [, , GREEN, , SKY] = okabeIto;

export function DailyChart({ daily }: { daily: FieldworkStats['daily'] }) {
  if (daily.length === 0) return <p className="text-sm text-ink-muted">No respondents yet.</p>;
  const total = daily.reduce((n, d) => n + d.completed, 0);
  return (
    <figure>
      <div className="h-48 sm:h-56">
        <Bar
          role="img"
          aria-label={`Starts and completes per day over ${daily.length} days, ${total} completes in all`}
          data={{
            labels: daily.map((d) => d.date.slice(5)),
            datasets: [
              { label: 'Starts', data: daily.map((d) => d.starts), backgroundColor: SKY },
              { label: 'Completes', data: daily.map((d) => d.completed), backgroundColor: GREEN },
            ],
          }}
          options={{
            ...baseChartOptions,
            plugins: { legend: bottomLegend },
            scales: {
              x: { grid: { display: false }, ticks: { maxRotation: 0, autoSkipPadding: 8 } },
              y: { beginAtZero: true, ticks: { precision: 0 } },
            },
          }}
        />
      </div>
      <figcaption className="mt-1 text-xs text-ink-muted">Days in UTC.</figcaption>
    </figure>
  );
}
