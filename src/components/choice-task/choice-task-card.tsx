/**
 * One choice task as respondents see it: the alternatives as cards, attribute rows aligned
 * across cards (CSS subgrid), stacked when narrow and side by side once its container is
 * tablet-wide (a container query, so a phone-sized preview frame stacks too); the whole
 * card is the tap target. Pure and presentational: shared by Preview and the respondent app.
 */
import type { KeyboardEvent } from 'react';
import type { StudyDefinition } from '@shared/schemas/study-definition';
import { cn } from '@/lib/cn';
import { formatLevel } from './format-level';

/** One alternative in display order: a designed one (its design index and levels) or the fixed one. */
export type ChoiceTaskAlternative =
  { kind: 'designed'; designIndex: number; levels: Record<string, string> } | { kind: 'fixed' };

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
  /** Accessible name of the group, e.g. "Task 3 of 8". */
  label?: string;
};

const LETTERS = 'ABCDE';

function alternativeTitle(definition: ShownDefinition, alt: ChoiceTaskAlternative, shown: number) {
  if (alt.kind === 'fixed') return definition.fixedAlternative?.label ?? 'None of these';
  const named = definition.alternatives.labeled
    ? definition.alternatives.labels[alt.designIndex]?.name
    : undefined;
  return named ?? `Option ${LETTERS[shown] ?? shown + 1}`;
}

export function ChoiceTaskCard({
  definition,
  alternatives,
  selectedIndex = null,
  onChoose,
  imageUrl = (key) => `/api/files/${encodeURIComponent(key)}`,
  label = 'Choose one option',
}: ChoiceTaskCardProps) {
  const attributes = definition.attributes;
  const fixed = definition.fixedAlternative;
  const onKey = (e: KeyboardEvent, i: number) => {
    if (e.key === 'Enter' || e.key === ' ') {
      e.preventDefault();
      onChoose?.(i);
    }
  };
  let designedShown = 0;
  const described = attributes.filter((a) => a.description?.trim());

  return (
    <div className="@container w-full">
      {described.length > 0 && (
        <details className="mb-3 rounded-md border border-line bg-white px-3 py-2 text-sm">
          <summary className="cursor-pointer font-medium text-ink">What the features mean</summary>
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
      <div
        role="radiogroup"
        aria-label={label}
        className="flex flex-col gap-3 @xl:grid @xl:gap-x-4 @xl:gap-y-0"
        style={{
          gridTemplateColumns: `repeat(${alternatives.length}, minmax(0, 1fr))`,
          gridTemplateRows: `auto repeat(${attributes.length}, auto) auto`,
        }}
      >
        {alternatives.map((alt, i) => {
          const title = alternativeTitle(
            definition,
            alt,
            alt.kind === 'designed' ? designedShown++ : 0,
          );
          const selected = selectedIndex === i;
          const omitted = new Set(
            alt.kind === 'designed' && definition.alternatives.labeled
              ? (definition.alternatives.labels[alt.designIndex]?.omittedAttributeIds ?? [])
              : [],
          );
          const isOptOut = alt.kind === 'fixed' && fixed?.kind === 'opt_out';
          return (
            <div
              key={i}
              role="radio"
              aria-checked={selected}
              aria-label={title}
              tabIndex={onChoose ? 0 : -1}
              onClick={() => onChoose?.(i)}
              onKeyDown={(e) => onKey(e, i)}
              className={cn(
                'flex flex-col rounded-xl border-2 bg-white p-4 text-left shadow-sm transition-colors @xl:row-span-full @xl:grid @xl:grid-rows-subgrid',
                onChoose && 'cursor-pointer hover:border-primary/60',
                selected ? 'border-primary ring-2 ring-primary/25' : 'border-line',
                alt.kind === 'fixed' && !selected && 'bg-canvas',
              )}
            >
              <div className="mb-2 flex items-center justify-between gap-2">
                <span className="text-base font-semibold text-ink">{title}</span>
                <span
                  aria-hidden
                  className={cn(
                    'flex size-6 shrink-0 items-center justify-center rounded-full border-2 text-sm',
                    selected ? 'border-primary bg-primary text-white' : 'border-line',
                  )}
                >
                  {selected ? '✓' : ''}
                </span>
              </div>
              {attributes.map((a) => {
                const levelId =
                  alt.kind === 'designed'
                    ? alt.levels[a.id]
                    : isOptOut
                      ? undefined
                      : fixed?.levels[a.id];
                const level = a.levels.find((l) => l.id === levelId);
                const text = omitted.has(a.id) || !level ? '—' : formatLevel(a, level);
                return (
                  <div key={a.id} className="border-t border-line/70 py-2">
                    <div className="text-xs text-ink-muted">{a.name}</div>
                    <div className="text-base font-medium text-ink">
                      {level?.imageKey && !omitted.has(a.id) && (
                        <img
                          src={imageUrl(level.imageKey)}
                          alt=""
                          className="mb-1 max-h-20 w-auto rounded"
                          loading="lazy"
                        />
                      )}
                      {text === '—' ? (
                        <span>
                          <span aria-hidden>—</span>
                          <span className="sr-only">does not apply</span>
                        </span>
                      ) : (
                        text
                      )}
                    </div>
                  </div>
                );
              })}
              <div className="mt-auto pt-3">
                <span
                  className={cn(
                    'flex min-h-12 w-full items-center justify-center rounded-lg text-base font-semibold',
                    selected ? 'bg-primary text-white' : 'bg-primary-soft text-primary',
                  )}
                >
                  {selected ? 'Chosen' : 'Choose this'}
                </span>
              </div>
            </div>
          );
        })}
      </div>
    </div>
  );
}
