/**
 * Writing one language's translations: the form's save, the file import and the translator's
 * "still right" confirmation. Each is checked whole first (all or nothing), records the source
 * wording each translation was made from (so a later change of the source flags it as stale),
 * and leaves an audit entry in the same transaction.
 */
import type { AppDeps } from '../../deps';
import { ValidationError, type FieldIssue } from '../../lib/errors';
import { languageName } from '../../../shared/languages/language-tags';
import { isInterfaceKey, textIn } from '../../../shared/languages/study-texts';
import type { StudyTextsView } from '../../../shared/schemas/study-texts';
import type { AuditAction } from '../../../shared/schemas/audit';
import { updateDraftLanguages } from '../../../db/queries/versions';
import { recordAudit } from '../audit';
import { assertDraft, loadDraftStudy } from '../studies';
import { loadStudy } from '../study-access';
import { getStudyTexts, languagesOf, listCurrentStudyTexts } from '../study-texts';
import type { Actor } from '../actor';

type StudyRow = Awaited<ReturnType<typeof loadStudy>>;
/** What the audit entry says: the action and its details beyond the study and language. */
export type TranslationEvent = { action: AuditAction; details: Record<string, unknown> };

/**
 * Checks texts for one language against the study's keys: unknown keys, and source-language
 * texts that belong in the documents (the source language holds only the app's words).
 */
export function checkTranslationKeys(
  keys: Iterable<string>,
  known: Set<string>,
  isSource: boolean,
  prefix = 'texts',
): FieldIssue[] {
  const issues: FieldIssue[] = [];
  for (const key of keys) {
    if (!known.has(key))
      issues.push({ path: `${prefix}.${key}`, message: `${key} is not a text of this study` });
    else if (isSource && !isInterfaceKey(key))
      issues.push({
        path: `${prefix}.${key}`,
        message: `${key} is written in the source language on Attributes or Questionnaire`,
      });
  }
  return issues;
}

function assertLanguage(study: StudyRow, lang: string) {
  if (!study.languages.includes(lang))
    throw new ValidationError(`${languageName(lang)} is not a language of this study`, [
      { path: 'lang', message: `Add ${languageName(lang)} to the study's languages first` },
    ]);
}

/** Saves texts of one language (an empty text removes it); nothing is saved on any problem. */
export async function saveTranslations(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  lang: string,
  texts: Record<string, string>,
): Promise<StudyTextsView> {
  const { teamId } = actor;
  const study = await loadDraftStudy(deps, teamId, studyId, 'its texts');
  const values = Object.values(texts);
  await writeTranslations(deps, study, lang, texts, actor, {
    action: 'study.translations_saved',
    details: {
      saved: values.filter((v) => v.trim()).length,
      removed: values.filter((v) => !v.trim()).length,
    },
  });
  return getStudyTexts(deps, teamId, studyId);
}

/** The shared write of the form and the file import: validated first, all or nothing. */
export async function writeTranslations(
  deps: AppDeps,
  study: StudyRow,
  lang: string,
  texts: Record<string, string>,
  actor: Actor,
  event: TranslationEvent,
): Promise<void> {
  assertLanguage(study, lang);
  const entries = await listCurrentStudyTexts(deps, study);
  const isSource = lang === study.languages[0];
  const issues = checkTranslationKeys(
    Object.keys(texts),
    new Set(entries.map((e) => e.key)),
    isSource,
  );
  if (issues.length) throw new ValidationError(issues[0].message, issues);
  const sourceOf = new Map(entries.map((e) => [e.key, e.source]));
  const next = { ...(study.translations[lang] ?? {}) };
  const made = { ...(study.translationSources[lang] ?? {}) };
  for (const [key, text] of Object.entries(texts)) {
    const value = text.trim();
    if (value) next[key] = value;
    else delete next[key];
    // The source language's own wordings are not translations of anything.
    if (value && !isSource) made[key] = sourceOf.get(key) ?? '';
    else delete made[key];
  }
  await writeLanguage(deps, study, lang, next, made, actor, event);
}

/**
 * The translator has checked translations whose source wording changed and they still hold:
 * they are recorded as made from the current source, and no longer flagged.
 */
export async function confirmTranslations(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  lang: string,
  keys: string[],
): Promise<StudyTextsView> {
  const { teamId } = actor;
  const study = await loadDraftStudy(deps, teamId, studyId, 'its texts');
  assertLanguage(study, lang);
  if (lang === study.languages[0])
    throw new ValidationError('The source language has no translations to confirm', [
      { path: 'lang', message: `${languageName(lang)} is the language the study is written in` },
    ]);
  const langs = languagesOf(study);
  const entries = new Map((await listCurrentStudyTexts(deps, study)).map((e) => [e.key, e]));
  const issues: FieldIssue[] = [];
  keys.forEach((key, i) => {
    const entry = entries.get(key);
    if (!entry) issues.push({ path: `keys.${i}`, message: `${key} is not a text of this study` });
    else if (!textIn(entry, lang, langs))
      issues.push({
        path: `keys.${i}`,
        message: `${key} has no ${languageName(lang)} text to confirm: write one instead`,
      });
  });
  if (issues.length) throw new ValidationError(issues[0].message, issues);
  const made = { ...(study.translationSources[lang] ?? {}) };
  for (const key of keys) made[key] = entries.get(key)!.source;
  await writeLanguage(deps, study, lang, study.translations[lang] ?? {}, made, actor, {
    action: 'study.translations_confirmed',
    details: { texts: keys.length },
  });
  return getStudyTexts(deps, teamId, studyId);
}

/** One language's texts and sources, written to the draft with the audit entry. */
async function writeLanguage(
  deps: AppDeps,
  study: StudyRow,
  lang: string,
  texts: Record<string, string>,
  made: Record<string, string>,
  actor: Actor,
  event: TranslationEvent,
) {
  await deps.db.transaction(async (tx) => {
    const updated = await updateDraftLanguages(tx, {
      id: study.id,
      teamId: study.teamId,
      languages: study.languages,
      translations: { ...study.translations, [lang]: texts },
      translationSources: { ...study.translationSources, [lang]: made },
    });
    if (!updated) assertDraft({ status: 'live' }, 'its texts');
    await recordAudit(tx, {
      teamId: study.teamId,
      studyId: study.id,
      actor,
      action: event.action,
      details: { study: study.name, language: lang, ...event.details },
    });
  });
}
