import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { Badge } from '@/components/ui/badge';
import { Alert, Card } from '@/components/ui/feedback';
import { TextField } from '@/components/ui/field';
import { useConfirm } from '@/components/ui/confirm-dialog';
import { applyFieldErrors, ApiError } from '@/lib/api-client';
import { languageName } from '@shared/languages/language-tags';
import { languageTagSchema, type StudyTextsView } from '@shared/schemas/study-texts';
import { useUpdateLanguages } from '../api/update-languages';
import { formField } from '@/components/ui/form-field';

const addSchema = z.object({ tag: languageTagSchema });
type AddInput = z.input<typeof addSchema>;

type Props = {
  teamId: string;
  studyId: string;
  view: StudyTextsView;
  canEdit: boolean;
  selected: string | null;
  onSelect: (lang: string) => void;
};

/** The study's languages: the source first, each with how many texts it lacks. */
export function LanguagesCard({ teamId, studyId, view, canEdit, selected, onSelect }: Props) {
  const update = useUpdateLanguages(teamId, studyId);
  const { confirm, dialog } = useConfirm();
  const form = useForm<AddInput>({ resolver: zodResolver(addSchema), defaultValues: { tag: '' } });
  const editable = canEdit && view.editable;

  const add = form.handleSubmit(async ({ tag }) => {
    const canonical = languageTagSchema.parse(tag);
    if (view.languages.includes(canonical))
      return form.setError('tag', { message: `${languageName(canonical)} is already listed` });
    try {
      await update.mutateAsync([...view.languages, canonical]);
      form.reset({ tag: '' });
      onSelect(canonical);
    } catch (err) {
      if (err instanceof ApiError && err.fields.length)
        form.setError('tag', { message: err.fields[0].message });
      else applyFieldErrors(err, form.setError);
    }
  });

  const remove = async (lang: string) => {
    const count = Object.keys(view.translations[lang] ?? {}).length;
    const ok = await confirm({
      title: `Remove ${languageName(lang)}?`,
      body: `Respondents will no longer be able to answer in it${count ? `, and its ${count} translated texts are deleted` : ''}.`,
      confirmLabel: 'Remove the language',
      danger: true,
    });
    if (ok) await update.mutateAsync(view.languages.filter((l) => l !== lang));
  };

  return (
    <Card title="Languages">
      {dialog}
      <p className="mb-3 text-sm text-ink-soft">
        Respondents answer in one of these languages: they choose it on the first screen, or the
        link sets it with <code className="font-mono">?lang=</code>. The first is the language the
        study is written in; every other one needs all texts before the study can go live.
      </p>
      <ul className="divide-y divide-line rounded-md border border-line">
        {view.languages.map((lang, i) => {
          const missing = view.missing[lang] ?? 0;
          const stale = Object.keys(view.stale[lang] ?? {}).length;
          return (
            <li key={lang} className="flex flex-wrap items-center gap-2 px-3 py-2">
              <span
                className="min-w-0 basis-full font-medium text-ink sm:basis-0 sm:flex-1"
                lang={lang}
              >
                {languageName(lang)}
              </span>
              {i === 0 && <Badge tone="primary">source</Badge>}
              {missing > 0 ? (
                <Badge tone="accent">{missing} missing</Badge>
              ) : (
                <Badge>all texts</Badge>
              )}
              {stale > 0 && <Badge tone="accent">{stale} source changed</Badge>}
              <Button
                size="sm"
                variant={selected === lang ? 'primary' : 'secondary'}
                aria-pressed={selected === lang}
                onClick={() => onSelect(lang)}
              >
                Texts<span className="sr-only"> in {languageName(lang)}</span>
              </Button>
              {editable && i > 0 && (
                <Button size="sm" variant="ghost" onClick={() => void remove(lang)}>
                  Remove<span className="sr-only"> {languageName(lang)}</span>
                </Button>
              )}
            </li>
          );
        })}
      </ul>
      {editable ? (
        <form onSubmit={add} className="mt-4 flex flex-wrap items-end gap-2" noValidate>
          <TextField
            label="Add a language"
            hint="A language tag (BCP 47), such as de, fr-CA, pt-BR or ar."
            wrapperClassName="min-w-0 flex-1"
            autoComplete="off"
            {...formField(form, 'tag')}
          />
          <Button type="submit" busy={update.isPending} className="mb-5">
            Add
          </Button>
        </form>
      ) : (
        !view.editable && (
          <Alert tone="info" className="mt-4">
            Languages and texts are frozen while the study is live or closed.
          </Alert>
        )
      )}
    </Card>
  );
}
