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

ChartJS.register(BarController, BarElement, CategoryScale, LinearScale, Tooltip);

/** Okabe–Ito colours (Okabe & Ito 2008), one per alternative. */
const OKABE_ITO = ['#0072b2', '#e69f00', '#009e73', '#cc79a7', '#56b4e9', '#d55e00'];
const pct = (x: number) => `${(x * 100).toFixed(1)} %`;

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
                backgroundColor: names.map((_, i) => OKABE_ITO[i % OKABE_ITO.length]),
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
      <div className="overflow-x-auto">
        <table className="min-w-full text-sm">
          <caption className="mb-1 text-left text-xs text-ink-muted">
            Predicted shares over {result.respondents} respondents
          </caption>
          <thead className="border-b border-line text-xs text-ink-soft">
            <tr>
              <th className="px-2 py-1 text-left">
                {result.segments ? result.segments.label : 'Group'}
              </th>
              <th className="px-2 py-1 text-right">n</th>
              {names.map((n) => (
                <th key={n} className="px-2 py-1 text-right">
                  {n}
                </th>
              ))}
            </tr>
          </thead>
          <tbody className="font-mono tabular-nums">
            <tr className="border-b border-line font-semibold">
              <td className="px-2 py-1 font-sans">All respondents</td>
              <td className="px-2 py-1 text-right">{result.respondents}</td>
              {result.alternatives.map((a) => (
                <td key={a.name} className="px-2 py-1 text-right">
                  {pct(a.share)}
                </td>
              ))}
            </tr>
            {result.segments?.groups.map((g) => (
              <tr key={g.key} className="border-b border-line/60">
                <td className="px-2 py-1 font-sans">{g.label}</td>
                <td className="px-2 py-1 text-right">{g.count}</td>
                {g.shares.map((s, j) => (
                  <td key={j} className="px-2 py-1 text-right">
                    {pct(s)}
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
