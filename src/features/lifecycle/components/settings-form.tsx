import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/feedback';
import { applyFieldErrors } from '@/lib/api-client';
import {
  mailSenderNameSchema,
  panelParamSchema,
  type FieldworkSettings,
} from '@shared/schemas/study-lifecycle';
import { emailSchema } from '@shared/schemas/email';
import { emptyOr } from '@shared/schemas/empty-or';
import { useUpdateSettings } from '../api/update-settings';
import { FormTextFields, type TextFieldSpec } from '@/components/ui/form-text-fields';

/** The form works on text inputs; empty means "none". The server checks the parsed values again. */
const formSchema = z.object({
  closeAt: z.string(),
  quotaCompletes: z.string().regex(/^\d*$/, 'A whole number of completes, or empty for no quota'),
  panelParam: panelParamSchema,
  dedupePanelIds: z.boolean(),
  lateAnswerGraceHours: z
    .string()
    .regex(/^\d+$/, 'A whole number of hours')
    .refine((s) => Number(s) <= 720, 'At most 720 hours (30 days)'),
  complete: z.string(),
  screenedOut: z.string(),
  overQuota: z.string(),
  mailSenderName: emptyOr(mailSenderNameSchema),
  mailReplyTo: emptyOr(emailSchema),
});
type FormValues = z.infer<typeof formSchema>;

const toLocalInput = (iso: string | null) => {
  if (!iso) return '';
  const d = new Date(iso);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
};
const orNull = (s: string) => (s.trim() === '' ? null : s.trim());

/** Where a panel respondent is sent back to at each way out of the survey. */
const redirects = [
  { name: 'complete', when: 'complete', page: 'complete' },
  { name: 'screenedOut', when: 'screened out', page: 'screened' },
  { name: 'overQuota', when: 'over quota', page: 'full' },
] as const;

const closeFields: TextFieldSpec<FormValues>[] = [
  {
    name: 'closeAt',
    label: 'Close automatically at',
    type: 'datetime-local',
    hint: 'Local time. Leave empty to close by hand.',
  },
  {
    name: 'quotaCompletes',
    label: 'Close at this many completes',
    inputMode: 'numeric',
    hint: 'Leave empty for no quota.',
  },
  {
    name: 'panelParam',
    label: 'Panel id parameter',
    hint: "Stored as the respondent's external id, e.g. ?pid=123.",
  },
];

const returnAndMailFields: TextFieldSpec<FormValues>[] = [
  {
    name: 'lateAnswerGraceHours',
    label: 'Accept answers given before the close for (hours)',
    inputMode: 'numeric',
    hint: 'Phones that were offline send their answers later. 0 refuses every answer after the close.',
  },
  ...redirects.map((r, i) => ({
    name: r.name,
    label: `Redirect when ${r.when}`,
    placeholder: `https://panel.example/${r.page}?id={pid}`,
    hint:
      i === redirects.length - 1 ? "{pid} is replaced by the respondent's panel id." : undefined,
  })),
  {
    name: 'mailSenderName',
    label: 'Invitation e-mails come from',
    placeholder: 'Larkspur customer research',
    hint: "The sender name invitees see. Leave empty for the product's own.",
  },
  {
    name: 'mailReplyTo',
    label: 'Replies to invitations go to',
    type: 'email',
    placeholder: 'research@your-organisation.example',
    hint: 'Leave empty if replies should not reach the team.',
  },
];

export function SettingsForm({
  teamId,
  studyId,
  settings,
  canManage,
}: {
  teamId: string;
  studyId: string;
  settings: FieldworkSettings;
  canManage: boolean;
}) {
  const update = useUpdateSettings(teamId, studyId);
  const form = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    values: {
      closeAt: toLocalInput(settings.closeAt),
      quotaCompletes: settings.quotaCompletes?.toString() ?? '',
      panelParam: settings.panelParam,
      dedupePanelIds: settings.dedupePanelIds,
      lateAnswerGraceHours: String(settings.lateAnswerGraceHours),
      complete: settings.redirects.complete ?? '',
      screenedOut: settings.redirects.screenedOut ?? '',
      overQuota: settings.redirects.overQuota ?? '',
      mailSenderName: settings.mailSenderName ?? '',
      mailReplyTo: settings.mailReplyTo ?? '',
    },
  });
  const submit = form.handleSubmit((v) =>
    update.mutate(
      {
        closeAt: v.closeAt ? new Date(v.closeAt).toISOString() : null,
        quotaCompletes: v.quotaCompletes ? Number(v.quotaCompletes) : null,
        panelParam: v.panelParam,
        dedupePanelIds: v.dedupePanelIds,
        lateAnswerGraceHours: Number(v.lateAnswerGraceHours),
        redirects: {
          complete: orNull(v.complete),
          screenedOut: orNull(v.screenedOut),
          overQuota: orNull(v.overQuota),
        },
        mailSenderName: orNull(v.mailSenderName),
        mailReplyTo: orNull(v.mailReplyTo),
      },
      {
        onError: (err) =>
          applyFieldErrors(err, (name, e) =>
            form.setError(String(name).replace('redirects.', '') as keyof FormValues, e),
          ),
      },
    ),
  );
  return (
    <form onSubmit={submit} aria-label="Fieldwork settings" className="max-w-3xl space-y-4">
      <fieldset disabled={!canManage} className="grid gap-4">
        <FormTextFields form={form} fields={closeFields} />
        <label className="flex items-start gap-2 text-sm">
          <input
            type="checkbox"
            className="mt-0.5 size-4 accent-primary"
            {...form.register('dedupePanelIds')}
          />
          <span>
            One respondent per panel id
            <span className="block text-xs text-ink-muted">
              A panel id that comes back resumes its own session instead of answering again.
            </span>
          </span>
        </label>
        <FormTextFields form={form} fields={returnAndMailFields} />
      </fieldset>
      {update.error && !applyFieldErrors(update.error, () => {}) && (
        <Alert tone="danger">{update.error.message}</Alert>
      )}
      {canManage && (
        <div className="flex items-center gap-3">
          <Button type="submit" busy={update.isPending} disabled={!form.formState.isDirty}>
            Save settings
          </Button>
          {update.isSuccess && !form.formState.isDirty && (
            <span role="status" className="text-sm text-success">
              Saved.
            </span>
          )}
        </div>
      )}
    </form>
  );
}
