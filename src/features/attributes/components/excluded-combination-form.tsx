import { useState } from 'react';
import {
  excludedCombinationSchema,
  type Attribute,
  type ExcludedCombination,
  type Relation,
  type StudyDefinition,
} from '@shared/schemas/study-definition';
import {
  designedAlternativeName,
  orderingRelations,
  relationWords,
} from '@shared/study/excluded-combinations';
import { getLevelLabel } from '@shared/study/level-labels';
import { SelectField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { newId } from '../utils/definition-drafts';
import { Options } from '@/components/ui/options';
import { CheckboxList } from '@/components/ui/checkbox-field';

type Kind = ExcludedCombination['kind'];

const kindNames: Record<Kind, string> = {
  pair: 'Two levels never together',
  when_then: 'When one attribute shows some levels, another shows only some',
  versus_status_quo: 'Every designed alternative against the status quo',
  between_alternatives: 'One alternative against another in the same task',
};

type Draft = {
  kind: Kind;
  a: string;
  b: string;
  aLevels: string[];
  bLevels: string[];
  relation: Relation;
  first: number;
  second: number;
};

const empty: Draft = {
  kind: 'pair',
  a: '',
  b: '',
  aLevels: [],
  bLevels: [],
  relation: 'greater',
  first: 0,
  second: 1,
};

const levelName = (a: Attribute, l: Attribute['levels'][number], i: number) =>
  getLevelLabel(a, l) || `Level ${i + 1}`;

/** The rule a draft describes (validated by the shared schema before it can be added). */
function toRule(v: Draft): unknown {
  const id = newId();
  switch (v.kind) {
    case 'pair': {
      const [aa, al] = v.a.split('|');
      const [ba, bl] = v.b.split('|');
      return {
        id,
        kind: 'pair',
        a: { attributeId: aa, levelId: al },
        b: { attributeId: ba, levelId: bl },
      };
    }
    case 'when_then':
      return {
        id,
        kind: 'when_then',
        when: { attributeId: v.a, levelIds: v.aLevels },
        then: { attributeId: v.b, levelIds: v.bLevels },
      };
    case 'versus_status_quo':
      return { id, kind: 'versus_status_quo', attributeId: v.a, relation: v.relation };
    case 'between_alternatives':
      return {
        id,
        kind: 'between_alternatives',
        attributeId: v.a,
        first: v.first,
        relation: v.relation,
        second: v.second,
      };
  }
}

function LevelChecks(props: {
  legend: string;
  attribute: Attribute | undefined;
  chosen: string[];
  onChange: (ids: string[]) => void;
}) {
  const { legend, attribute, chosen, onChange } = props;
  if (!attribute) return null;
  return (
    <fieldset className="space-y-1">
      <legend className="text-sm font-medium text-ink">{legend}</legend>
      <CheckboxList
        items={attribute.levels.map((l, i) => ({ id: l.id, label: levelName(attribute, l, i) }))}
        selected={chosen}
        onChange={onChange}
        boxClassName="size-4 accent-primary"
      />
    </fieldset>
  );
}

/** Adds one excluded combination of the chosen kind. */
export function ExcludedCombinationForm({
  definition: d,
  onAdd,
}: {
  definition: StudyDefinition;
  onAdd: (rule: ExcludedCombination) => void;
}) {
  const [v, setV] = useState<Draft>(empty);
  const set = (patch: Partial<Draft>) => setV((old) => ({ ...old, ...patch }));
  const attribute = (id: string) => d.attributes.find((a) => a.id === id);
  const hasStatusQuo = d.fixedAlternative?.kind === 'status_quo';
  const kinds = (Object.keys(kindNames) as Kind[]).filter(
    (k) =>
      (k !== 'versus_status_quo' || hasStatusQuo) && (k !== 'when_then' || d.attributes.length > 1),
  );
  const compared = attribute(v.a);
  const relations = (Object.keys(relationWords) as Relation[]).filter(
    (r) => compared?.kind === 'numeric' || !orderingRelations.has(r),
  );
  const levelOptions = d.attributes.flatMap((a) =>
    a.levels.map((l, i) => ({
      value: `${a.id}|${l.id}`,
      text: `${a.name || 'Unnamed'}: ${levelName(a, l, i)}`,
    })),
  );
  const parsed = excludedCombinationSchema.safeParse(toRule(v));
  const sameAttribute =
    (v.kind === 'pair' && v.a && v.b && v.a.split('|')[0] === v.b.split('|')[0]) ||
    (v.kind === 'when_then' && v.a && v.a === v.b);
  const attributeSelect = (label: string, key: 'a' | 'b') => (
    <SelectField
      label={label}
      value={v[key]}
      onChange={(e) =>
        set({
          [key]: e.target.value,
          [key === 'a' ? 'aLevels' : 'bLevels']: [],
          ...(key === 'a'
            ? {
                relation: (attribute(e.target.value)?.kind === 'numeric'
                  ? 'greater'
                  : 'different') as Relation,
              }
            : {}),
        })
      }
    >
      <option value="">Choose…</option>
      <Options
        items={d.attributes.map((a) => ({ value: a.id, label: a.name || 'Unnamed attribute' }))}
      />
    </SelectField>
  );
  const relationSelect = (
    <SelectField
      label="is"
      value={v.relation}
      onChange={(e) => set({ relation: e.target.value as Relation })}
    >
      <Options items={relations.map((r) => ({ value: r, label: relationWords[r] }))} />
    </SelectField>
  );
  const alternativeSelect = (label: string, key: 'first' | 'second') => (
    <SelectField
      label={label}
      value={v[key]}
      onChange={(e) => set({ [key]: Number(e.target.value) })}
    >
      {Array.from({ length: d.alternatives.count }, (_, j) => (
        <option key={j} value={j}>
          {designedAlternativeName(d, j)}
        </option>
      ))}
    </SelectField>
  );

  return (
    <form
      aria-label="Add an excluded combination"
      className="space-y-3 rounded-md bg-canvas p-3"
      onSubmit={(e) => {
        e.preventDefault();
        if (!parsed.success || sameAttribute) return;
        onAdd(parsed.data);
        setV({ ...empty, kind: v.kind });
      }}
    >
      <SelectField
        label="Kind of rule"
        value={v.kind}
        onChange={(e) => setV({ ...empty, kind: e.target.value as Kind })}
      >
        <Options items={kinds.map((k) => ({ value: k, label: kindNames[k] }))} />
      </SelectField>
      {v.kind === 'pair' && (
        <div className="grid gap-3 sm:grid-cols-2">
          {(['a', 'b'] as const).map((key) => (
            <SelectField
              key={key}
              label={key === 'a' ? 'This level' : 'never with'}
              value={v[key]}
              error={key === 'b' && sameAttribute ? 'Pick a level of another attribute' : undefined}
              onChange={(e) => set({ [key]: e.target.value })}
            >
              <option value="">Choose…</option>
              <Options items={levelOptions.map((o) => ({ value: o.value, label: o.text }))} />
            </SelectField>
          ))}
        </div>
      )}
      {v.kind === 'when_then' && (
        <div className="grid gap-3 sm:grid-cols-2">
          <div className="space-y-2">
            {attributeSelect('When', 'a')}
            <LevelChecks
              legend="shows one of"
              attribute={attribute(v.a)}
              chosen={v.aLevels}
              onChange={(aLevels) => set({ aLevels })}
            />
          </div>
          <div className="space-y-2">
            {attributeSelect('then', 'b')}
            {sameAttribute && (
              <p role="alert" className="text-xs font-medium text-danger">
                Pick another attribute
              </p>
            )}
            <LevelChecks
              legend="shows only"
              attribute={attribute(v.b)}
              chosen={v.bLevels}
              onChange={(bLevels) => set({ bLevels })}
            />
          </div>
        </div>
      )}
      {v.kind === 'versus_status_quo' && (
        <div className="grid gap-3 sm:grid-cols-2">
          {attributeSelect('In every designed alternative,', 'a')}
          {relationSelect}
          <p className="text-sm text-ink-soft sm:col-span-2">
            … the level of “{d.fixedAlternative?.label}”.
          </p>
        </div>
      )}
      {v.kind === 'between_alternatives' && (
        <div className="grid gap-3 sm:grid-cols-4">
          {attributeSelect('Attribute', 'a')}
          {alternativeSelect('of', 'first')}
          {relationSelect}
          {alternativeSelect('that of', 'second')}
        </div>
      )}
      <Button type="submit" variant="secondary" disabled={!parsed.success || !!sameAttribute}>
        Add rule
      </Button>
    </form>
  );
}
