import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Alert, Card } from '@/components/ui/feedback';
import { CheckboxField } from '@/components/ui/checkbox-field';
import { ApiError } from '@/lib/api-client';
import { ErrorText } from '@/components/ui/error-boundary';
import { languageName, textDirection } from '@shared/languages/language-tags';
import type { StudyTextsView } from '@shared/schemas/study-texts';
import { useSaveTranslations } from '../api/save-translations';
import { useConfirmTranslations } from '../api/confirm-translations';
import { StaleNote } from './stale-note';

type Props = {
  teamId: string;
  studyId: string;
  view: StudyTextsView;
  lang: string;
  canEdit: boolean;
};
type Values = { values: string[] };

const isInterface = (key: string) => key.startsWith('ui.');

/**
 * Every text of the study beside its source wording, with one field per text in the chosen
 * language. In the source language only the survey app's own words are edited here; the
 * study's texts are written on Attributes and Questionnaire.
 */
export function TranslationTable({ teamId, studyId, view, lang, canEdit }: Props) {
  const save = useSaveTranslations(teamId, studyId);
  const source = view.languages[0];
  const isSource = lang === source;
  const own = view.translations[lang] ?? {};
  const initial = useMemo(
    () => view.texts.map((t) => own[t.key] ?? ''),
    // Reset only when another language or another text list comes in.
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [lang, view],
  );
  // A new view (a save, an import, a confirmation) keeps what the user is still typing.
  const form = useForm<Values>({
    values: { values: initial },
    resetOptions: { keepDirtyValues: true },
  });
  const [onlyMissing, setOnlyMissing] = useState(false);
  const [saved, setSaved] = useState(false);
  const editable = canEdit && view.editable;
  const dir = textDirection(lang);
  const missing = view.missing[lang] ?? 0;
  const stale = view.stale[lang] ?? {};
  const staleKeys = Object.keys(stale);
  const confirm = useConfirmTranslations(teamId, studyId);
  const confirmKeys = (keys: string[]) => {
    setSaved(false);
    confirm.mutate({ lang, keys });
  };

  const submit = form.handleSubmit(async ({ values }) => {
    setSaved(false);
    const texts: Record<string, string> = {};
    view.texts.forEach((t, i) => {
      if (values[i] !== initial[i]) texts[t.key] = values[i];
    });
    if (Object.keys(texts).length === 0) return;
    try {
      await save.mutateAsync({ lang, texts });
      setSaved(true);
    } catch (err) {
      if (!(err instanceof ApiError)) throw err;
      const rowOf = new Map(view.texts.map((t, i) => [`texts.${t.key}`, i]));
      for (const f of err.fields) {
        const i = rowOf.get(f.path);
        if (i !== undefined) form.setError(`values.${i}`, { message: f.message });
      }
      form.setError('root', { message: err.message });
    }
  });

  return (
    <Card
      title={`Texts in ${languageName(lang)}`}
      actions={
        <CheckboxField
          label="Only texts to write or check"
          checked={onlyMissing}
          onChange={setOnlyMissing}
        />
      }
    >
      <p className="mb-4 text-sm text-ink-soft">
        {isSource
          ? 'This is the language the study is written in. Its texts are edited on Attributes and Questionnaire; here you can reword the survey app’s own buttons and messages.'
          : missing > 0
            ? `${missing} of ${view.texts.length} texts still need a wording in ${languageName(lang)}.`
            : `Every text has a wording in ${languageName(lang)}.`}
        {staleKeys.length > 0 &&
          ` ${staleKeys.length} ${staleKeys.length === 1 ? 'translation was' : 'translations were'} made from an earlier source wording (marked “Source changed”): rewrite and save them, or confirm they still hold.`}
      </p>
      {editable && staleKeys.length > 1 && (
        <Button
          size="sm"
          variant="secondary"
          className="mb-4"
          busy={confirm.isPending}
          onClick={() => confirmKeys(staleKeys)}
        >
          All {staleKeys.length} are still right
        </Button>
      )}
      {confirm.error && <ErrorText error={confirm.error} />}
      <form onSubmit={submit} noValidate>
        <ol className="divide-y divide-line rounded-md border border-line">
          {view.texts.map((t, i) => {
            const sourceOnly = isSource && !isInterface(t.key);
            const hasText =
              sourceOnly ||
              (isSource && t.source !== '') ||
              (form.watch(`values.${i}`) ?? '').trim() !== '';
            const previous = stale[t.key];
            const error = form.formState.errors.values?.[i]?.message;
            const id = `text-${i}`;
            return (
              <li
                key={t.key}
                hidden={onlyMissing && hasText && previous === undefined}
                className="grid gap-2 px-3 py-3 md:grid-cols-2 md:gap-4"
              >
                <div className="min-w-0">
                  <p className="text-xs font-medium text-ink-muted">{t.where}</p>
                  <p className="break-words font-mono text-[11px] text-ink-muted">{t.key}</p>
                  <p
                    className="mt-1 whitespace-pre-line break-words text-sm text-ink"
                    lang={source}
                  >
                    {t.source || <span className="italic text-ink-muted">(no source wording)</span>}
                  </p>
                  {previous !== undefined && (
                    <StaleNote
                      previous={previous}
                      where={t.where}
                      canConfirm={editable}
                      busy={confirm.isPending}
                      onConfirm={() => confirmKeys([t.key])}
                    />
                  )}
                </div>
                {!sourceOnly && (
                  <div className="min-w-0">
                    <label htmlFor={id} className="sr-only">
                      {languageName(lang)}: {t.where}
                    </label>
                    {(() => {
                      const field = form.register(`values.${i}`);
                      const common = {
                        id,
                        lang,
                        dir,
                        disabled: !editable,
                        'aria-invalid': error ? true : undefined,
                        placeholder: isSource ? t.source : `${languageName(lang)} wording`,
                        className:
                          'block w-full rounded-md border border-line bg-white px-3 py-2 text-sm text-ink placeholder:text-ink-muted focus:border-primary focus:outline-none focus:ring-2 focus:ring-primary/20 aria-[invalid=true]:border-danger disabled:bg-canvas',
                      };
                      return t.long ? (
                        <textarea rows={3} {...common} {...field} />
                      ) : (
                        <input {...common} {...field} />
                      );
                    })()}
                    {error && (
                      <p role="alert" className="mt-1 text-xs font-medium text-danger">
                        {error}
                      </p>
                    )}
                  </div>
                )}
              </li>
            );
          })}
        </ol>
        {form.formState.errors.root && (
          <Alert tone="danger" className="mt-3">
            {form.formState.errors.root.message}
          </Alert>
        )}
        {saved && !form.formState.isDirty && (
          <Alert tone="success" className="mt-3">
            Saved.
          </Alert>
        )}
        {editable && (
          <div className="sticky bottom-0 mt-4 flex justify-end border-t border-line bg-white/95 py-3">
            <Button type="submit" busy={save.isPending}>
              Save {languageName(lang)} texts
            </Button>
          </div>
        )}
      </form>
    </Card>
  );
}
