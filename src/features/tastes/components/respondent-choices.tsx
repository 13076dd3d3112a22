/**
 * A respondent's design-task choices, task by task, as compact read-only tables (attributes in
 * rows, alternatives in columns, the chosen one marked). The shared task card is built for
 * answering (it shows choose buttons), so the analyst's view uses this denser layout instead.
 */
import { cn } from '@/lib/cn';
import type { RespondentChoice } from '@shared/schemas/tastes';
import type { StudyDefinition } from '@shared/schemas/study-definition';
import { formatNumber } from '@/utils/format';

const ordinal = (n: number) =>
  `${n}${n % 10 === 1 && n !== 11 ? 'st' : n % 10 === 2 && n !== 12 ? 'nd' : n % 10 === 3 && n !== 13 ? 'rd' : 'th'}`;

export function RespondentChoices({
  definition,
  choices,
}: {
  definition: StudyDefinition;
  choices: RespondentChoice[];
}) {
  if (choices.length === 0) return <p className="text-sm text-ink-muted">No choice answers.</p>;
  return (
    <ol className="grid gap-5 lg:grid-cols-2">
      {choices.map((c) => {
        const chosen = c.alternatives.find((a) => a.index === c.chosen);
        return (
          <li key={c.task} className="min-w-0">
            <h4 className="mb-1 text-sm font-semibold text-ink">
              Task {c.task}
              <span className="ml-2 font-normal text-ink-muted">
                {c.position !== null && `answered ${ordinal(c.position)}`}
                {c.responseMs !== null && ` · ${formatNumber(c.responseMs / 1000, 1)} s`}
              </span>
            </h4>
            <div className="overflow-x-auto rounded-md border border-line">
              <table className="min-w-full text-sm">
                <caption className="sr-only">
                  Task {c.task}: chose {chosen?.label ?? 'nothing'}
                </caption>
                <thead>
                  <tr className="bg-canvas text-xs">
                    <th className="px-2 py-1.5 text-left font-medium text-ink-soft">Attribute</th>
                    {c.alternatives.map((a) => (
                      <th
                        key={a.index}
                        className={cn(
                          'px-2 py-1.5 text-left font-semibold',
                          a.index === c.chosen ? 'bg-primary text-white' : 'text-ink',
                        )}
                      >
                        {a.label}
                        {a.index === c.chosen && <span className="ml-1">✓ chosen</span>}
                      </th>
                    ))}
                  </tr>
                </thead>
                <tbody>
                  {definition.attributes.map((attr) => (
                    <tr key={attr.id} className="border-t border-line/70">
                      <th
                        scope="row"
                        className="px-2 py-1 text-left text-xs font-normal text-ink-muted"
                      >
                        {attr.name}
                      </th>
                      {c.alternatives.map((a) => (
                        <td
                          key={a.index}
                          className={cn(
                            'px-2 py-1',
                            a.index === c.chosen && 'bg-primary-soft font-medium',
                          )}
                        >
                          {a.levels[attr.name] ?? '—'}
                        </td>
                      ))}
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </li>
        );
      })}
    </ol>
  );
}
