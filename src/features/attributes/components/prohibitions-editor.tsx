import { useState } from 'react';
import type { StudyDefinition } from '@shared/schemas/study-definition';
import { Card } from '@/components/ui/feedback';
import { SelectField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import type { FieldErrors } from '../utils/field-errors';
import { newId } from '../utils/definition-drafts';
import { getLevelLabel } from '@shared/study/level-labels';

type Props = {
  definition: StudyDefinition;
  errors: FieldErrors;
  readOnly: boolean;
  onChange: (d: StudyDefinition) => void;
};

/** Options are "attributeId|levelId" so one select picks both. */
function levelOptions(d: StudyDefinition) {
  return d.attributes.flatMap((a) =>
    a.levels.map((l, i) => ({
      value: `${a.id}|${l.id}`,
      text: `${a.name || 'Unnamed'}: ${getLevelLabel(a, l) || `Level ${i + 1}`}`,
    })),
  );
}

export function ProhibitionsEditor({ definition: d, errors, readOnly, onChange }: Props) {
  const [a, setA] = useState('');
  const [b, setB] = useState('');
  const options = levelOptions(d);
  const textOf = (v: string) => options.find((o) => o.value === v)?.text ?? 'removed level';
  const sameAttribute = a && b && a.split('|')[0] === b.split('|')[0];
  const add = () => {
    const [aa, al] = a.split('|');
    const [ba, bl] = b.split('|');
    onChange({
      ...d,
      prohibitions: [
        ...d.prohibitions,
        { id: newId(), a: { attributeId: aa, levelId: al }, b: { attributeId: ba, levelId: bl } },
      ],
    });
    setA('');
    setB('');
  };
  return (
    <Card title="Prohibited combinations">
      <p className="mb-3 text-sm text-ink-soft">
        Two levels that must never appear together in the same alternative.
      </p>
      {d.prohibitions.length > 0 && (
        <ul className="mb-4 space-y-2">
          {d.prohibitions.map((p, i) => (
            <li
              key={p.id}
              className="flex flex-wrap items-center gap-2 rounded-md border border-line/70 px-3 py-2 text-sm"
            >
              <span className="flex-1">
                {textOf(`${p.a.attributeId}|${p.a.levelId}`)} <strong>never with</strong>{' '}
                {textOf(`${p.b.attributeId}|${p.b.levelId}`)}
              </span>
              {errors.get(`prohibitions.${i}`) && (
                <span role="alert" className="text-xs text-danger">
                  {errors.get(`prohibitions.${i}`)}
                </span>
              )}
              {!readOnly && (
                <Button
                  size="sm"
                  variant="ghost"
                  onClick={() =>
                    onChange({ ...d, prohibitions: d.prohibitions.filter((x) => x.id !== p.id) })
                  }
                >
                  Remove
                </Button>
              )}
            </li>
          ))}
        </ul>
      )}
      {!readOnly && options.length > 0 && (
        <div className="grid items-end gap-3 sm:grid-cols-[1fr_1fr_auto]">
          <SelectField label="This level" value={a} onChange={(e) => setA(e.target.value)}>
            <option value="">Choose…</option>
            {options.map((o) => (
              <option key={o.value} value={o.value}>
                {o.text}
              </option>
            ))}
          </SelectField>
          <SelectField
            label="never with"
            value={b}
            error={sameAttribute ? 'Pick a level of another attribute' : undefined}
            onChange={(e) => setB(e.target.value)}
          >
            <option value="">Choose…</option>
            {options.map((o) => (
              <option key={o.value} value={o.value}>
                {o.text}
              </option>
            ))}
          </SelectField>
          <Button variant="secondary" disabled={!a || !b || !!sameAttribute} onClick={add}>
            Add rule
          </Button>
        </div>
      )}
    </Card>
  );
}
