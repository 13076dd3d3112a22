/**
 * One inferred attribute of an import, editable before saving: its name, kind, coding, whether
 * it is the cost, the reference level (dummy coding) and every level's label. The column and
 * the values as the file writes them stay as they are.
 */
import { useFormContext, useWatch } from 'react-hook-form';
import type { ImportSetupInput } from '@shared/schemas/study-import';
import { SelectField, TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { formField } from '@/components/ui/form-field';
import { Options } from '@/components/ui/options';

export function ImportedAttributeFields({
  index,
  onRemove,
}: {
  index: number;
  onRemove: () => void;
}) {
  const form = useFormContext<ImportSetupInput>();
  const { register, control, formState } = form;
  const at = `attributes.${index}` as const;
  const attribute = useWatch({ control, name: at });
  const errors = formState.errors.attributes?.[index];
  const numeric = attribute.kind === 'numeric';
  return (
    <fieldset className="space-y-3 rounded-md border border-line p-3">
      <legend className="px-1 text-sm font-medium text-ink">
        Column <code className="font-mono">{attribute.column}</code>
      </legend>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <TextField label="Attribute name" {...formField(form, `${at}.name`)} />
        <SelectField label="Kind" {...register(`${at}.kind`)}>
          <option value="numeric">Numeric</option>
          <option value="categorical">Categorical</option>
        </SelectField>
        <SelectField label="Coding" {...formField(form, `${at}.coding`)}>
          {numeric && <option value="linear">Linear</option>}
          <option value="dummy">Dummy</option>
          <option value="effects">Effects</option>
        </SelectField>
        {attribute.coding === 'dummy' ? (
          <SelectField label="Reference level" {...register(`${at}.referenceRaw`)}>
            <Options items={attribute.levels.map((l) => ({ value: l.raw, label: l.raw }))} />
          </SelectField>
        ) : (
          <div />
        )}
      </div>
      {numeric && (
        <label className="flex min-h-8 items-center gap-2 text-sm">
          <input type="checkbox" className="size-4 accent-primary" {...register(`${at}.isCost`)} />
          This is the cost (used for willingness to pay)
        </label>
      )}
      <div>
        <p className="mb-1 text-sm font-medium text-ink">
          Levels (value in the file → label shown)
        </p>
        <ul className="grid gap-2 sm:grid-cols-2 lg:grid-cols-3">
          {attribute.levels.map((level, k) => (
            <li key={level.raw}>
              <TextField
                label={
                  <>
                    <span className="font-mono">{level.raw}</span> →
                  </>
                }
                placeholder={numeric ? 'from the value' : level.raw}
                {...formField(form, `${at}.levels.${k}.label`)}
              />
            </li>
          ))}
        </ul>
        {errors?.levels?.message && (
          <p role="alert" className="text-xs font-medium text-danger">
            {errors.levels.message}
          </p>
        )}
      </div>
      <Button type="button" size="sm" variant="ghost" onClick={onRemove}>
        Leave this column out
      </Button>
    </fieldset>
  );
}
