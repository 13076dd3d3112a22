/**
 * One choice task as respondents see it, shared by Preview and the respondent app. Up to three
 * alternatives (more on wider screens) sit side by side in a compact table with attributes as
 * rows; an opt-out is one compact choice below it. Only when labels or images cannot fit the
 * width does the task fall back to one card per alternative. Choices are native radio buttons:
 * arrow keys move between them, and each one's description reads out its levels.
 */
import { useId, useLayoutEffect, useRef, useState, type RefObject } from 'react';
import type { StudyDefinition } from '@shared/schemas/study-definition';
import { cn } from '@/lib/cn';
import { ChoiceRadio } from './choice-radio';
import {
  viewAlternatives,
  type AlternativeView,
  type ChoiceTaskAlternative,
} from './alternative-view';
import { TaskStack } from './task-stack';
import { TaskTable } from './task-table';
import { useInterfaceText } from '@/lib/interface-texts';

export type { ChoiceTaskAlternative } from './alternative-view';

/** What a task shows of the study: attributes, alternatives and the opt-out / status quo. */
export type ShownDefinition = Pick<
  StudyDefinition,
  'attributes' | 'alternatives' | 'fixedAlternative'
>;

export type ChoiceTaskCardProps = {
  definition: ShownDefinition;
  alternatives: ChoiceTaskAlternative[];
  selectedIndex?: number | null;
  onChoose?: (index: number) => void;
  /** URL of a level image from its storage key. */
  imageUrl?: (key: string) => string;
  /** Accessible name of the group, e.g. "Choice 3 of 8". */
  label?: string;
};

/** Narrowest column that still reads well (text; with level images). */
const MIN_COLUMN_PX = 84;
const MIN_IMAGE_COLUMN_PX = 112;

/**
 * Side by side while the table fits its container; stacked otherwise, until the container
 * grows back to the width the table needed. Without layout (no width) it stays side by side.
 */
function useSideBySide(ref: RefObject<HTMLDivElement | null>, columns: number, images: boolean) {
  const [state, setState] = useState({ side: true, needed: 0 });
  const side = useRef(state.side);
  side.current = state.side;
  useLayoutEffect(() => {
    const el = ref.current;
    if (!el) return;
    const check = () => {
      const width = el.clientWidth;
      if (width === 0) return;
      if (side.current) {
        const table = el.querySelector('table');
        const minimum = columns * (images ? MIN_IMAGE_COLUMN_PX : MIN_COLUMN_PX);
        const needed = Math.max(minimum, table?.offsetWidth ?? 0);
        if (needed > width + 1) setState({ side: false, needed });
      } else if (width >= state.needed) setState({ side: true, needed: 0 });
    };
    check();
    if (typeof ResizeObserver === 'undefined') return;
    const observer = new ResizeObserver(check);
    observer.observe(el);
    return () => observer.disconnect();
  }, [ref, columns, images, state.needed]);
  return state.side;
}

function summary(definition: ShownDefinition, view: AlternativeView, none: string): string {
  return definition.attributes.map((a, i) => `${a.name}: ${view.cells[i].text ?? none}`).join('; ');
}

export function ChoiceTaskCard({
  definition,
  alternatives,
  selectedIndex = null,
  onChoose,
  imageUrl = (key) => `/api/files/${encodeURIComponent(key)}`,
  label,
}: ChoiceTaskCardProps) {
  const t = useInterfaceText();
  const views = viewAlternatives(definition, alternatives, imageUrl, (letter) =>
    t('ui.unlabeled_alternative', { letter }),
  );
  const columns = views.filter((v) => !v.optOut);
  const optOut = views.find((v) => v.optOut);
  const images = columns.some((c) => c.cells.some((cell) => cell.image));
  const box = useRef<HTMLDivElement>(null);
  const sideBySide = useSideBySide(box, columns.length, images);
  const name = useId();
  const summaryId = (position: number) => `${name}-summary-${position}`;
  const described = definition.attributes.filter((a) => a.description?.trim());
  const layout = {
    attributes: definition.attributes,
    selected: selectedIndex,
    onChoose,
    name,
    summaryId,
  };

  return (
    <fieldset className="w-full min-w-0">
      <legend className="sr-only">{label ?? t('ui.choose_one')}</legend>
      {!sideBySide && described.length > 0 && (
        <details className="mb-3 rounded-md border border-line bg-white px-3 py-2 text-sm">
          <summary className="cursor-pointer font-medium text-ink">{t('ui.features_help')}</summary>
          <dl className="mt-2 space-y-2">
            {described.map((a) => (
              <div key={a.id}>
                <dt className="font-medium text-ink">{a.name}</dt>
                <dd className="text-ink-soft">{a.description}</dd>
              </div>
            ))}
          </dl>
        </details>
      )}
      <div ref={box} className="w-full">
        {sideBySide ? (
          <TaskTable {...layout} alternatives={columns} />
        ) : (
          <TaskStack {...layout} alternatives={columns} />
        )}
      </div>
      {optOut && (
        <label
          className={cn(
            'mt-3 flex min-h-12 items-center gap-3 rounded-lg border-2 bg-white px-4 py-2 text-base font-medium text-ink has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-accent',
            selectedIndex === optOut.position ? 'border-primary bg-primary-soft' : 'border-line',
            onChoose && 'cursor-pointer',
          )}
        >
          <ChoiceRadio
            group={{ name, selected: selectedIndex, onChoose }}
            position={optOut.position}
          />
          {optOut.title}
        </label>
      )}
      <div hidden>
        {columns.map((c) => (
          <span key={c.position} id={summaryId(c.position)}>
            {summary(definition, c, t('ui.not_applicable'))}
          </span>
        ))}
      </div>
    </fieldset>
  );
}
