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
