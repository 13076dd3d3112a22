/**
 * Saved scenarios side by side under the run on screen: one column per scenario, one row per
 * position (alternative 1…5, then the status quo), each cell the alternative's name, share and
 * interval — computed in the browser with the same shared code as the editor's shares.
 */
import type { SavedScenario } from '@shared/schemas/shares';
import type { PreparedShareModel } from '@shared/engine/shares/share-model';
import { formatInterval, formatPercent } from '@/utils/format';
import { computeOutcome } from '../hooks/use-scenario-shares';
import { DataTable } from '@/components/ui/data-table';

const pct = (x: number | null | undefined) => formatPercent(x, 1);

export function ScenarioComparison({
  prepared,
  scenarios,
}: {
  prepared: PreparedShareModel;
  scenarios: SavedScenario[];
}) {
  const outcomes = scenarios.map((s) => computeOutcome(prepared, s.alternatives, s.includeFixed));
  const designed = Math.max(...scenarios.map((s) => s.alternatives.length));
  const fixedLabel = prepared.model.definition.fixedAlternative?.label;
  const rows = [
    ...Array.from({ length: designed }, (_, i) => ({
      label: `Alternative ${i + 1}`,
      at: (s: SavedScenario) => (i < s.alternatives.length ? i : -1),
    })),
    ...(fixedLabel
      ? [
          {
            label: fixedLabel,
            at: (s: SavedScenario) => (s.includeFixed ? s.alternatives.length : -1),
          },
        ]
      : []),
  ];
  return (
    <DataTable
      className="min-w-full text-sm"
      caption="Saved scenarios compared"
      headings={[
        { label: <span className="sr-only">Position</span>, align: 'left', key: 'position' },
        ...scenarios.map((s) => ({ label: s.name, align: 'right' as const, key: s.id })),
      ]}
    >
      {rows.map((row) => (
        <tr key={row.label} className="border-b border-line/60 align-top">
          <th scope="row" className="px-2 py-1 text-left text-xs font-normal text-ink-soft">
            {row.label}
          </th>
          {scenarios.map((s, c) => {
            const o = outcomes[c];
            const j = row.at(s);
            if (j < 0)
              return (
                <td key={s.id} className="px-2 py-1 text-right text-ink-muted">
                  —
                </td>
              );
            if (!o.shares)
              return (
                <td key={s.id} className="px-2 py-1 text-right text-xs text-danger">
                  {o.error?.message ?? 'Not computed'}
                </td>
              );
            return (
              <td key={s.id} className="px-2 py-1 text-right">
                <span className="block text-xs text-ink-soft">{o.shares.names[j]}</span>
                <span className="num font-semibold">{pct(o.shares.shares[j])}</span>
                {o.shares.lower && (
                  <span className="num block text-xs whitespace-nowrap text-ink-muted">
                    {formatInterval(o.shares.lower[j], o.shares.upper![j], pct)}
                  </span>
                )}
              </td>
            );
          })}
        </tr>
      ))}
    </DataTable>
  );
}
