/**
 * The set-up of an import (study name and the attributes inferred from the columns), edited
 * with react-hook-form against the same zod schema the server parses. "Check again" sends it
 * with the files for a new preview; "Create the study" saves, which the server refuses while
 * any problem is left.
 */
import { FormProvider, useFieldArray, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  importSetupSchema,
  type ImportAttribute,
  type ImportSetupInput,
} from '@shared/schemas/study-import';
import { TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { ImportedAttributeFields } from './imported-attribute-fields';
import { formField } from '@/components/ui/form-field';

type Props = {
  attributes: ImportAttribute[];
  defaultName: string;
  canSave: boolean;
  busy: boolean;
  onCheck: (setup: ImportSetupInput) => void;
  onSave: (setup: ImportSetupInput) => void;
};

export function ImportSetupForm({
  attributes,
  defaultName,
  canSave,
  busy,
  onCheck,
  onSave,
}: Props) {
  const form = useForm<ImportSetupInput>({
    resolver: zodResolver(importSetupSchema),
    defaultValues: { name: defaultName, description: '', attributes },
  });
  const list = useFieldArray({ control: form.control, name: 'attributes' });
  const { errors } = form.formState;
  return (
    <FormProvider {...form}>
      <form
        noValidate
        className="space-y-4"
        aria-label="Study set-up"
        onSubmit={form.handleSubmit(onSave)}
      >
        <TextField label="Study name" {...formField(form, 'name')} />
        <div className="space-y-3">
          <h3 className="text-sm font-semibold text-ink">Attributes found in the columns</h3>
          {list.fields.map((field, i) => (
            <ImportedAttributeFields key={field.id} index={i} onRemove={() => list.remove(i)} />
          ))}
          {errors.attributes?.message && (
            <p role="alert" className="text-xs font-medium text-danger">
              {errors.attributes.message}
            </p>
          )}
        </div>
        <div className="flex flex-wrap gap-2">
          <Button
            type="button"
            variant="secondary"
            busy={busy}
            onClick={form.handleSubmit(onCheck)}
          >
            Check again with this set-up
          </Button>
          <Button type="submit" busy={busy} disabled={!canSave}>
            Create the study
          </Button>
        </div>
      </form>
    </FormProvider>
  );
}
