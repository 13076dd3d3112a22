import { useId, type ReactNode } from 'react';
import type { Attribute } from '@shared/schemas/study-definition';
import { SelectField, TextAreaField, TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import type { FieldErrors } from '../utils/field-errors';
import { changeKind, makeLevel, moveItem } from '../utils/definition-drafts';
import { LevelRow } from './level-row';
import { SortableList } from './sortable-list';
import { getLevelLabel } from '@shared/study/level-labels';

type Props = {
  attribute: Attribute;
  index: number;
  errors: FieldErrors;
  handle: ReactNode;
  readOnly: boolean;
  onChange: (a: Attribute) => void;
  onRemove: () => void;
  uploadImage: (file: File) => Promise<{ key: string }>;
};

const codingHelp = {
  dummy: 'Each level against the reference level.',
  effects: 'Each level against the average of all levels.',
  linear: 'One coefficient per unit of the value.',
};

export function AttributeCard(props: Props) {
  const { attribute: a, index, errors, handle, readOnly, onChange } = props;
  const id = useId();
  const path = `attributes.${index}`;
  const levelsError = errors.get(`${path}.levels`);
  const set = (patch: Partial<Attribute>) => onChange({ ...a, ...patch });

  return (
    <section
      aria-label={`Attribute ${a.name || index + 1}`}
      className="rounded-lg border border-line bg-white p-3 sm:p-4"
    >
      <div className="flex items-start gap-2">
        {handle}
        <div className="grid flex-1 gap-3 sm:grid-cols-[2fr_1fr_1fr]">
          <TextField
            label="Attribute name"
            value={a.name}
            disabled={readOnly}
            error={errors.get(`${path}.name`)}
            onChange={(e) => set({ name: e.target.value })}
          />
          <SelectField
            label="Kind"
            value={a.kind}
            disabled={readOnly}
            onChange={(e) => onChange(changeKind(a, e.target.value as Attribute['kind']))}
          >
            <option value="categorical">Categorical (labels)</option>
            <option value="numeric">Numeric (values)</option>
          </SelectField>
          <SelectField
            label="Coding"
            value={a.coding}
            disabled={readOnly}
            hint={codingHelp[a.coding]}
            error={errors.get(`${path}.coding`)}
            onChange={(e) => set({ coding: e.target.value as Attribute['coding'] })}
          >
            <option value="dummy">Dummy</option>
            <option value="effects">Effects</option>
            {a.kind === 'numeric' && <option value="linear">Linear</option>}
          </SelectField>
        </div>
      </div>

      <div className="mt-3 grid gap-3 sm:grid-cols-3">
        {a.kind === 'numeric' && (
          <TextField
            label="Unit"
            hint="€, %, days… (currency symbols go before the number)"
            value={a.unit ?? ''}
            disabled={readOnly}
            onChange={(e) => set({ unit: e.target.value })}
          />
        )}
        {a.coding === 'dummy' && (
          <SelectField
            label="Reference level"
            value={a.referenceLevelId ?? a.levels[0]?.id ?? ''}
            disabled={readOnly}
            error={errors.get(`${path}.referenceLevelId`)}
            onChange={(e) => set({ referenceLevelId: e.target.value })}
          >
            {a.levels.map((l, i) => (
              <option key={l.id} value={l.id}>
                {getLevelLabel(a, l) || `Level ${i + 1}`}
              </option>
            ))}
          </SelectField>
        )}
        {a.kind === 'numeric' && (
          <div className="flex items-end pb-2">
            <label htmlFor={`${id}-cost`} className="flex items-center gap-2 text-sm text-ink">
              <input
                id={`${id}-cost`}
                type="checkbox"
                className="size-5 accent-primary"
                checked={a.isCost}
                disabled={readOnly}
                onChange={(e) => set({ isCost: e.target.checked })}
              />
              This is the cost attribute
            </label>
          </div>
        )}
      </div>
      {errors.get(`${path}.isCost`) && (
        <p role="alert" className="mt-1 text-xs font-medium text-danger">
          {errors.get(`${path}.isCost`)}
        </p>
      )}

      <h3 className="mt-4 mb-2 text-sm font-semibold text-ink">
        Levels <span className="font-normal text-ink-muted">({a.levels.length})</span>
      </h3>
      <SortableList
        items={a.levels}
        disabled={readOnly}
        className="space-y-2"
        itemName={(l) => `level ${getLevelLabel(a, l)}`.trim()}
        onMove={(from, to) => set({ levels: moveItem(a.levels, from, to) })}
        renderItem={(level, li, levelHandle) => (
          <LevelRow
            attribute={a}
            level={level}
            path={`${path}.levels.${li}`}
            errors={errors}
            handle={levelHandle}
            readOnly={readOnly}
            canRemove={a.levels.length > 2}
            uploadImage={props.uploadImage}
            onChange={(l) => set({ levels: a.levels.map((x) => (x.id === l.id ? l : x)) })}
            onRemove={() => set({ levels: a.levels.filter((x) => x.id !== level.id) })}
          />
        )}
      />
      {levelsError && (
        <p role="alert" className="mt-1 text-xs font-medium text-danger">
          {levelsError}
        </p>
      )}
      {!readOnly && (
        <div className="mt-2 flex flex-wrap gap-2">
          <Button
            size="sm"
            variant="secondary"
            disabled={a.levels.length >= 12}
            onClick={() => set({ levels: [...a.levels, makeLevel(a, a.levels.length)] })}
          >
            Add level
          </Button>
        </div>
      )}

      <TextAreaField
        wrapperClassName="mt-4"
        label="Description shown to respondents (optional)"
        className="min-h-16"
        value={a.description ?? ''}
        disabled={readOnly}
        onChange={(e) => set({ description: e.target.value })}
      />
      {!readOnly && (
        <div className="mt-3 flex justify-end">
          <Button size="sm" variant="ghost" className="text-danger" onClick={props.onRemove}>
            Delete attribute
          </Button>
        </div>
      )}
    </section>
  );
}
