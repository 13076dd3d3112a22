import { SelectField } from '@/components/ui/field';
import type { QuestionnairePage } from '@shared/schemas/questionnaire';
import type { Attribute, StudyDefinition } from '@shared/schemas/study-definition';
import { getLevelLabel } from '@shared/study/level-labels';
import { Options } from '@/components/ui/options';

type HandSetTaskPage = Extract<QuestionnairePage, { kind: 'warmup' | 'holdout' }>;
type DominancePage = Extract<QuestionnairePage, { kind: 'dominance' }>;

/** One attribute's levels to pick from, empty until the researcher picks one. */
function LevelSelect({
  attribute,
  label,
  value,
  onChange,
}: {
  attribute: Attribute;
  label: string;
  value: string | undefined;
  onChange: (levelId: string) => void;
}) {
  return (
    <SelectField label={label} value={value ?? ''} onChange={(e) => onChange(e.target.value)}>
      <option value="">Choose a level</option>
      <Options
        items={attribute.levels.map((l) => ({ value: l.id, label: getLevelLabel(attribute, l) }))}
      />
    </SelectField>
  );
}

/** Levels of a warm-up or holdout task: one select per attribute and alternative. */
export function HandSetTaskFields({
  page,
  definition,
  onChange,
}: {
  page: HandSetTaskPage;
  definition: StudyDefinition;
  onChange: (p: HandSetTaskPage) => void;
}) {
  const setLevel = (j: number, attributeId: string, levelId: string) =>
    onChange({
      ...page,
      alternatives: page.alternatives.map((alt, k) =>
        k === j ? { levels: { ...alt.levels, [attributeId]: levelId } } : alt,
      ),
    });
  return (
    <div className="grid gap-4 sm:grid-cols-2">
      {page.alternatives.map((alt, j) => (
        <fieldset key={j} className="space-y-3 rounded-md border border-line p-3">
          <legend className="px-1 text-sm font-medium text-ink">
            {definition.alternatives.labeled
              ? (definition.alternatives.labels[j]?.name ?? `Alternative ${j + 1}`)
              : `Option ${String.fromCharCode(65 + j)}`}
          </legend>
          {definition.attributes.map((a) => (
            <LevelSelect
              key={a.id}
              attribute={a}
              label={a.name}
              value={alt.levels[a.id]}
              onChange={(levelId) => setLevel(j, a.id, levelId)}
            />
          ))}
        </fieldset>
      ))}
    </div>
  );
}

/** The best level of every attribute; the other alternatives are built worse on each. */
export function DominanceFields({
  page,
  definition,
  onChange,
}: {
  page: DominancePage;
  definition: StudyDefinition;
  onChange: (p: DominancePage) => void;
}) {
  return (
    <fieldset className="space-y-3">
      <legend className="mb-1 text-sm text-ink-soft">
        The dominant option gets the best level of every attribute; the others get worse levels.
        Respondents who do not choose it may not be paying attention.
      </legend>
      <div className="grid gap-3 sm:grid-cols-2">
        {definition.attributes.map((a) => (
          <LevelSelect
            key={a.id}
            attribute={a}
            label={`Best level of ${a.name}`}
            value={page.bestLevels[a.id]}
            onChange={(levelId) =>
              onChange({ ...page, bestLevels: { ...page.bestLevels, [a.id]: levelId } })
            }
          />
        ))}
      </div>
    </fieldset>
  );
}
