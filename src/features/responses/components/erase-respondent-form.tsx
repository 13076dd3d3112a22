/**
 * Erasure of one respondent on a data-protection request (owners): find them, read what will
 * go, give a reason, then confirm in the app's own dialog. Changing the lookup forgets the
 * preview, so the erasure always acts on the respondent that was shown.
 */
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  eraseRespondentSchema,
  erasureLookupKinds,
  erasureLookupLabels,
  erasureLookupSchema,
  type EraseRespondentInput,
  type ErasurePreview,
} from '@shared/schemas/erasure';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/feedback';
import { SelectField, TextAreaField, TextField } from '@/components/ui/field';
import { ErrorText } from '@/components/ui/error-boundary';
import { useConfirm } from '@/components/ui/confirm-dialog';
import { applyFieldErrors } from '@/lib/api-client';
import { useEraseRespondent, usePreviewErasure } from '../api/erase-respondent';
import { statusLabels } from '../utils/labels';
import { formField } from '@/components/ui/form-field';
import { Options } from '@/components/ui/options';

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** "12 answers, 1 earlier answer and the personal invitation" (only what there is). */
function whatGoes(p: ErasurePreview): string {
  const parts = [plural(p.answers, 'answer')];
  if (p.revisions > 0) parts.push(plural(p.revisions, 'earlier answer'));
  if (p.invitation) parts.push('the personal invitation');
  return parts.length === 1 ? parts[0]! : `${parts.slice(0, -1).join(', ')} and ${parts.at(-1)}`;
}

function whoOf(p: ErasurePreview): string {
  return p.number === null ? 'this invitee' : `respondent ${p.number}`;
}

function PreviewFacts({ preview }: { preview: ErasurePreview }) {
  const facts: [string, string][] = [
    [
      'Respondent number',
      preview.number === null ? 'none (never opened the link)' : String(preview.number),
    ],
    ['Reference in the respondent table', preview.reference ?? '—'],
    ['Status', preview.status ? statusLabels[preview.status] : '—'],
    ['Answers', String(preview.answers)],
    ['Earlier answers (changed by going back)', String(preview.revisions)],
    ['Personal invitation', preview.invitation ? 'yes: address, name and link' : 'no'],
    ['Model runs that used them', String(preview.runsAffected)],
  ];
  return (
    <dl className="grid max-w-lg gap-x-4 gap-y-1 rounded-md border border-line bg-canvas px-4 py-3 text-sm sm:grid-cols-[auto_1fr]">
      {facts.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="text-ink-soft">{k}</dt>
          <dd className="num mb-1 font-medium text-ink sm:mb-0">{v}</dd>
        </div>
      ))}
    </dl>
  );
}

export function EraseRespondentForm({ teamId, studyId }: { teamId: string; studyId: string }) {
  const preview = usePreviewErasure(teamId, studyId);
  const erase = useEraseRespondent(teamId, studyId);
  const { confirm, dialog } = useConfirm();
  const form = useForm<EraseRespondentInput>({
    resolver: zodResolver(eraseRespondentSchema),
    defaultValues: { by: 'number', value: '', reason: '' },
  });
  const { errors } = form.formState;
  const by = useWatch({ control: form.control, name: 'by' });
  const forgetPreview = () => {
    if (preview.data || preview.error) preview.reset();
  };

  const find = () => {
    erase.reset();
    const lookup = erasureLookupSchema.safeParse({ by, value: form.getValues('value') });
    if (!lookup.success) {
      for (const issue of lookup.error.issues)
        form.setError(issue.path[0] === 'by' ? 'by' : 'value', { message: issue.message });
      return;
    }
    form.clearErrors(['by', 'value']);
    preview.mutate(lookup.data, { onError: (e) => applyFieldErrors(e, form.setError) });
  };

  const onSubmit = form.handleSubmit(async (input) => {
    const shown = preview.data;
    if (!shown) return;
    const ok = await confirm({
      title: `Erase ${whoOf(shown)}?`,
      body: (
        <>
          <p>{whatGoes(shown)} will be deleted. This cannot be undone.</p>
          {shown.runsAffected > 0 && (
            <p className="mt-2">
              {plural(shown.runsAffected, 'model run')} will say that they used an erased
              respondent; estimate again to remove them from the results.
            </p>
          )}
        </>
      ),
      confirmLabel: 'Erase for good',
      danger: true,
    });
    if (!ok) return;
    erase.mutate(input, {
      onSuccess: () => {
        form.reset({ by: input.by, value: '', reason: '' });
        preview.reset();
      },
      onError: (e) => applyFieldErrors(e, form.setError),
    });
  });

  const done = erase.data;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <div className="grid gap-3 sm:grid-cols-[minmax(0,14rem)_minmax(0,1fr)_auto] sm:items-end">
        <SelectField label="Find by" {...formField(form, 'by', { onChange: forgetPreview })}>
          <Options
            items={erasureLookupKinds.map((k) => ({ value: k, label: erasureLookupLabels[k] }))}
          />
        </SelectField>
        <TextField
          label={erasureLookupLabels[by]}
          inputMode={by === 'number' ? 'numeric' : by === 'email' ? 'email' : 'text'}
          autoComplete="off"
          {...formField(form, 'value', { onChange: forgetPreview })}
        />
        <Button type="button" variant="secondary" busy={preview.isPending} onClick={find}>
          Find
        </Button>
      </div>
      {preview.error && !errors.value && <ErrorText error={preview.error} />}

      {preview.data && (
        <section aria-label="What will be erased" className="space-y-3">
          <PreviewFacts preview={preview.data} />
          <TextAreaField
            label="Reason (kept in the audit trail)"
            hint="A request reference, not the person's name or address: the audit trail keeps this text."
            placeholder="e.g. Data-protection request DP-2026-014"
            rows={2}
            {...formField(form, 'reason')}
          />
          <div className="flex flex-wrap items-center gap-3">
            <Button type="submit" variant="danger" busy={erase.isPending}>
              Erase {whoOf(preview.data)}…
            </Button>
          </div>
        </section>
      )}
      <ErrorText error={erase.error} />
      {done && (
        <Alert tone="success" title={`Erased ${whoOf(done)}.`}>
          Deleted {whatGoes(done)}.
          {done.runsAffected > 0 &&
            ` ${plural(done.runsAffected, 'model run')} now ${done.runsAffected === 1 ? 'says' : 'say'} so; estimate again to remove them.`}{' '}
          The other respondents keep their numbers.
        </Alert>
      )}
      {dialog}
    </form>
  );
}
