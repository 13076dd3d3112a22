import type { FieldworkStats } from '@shared/schemas/fieldwork';
import { formatCount } from '@/utils/format';
import { HeaderCells } from '@/components/ui/header-cells';

function CountTable({
  caption,
  head,
  rows,
}: {
  caption: string;
  head: string;
  rows: Array<{ key: number; starts: number; completed: number }>;
}) {
  return (
    <table className="w-full text-sm">
      <caption className="mb-1 text-left text-xs font-medium text-ink-soft">{caption}</caption>
      <thead>
        <tr className="border-b border-line text-xs text-ink-soft">
          <HeaderCells
            className="py-1.5 font-medium"
            headings={[
              head,
              { label: 'Starts', align: 'right' },
              { label: 'Completes', align: 'right' },
            ]}
          />
        </tr>
      </thead>
      <tbody>
        {rows.length === 0 && (
          <tr>
            <td colSpan={3} className="py-2 text-ink-muted">
              None yet
            </td>
          </tr>
        )}
        {rows.map((r) => (
          <tr key={r.key} className="border-b border-line/60 last:border-0">
            <th scope="row" className="py-1.5 text-left font-normal">
              {head} {r.key}
            </th>
            <td className="num py-1.5">{formatCount(r.starts)}</td>
            <td className="num py-1.5 font-medium">{formatCount(r.completed)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** Completes per block (balance of the design) and per frozen version of the study. */
export function CompletesBreakdown({ stats }: { stats: FieldworkStats }) {
  return (
    <div className="grid gap-6 sm:grid-cols-2 lg:grid-cols-1">
      <CountTable
        caption="Per block"
        head="Block"
        rows={stats.byBlock.map((b) => ({
          key: b.block,
          starts: b.starts,
          completed: b.completed,
        }))}
      />
      <CountTable
        caption="Per version"
        head="Version"
        rows={stats.byVersion.map((v) => ({
          key: v.version,
          starts: v.starts,
          completed: v.completed,
        }))}
      />
    </div>
  );
}
