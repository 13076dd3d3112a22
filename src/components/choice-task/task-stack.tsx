import { cn } from '@/lib/cn';
import type { TaskLayoutProps } from './alternative-view';
import { LevelText } from './level-text';
import { ChoiceRadio } from './choice-radio';

/**
 * The fallback when the alternatives cannot fit side by side (long labels, images, many
 * alternatives on a narrow screen): one card per alternative, attributes listed in the same
 * order in every card. The whole card is the tap target.
 */
export function TaskStack(layout: TaskLayoutProps) {
  const { attributes, alternatives: cards, selected, onChoose } = layout;
  return (
    <div className="space-y-3">
      {cards.map((c) => (
        <div
          key={c.position}
          onClick={() => onChoose?.(c.position)}
          className={cn(
            'rounded-xl border-2 bg-white p-4 shadow-sm',
            selected === c.position ? 'border-primary ring-2 ring-primary/25' : 'border-line',
            onChoose && 'cursor-pointer',
          )}
        >
          <label className="flex min-h-10 cursor-pointer items-center justify-between gap-3 has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-accent">
            <span className="text-base font-semibold text-ink">{c.title}</span>
            <ChoiceRadio group={layout} position={c.position} large />
          </label>
          <dl className="mt-2">
            {attributes.map((a, row) => (
              <div key={a.id} className="border-t border-line/70 py-2">
                <dt className="text-xs text-ink-muted">{a.name}</dt>
                <dd className="text-base font-medium text-ink">
                  <LevelText cell={c.cells[row]} />
                </dd>
              </div>
            ))}
          </dl>
        </div>
      ))}
    </div>
  );
}
