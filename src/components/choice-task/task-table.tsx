import { cn } from '@/lib/cn';
import { ChoiceRadio } from './choice-radio';
import type { AlternativeView, TaskLayoutProps } from './alternative-view';
import { AttributeName } from './attribute-name';
import { LevelText } from './level-text';
import { useInterfaceText } from '@/lib/interface-texts';

/**
 * The alternatives side by side: one column each, attributes as rows (the attribute's name on
 * its own line across the columns, so values keep the full column width on a phone), and a
 * radio button under each column. Tapping anywhere in a column chooses it.
 */
export function TaskTable(layout: TaskLayoutProps) {
  const { attributes, alternatives: columns, selected, onChoose } = layout;
  const t = useInterfaceText();
  const width = `${100 / columns.length}%`;
  const tint = (c: AlternativeView) => (selected === c.position ? 'bg-primary-soft' : 'bg-white');
  const choose = (c: AlternativeView) => () => onChoose?.(c.position);
  return (
    <table className="w-full border-separate border-spacing-0 text-start">
      <thead>
        <tr>
          {columns.map((c) => (
            <th
              key={c.position}
              scope="col"
              style={{ width }}
              onClick={choose(c)}
              className={cn(
                'rounded-t-lg border-x-2 border-t-2 px-2 pb-1 pt-2 align-bottom text-sm font-semibold leading-tight',
                selected === c.position
                  ? 'border-primary bg-primary text-white'
                  : 'border-transparent text-ink',
                onChoose && 'cursor-pointer',
              )}
            >
              {c.title}
            </th>
          ))}
        </tr>
      </thead>
      {attributes.map((a, row) => (
        <tbody key={a.id}>
          <tr>
            <th
              scope="colgroup"
              colSpan={columns.length}
              className="border-t border-line px-2 pb-0.5 pt-2 text-start text-xs font-normal text-ink-muted"
            >
              <AttributeName attribute={a} />
            </th>
          </tr>
          <tr>
            {columns.map((c) => (
              <td
                key={c.position}
                onClick={choose(c)}
                className={cn(
                  'border-x-2 px-2 pb-2 align-top text-base font-medium text-ink',
                  selected === c.position ? 'border-primary' : 'border-transparent',
                  tint(c),
                  onChoose && 'cursor-pointer',
                )}
              >
                <LevelText cell={c.cells[row]} />
              </td>
            ))}
          </tr>
        </tbody>
      ))}
      <tfoot>
        <tr>
          {columns.map((c) => (
            <td
              key={c.position}
              className={cn(
                'rounded-b-lg border-x-2 border-b-2 px-1 pb-2 pt-1',
                selected === c.position ? 'border-primary' : 'border-transparent',
                tint(c),
              )}
            >
              <label
                className={cn(
                  'flex min-h-12 items-center justify-center gap-2 rounded-lg px-1 text-sm font-semibold has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-accent',
                  selected === c.position
                    ? 'bg-primary text-white'
                    : 'bg-primary-soft text-primary',
                  onChoose && 'cursor-pointer',
                )}
              >
                <ChoiceRadio group={layout} position={c.position} />
                <span aria-hidden>{selected === c.position ? t('ui.chosen') : t('ui.choose')}</span>
                <span className="sr-only">{c.title}</span>
              </label>
            </td>
          ))}
        </tr>
      </tfoot>
    </table>
  );
}
