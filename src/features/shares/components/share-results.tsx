/**
 * Predicted shares as horizontal bars with their 95 % intervals (a thin dark bar from lower to
 * upper over each share bar), a table with the intervals, and shares by segment.
 */
import type { RefObject } from 'react';
import type { Chart } from 'chart.js';
import { Bar } from 'react-chartjs-2';
import { baseChartOptions } from '@/components/charts/chart-setup';
import type { ShareGroups } from '@shared/schemas/shares';
import type { ScenarioShares } from '@shared/engine/shares/share-model';
import { formatCount, formatInterval, formatPercent } from '@/utils/format';
import { chartInk, okabeIto } from '@/components/charts/palette';
import { whiteBackground } from '@/components/charts/chart-png';
import { DataTable, figureHeading } from '@/components/ui/data-table';

const pct = (x: number | null | undefined) => formatPercent(x, 1);

export function ShareResults({
  result,
  respondents,
  segments,
  chartRef,
}: {
  chartRef?: RefObject<Chart | null>;
  result: ScenarioShares;
  respondents: number;
  segments: ShareGroups | null;
}) {
  const names = result.names;
  const groups =
    segments && result.groups
      ? segments.groups
          .map((g, i) => ({
            ...g,
            count: result.groups!.counts[i],
            shares: result.groups!.shares[i],
          }))
          .filter((g) => g.count > 0)
      : [];
  const ungrouped = segments ? segments.of.filter((g) => g < 0).length : 0;
  const label = names.map((n, j) => `${n} ${pct(result.shares[j])}`).join(', ');
  return (
    <div className="space-y-4">
      <div style={{ height: 56 + 44 * names.length }}>
        <Bar
          ref={chartRef as never}
          plugins={[whiteBackground]}
          role="img"
          aria-label={`Predicted shares: ${label}`}
          data={{
            labels: names,
            datasets: [
              ...(result.lower && result.upper
                ? [
                    {
                      label: '95 % interval',
                      data: names.map((_, j) => [result.lower![j] * 100, result.upper![j] * 100]),
                      backgroundColor: chartInk,
                      barPercentage: 0.12,
                      grouped: false,
                      order: 0,
                    },
                  ]
                : []),
              {
                label: 'Predicted share',
                data: result.shares.map((s) => [0, s * 100]),
                backgroundColor: names.map((_, i) => okabeIto[i % okabeIto.length]),
                barPercentage: 0.7,
                grouped: false,
                order: 1,
              },
            ],
          }}
          options={{
            indexAxis: 'y',
            ...baseChartOptions,
            scales: { x: { min: 0, max: 100, title: { display: true, text: 'Share (%)' } } },
            plugins: { legend: { display: false } },
          }}
        />
      </div>
      <p className="mb-1 text-xs text-ink-muted">
        Predicted shares over {formatCount(respondents)} respondents
        {segments && `, and by ${segments.label}`}
        {ungrouped > 0 && ` (${formatCount(ungrouped)} in no segment)`}
      </p>
      <DataTable
        className="min-w-full text-sm"
        bodyClassName="font-mono tabular-nums"
        headings={[
          'Alternative',
          figureHeading('Share'),
          result.lower && figureHeading('95 % interval'),
          ...groups.map((g) => figureHeading(`${g.label} (${formatCount(g.count)})`, g.key)),
        ]}
      >
        {names.map((name, j) => (
          <tr key={j} className="border-b border-line/60">
            <td className="px-2 py-1 font-sans">{name}</td>
            <td className="px-2 py-1 text-right font-semibold whitespace-nowrap">
              {pct(result.shares[j])}
            </td>
            {result.lower && (
              <td className="px-2 py-1 text-right whitespace-nowrap">
                {formatInterval(result.lower[j], result.upper![j], pct)}
              </td>
            )}
            {groups.map((g) => (
              <td key={g.key} className="px-2 py-1 text-right whitespace-nowrap">
                {pct(g.shares[j])}
              </td>
            ))}
          </tr>
        ))}
      </DataTable>
    </div>
  );
}
