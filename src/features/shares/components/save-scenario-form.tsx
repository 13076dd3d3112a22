/**
 * Saves the scenario on screen under a name: as a new scenario, or over the loaded one. Server
 * field errors (a name already taken, a level that no longer exists) land on the field.
 */
import { useEffect, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { ErrorText } from '@/components/ui/error-boundary';
import { applyFieldErrors } from '@/lib/api-client';
import { scenarioBodySchema } from '@shared/schemas/shares';
import { formField } from '@/components/ui/form-field';

const nameSchema = scenarioBodySchema.pick({ name: true });
type NameForm = z.infer<typeof nameSchema>;

export function SaveScenarioForm({
  loaded,
  onSave,
  busy,
}: {
  /** The saved scenario being edited, if any. */
  loaded: { id: string; name: string } | null;
  onSave: (name: string, id: string | undefined) => Promise<unknown>;
  busy: boolean;
}) {
  const form = useForm<NameForm>({
    resolver: zodResolver(nameSchema),
    defaultValues: { name: loaded?.name ?? '' },
  });
  const [failure, setFailure] = useState<unknown>(null);
  const { reset } = form;
  useEffect(() => reset({ name: loaded?.name ?? '' }), [loaded?.id, loaded?.name, reset]);
  const submit = (id: string | undefined) =>
    form.handleSubmit(async ({ name }) => {
      setFailure(null);
      try {
        await onSave(name, id);
      } catch (e) {
        if (!applyFieldErrors(e, form.setError)) setFailure(e);
      }
    });
  return (
    <form className="flex flex-wrap items-end gap-3" onSubmit={submit(undefined)} noValidate>
      <TextField
        label="Scenario name"
        wrapperClassName="w-full sm:w-72"
        maxLength={80}
        {...formField(form, 'name')}
      />
      <Button type="submit" variant={loaded ? 'secondary' : 'primary'} busy={busy}>
        Save as new scenario
      </Button>
      {loaded && (
        <Button type="button" busy={busy} onClick={submit(loaded.id)}>
          Save changes to “{loaded.name}”
        </Button>
      )}
      <ErrorText error={failure} />
    </form>
  );
}
