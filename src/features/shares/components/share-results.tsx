/** Predicted shares as horizontal bars with percentages, and a per-segment table. */
import {
  BarController,
  BarElement,
  CategoryScale,
  Chart as ChartJS,
  LinearScale,
  Tooltip,
} from 'chart.js';
import { Bar } from 'react-chartjs-2';
import type { ShareResult } from '@shared/schemas/shares';
import { formatPercent } from '@/utils/format';
import { okabeIto } from '@/components/charts/palette';

ChartJS.register(BarController, BarElement, CategoryScale, LinearScale, Tooltip);

const pct = (x: number) => formatPercent(x, 1);

export function ShareResults({ result }: { result: ShareResult }) {
  const names = result.alternatives.map((a) => a.name);
  return (
    <div className="space-y-4">
      <div style={{ height: 56 + 44 * names.length }}>
        <Bar
          role="img"
          aria-label={`Predicted shares: ${result.alternatives.map((a) => `${a.name} ${pct(a.share)}`).join(', ')}`}
          data={{
            labels: names,
            datasets: [
              {
                label: 'Predicted share',
                data: result.alternatives.map((a) => a.share * 100),
                backgroundColor: names.map((_, i) => okabeIto[i % okabeIto.length]),
                barPercentage: 0.7,
              },
            ],
          }}
          options={{
            indexAxis: 'y',
            responsive: true,
            maintainAspectRatio: false,
            animation: false,
            scales: { x: { min: 0, max: 100, title: { display: true, text: 'Share (%)' } } },
            plugins: { legend: { display: false } },
          }}
        />
      </div>
      <p className="mb-1 text-xs text-ink-muted">
        Predicted shares over {result.respondents} respondents
        {result.segments && `, and by ${result.segments.label}`}
      </p>
      <div className="overflow-x-auto">
        <table className="min-w-full text-sm">
          <thead className="border-b border-line text-xs text-ink-soft">
            <tr>
              <th className="px-2 py-1 text-left">Alternative</th>
              <th className="px-2 py-1 text-right whitespace-nowrap">All ({result.respondents})</th>
              {result.segments?.groups.map((g) => (
                <th key={g.key} className="px-2 py-1 text-right whitespace-nowrap">
                  {g.label} ({g.count})
                </th>
              ))}
            </tr>
          </thead>
          <tbody className="font-mono tabular-nums">
            {result.alternatives.map((a, j) => (
              <tr key={a.name} className="border-b border-line/60">
                <td className="px-2 py-1 font-sans">{a.name}</td>
                <td className="px-2 py-1 text-right font-semibold whitespace-nowrap">
                  {pct(a.share)}
                </td>
                {result.segments?.groups.map((g) => (
                  <td key={g.key} className="px-2 py-1 text-right whitespace-nowrap">
                    {pct(g.shares[j])}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
