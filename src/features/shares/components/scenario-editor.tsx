/**
 * The what-if scenario: 2–5 hypothetical alternatives, each a level of every attribute (and,
 * for labeled studies, which labeled alternative it is), plus the study's opt-out / status quo.
 */
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import type { ScenarioAlternative } from '@shared/schemas/shares';
import type { StudyDefinition } from '@shared/schemas/study-definition';
import { getLevelLabel } from '@shared/study/level-labels';
import { Options } from '@/components/ui/options';

export const MAX_ALTERNATIVES = 5;

/** A starting alternative: the i-th level of every attribute (wrapping), so two differ. */
export function makeAlternative(definition: StudyDefinition, i: number): ScenarioAlternative {
  const levels: Record<string, string> = {};
  for (const a of definition.attributes) levels[a.id] = a.levels[(i + 1) % a.levels.length].id;
  return {
    name: `Package ${String.fromCharCode(65 + i)}`,
    alternative: definition.alternatives.labeled ? i % definition.alternatives.count : 0,
    levels,
  };
}

const select =
  'mt-1 block h-9 w-full rounded-md border border-line bg-white px-2 text-sm focus:border-primary focus:outline-none';

export function ScenarioEditor({
  definition,
  alternatives,
  onChange,
}: {
  definition: StudyDefinition;
  alternatives: ScenarioAlternative[];
  onChange: (next: ScenarioAlternative[]) => void;
}) {
  const update = (i: number, patch: Partial<ScenarioAlternative>) =>
    onChange(alternatives.map((a, j) => (j === i ? { ...a, ...patch } : a)));
  return (
    <div className="space-y-3">
      <div className="grid gap-3 sm:grid-cols-2 xl:grid-cols-3">
        {alternatives.map((alt, i) => (
          <fieldset key={i} className="rounded-lg border border-line bg-white p-3">
            <legend className="px-1 text-sm font-semibold text-ink">Alternative {i + 1}</legend>
            <TextField
              label="Name"
              value={alt.name}
              maxLength={60}
              onChange={(e) => update(i, { name: e.target.value })}
            />
            {definition.alternatives.labeled && (
              <label className="mt-2 block text-xs text-ink-soft">
                Labeled as
                <select
                  className={select}
                  value={alt.alternative}
                  onChange={(e) => update(i, { alternative: Number(e.target.value) })}
                >
                  {definition.alternatives.labels.map((l, j) => (
                    <option key={l.id} value={j}>
                      {l.name}
                    </option>
                  ))}
                </select>
              </label>
            )}
            {definition.attributes.map((a) => (
              <label key={a.id} className="mt-2 block text-xs text-ink-soft">
                {a.name}
                <select
                  className={select}
                  value={alt.levels[a.id] ?? ''}
                  onChange={(e) => update(i, { levels: { ...alt.levels, [a.id]: e.target.value } })}
                >
                  <Options
                    items={a.levels.map((l) => ({ value: l.id, label: getLevelLabel(a, l) }))}
                  />
                </select>
              </label>
            ))}
            {alternatives.length > 2 && (
              <Button
                variant="ghost"
                size="sm"
                className="mt-2"
                onClick={() => onChange(alternatives.filter((_, j) => j !== i))}
              >
                Remove
              </Button>
            )}
          </fieldset>
        ))}
      </div>
      {alternatives.length < MAX_ALTERNATIVES && (
        <Button
          variant="secondary"
          size="sm"
          onClick={() =>
            onChange([...alternatives, makeAlternative(definition, alternatives.length)])
          }
        >
          Add an alternative
        </Button>
      )}
    </div>
  );
}
