import type { FieldworkStats } from '@shared/schemas/fieldwork';
import { formatCount } from '@/utils/format';
import { DataTable, figureHeading } from '@/components/ui/data-table';

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
    <DataTable
      wrapperClassName={false}
      caption={caption}
      captionClassName="mb-1 text-left text-xs font-medium text-ink-soft"
      headCellClassName="py-1.5 font-medium"
      headings={[head, figureHeading('Starts'), figureHeading('Completes')]}
      empty={rows.length === 0 && 'None yet'}
    >
      {rows.map((r) => (
        <tr key={r.key} className="border-b border-line/60 last:border-0">
          <th scope="row" className="py-1.5 text-left font-normal">
            {head} {r.key}
          </th>
          <td className="num py-1.5">{formatCount(r.starts)}</td>
          <td className="num py-1.5 font-medium">{formatCount(r.completed)}</td>
        </tr>
      ))}
    </DataTable>
  );
}

/** Completes per block (balance of the design) and per frozen version of the study. */
export function CompletesBreakdown({ stats }: { stats: FieldworkStats }) {
  return (
    <div className="grid gap-6 sm:grid-cols-2 lg:grid-cols-1">
      <CountTable
        caption="Per block"
        head="Block"
        rows={stats.byBlock.map(({ block, ...counts }) => ({ key: block, ...counts }))}
      />
      <CountTable
        caption="Per version"
        head="Version"
        rows={stats.byVersion.map(({ version, ...counts }) => ({ key: version, ...counts }))}
      />
    </div>
  );
}
