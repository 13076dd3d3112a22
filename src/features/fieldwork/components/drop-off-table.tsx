import type { DropOffStep } from '@shared/schemas/fieldwork';
import { formatCount } from '@/utils/format';
import { DataTable } from '@/components/ui/data-table';

/**
 * How far respondents got: one row per screen with a bar of those who answered it, and how many
 * unfinished respondents stopped there. A table rather than a chart so it reads at phone width
 * and with a screen reader.
 */
export function DropOffTable({ steps, starts }: { steps: DropOffStep[]; starts: number }) {
  if (steps.length === 0)
    return <p className="text-sm text-ink-muted">No questionnaire version has gone live yet.</p>;
  const top = Math.max(1, starts, ...steps.map((s) => s.reached));
  return (
    <DataTable
      caption="Respondents reaching each screen"
      headCellClassName="py-2 font-medium"
      headings={[
        { label: 'Screen', align: 'left', className: 'pr-3' },
        {
          label: <span className="sr-only">Share of starts</span>,
          align: 'left',
          key: 'share',
          className: 'hidden w-2/5 pr-3 sm:table-cell',
        },
        { label: 'Answered', align: 'right', className: 'pr-3' },
        { label: 'Stopped here', align: 'right' },
      ]}
    >
      {steps.map((s) => (
        <tr key={s.key} className="border-b border-line/60 last:border-0">
          <th scope="row" className="max-w-[11rem] py-1.5 pr-3 text-left font-normal sm:max-w-none">
            <span className="block truncate" title={s.label}>
              {s.label}
            </span>
          </th>
          <td className="hidden py-1.5 pr-3 sm:table-cell" aria-hidden>
            <div className="h-2.5 w-full rounded-full bg-canvas">
              <div
                className="h-full rounded-full bg-oi-blue"
                style={{ width: `${(100 * s.reached) / top}%` }}
              />
            </div>
          </td>
          <td className="num py-1.5 pr-3">{formatCount(s.reached)}</td>
          <td
            className={
              s.stoppedHere > 0 ? 'num py-1.5 text-oi-vermillion' : 'num py-1.5 text-ink-muted'
            }
          >
            {formatCount(s.stoppedHere)}
          </td>
        </tr>
      ))}
    </DataTable>
  );
}
