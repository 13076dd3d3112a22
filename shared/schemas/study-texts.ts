/**
 * The languages of a study and its translated texts: the API's inputs and what it answers.
 * Keys and their meaning: shared/languages/study-text-keys.ts.
 */
import { z } from 'zod';
import { canonicalLanguageTag } from '../languages/language-tags';
import { addIssue } from './add-issue';

/** A BCP 47 tag of a known language, in canonical form ("pt-br" → "pt-BR"). */
export const languageTagSchema = z
  .string()
  .max(35, 'A language tag has at most 35 characters')
  .transform((raw, ctx) => {
    const tag = canonicalLanguageTag(raw);
    if (!tag) {
      ctx.addIssue({
        code: 'custom',
        message: `“${raw}” is not a language tag we know. Use a BCP 47 tag such as de, pt-BR or ar.`,
      });
      return z.NEVER;
    }
    return tag;
  });

export const studyLanguagesSchema = z
  .array(languageTagSchema)
  .min(1, 'A study needs at least one language')
  .max(12, 'At most 12 languages per study')
  .superRefine((tags, ctx) => {
    tags.forEach((t, i) => {
      if (tags.indexOf(t) !== i) addIssue(ctx, [i], `${t} is listed twice`);
    });
  });

/** The first language is the source: the texts written on Attributes and Questionnaire. */
export const updateLanguagesSchema = z.object({ languages: studyLanguagesSchema });
export type UpdateLanguagesInput = z.input<typeof updateLanguagesSchema>;

export const textKeySchema = z
  .string()
  .max(120)
  .regex(/^[a-z]+(\.[A-Za-z0-9_-]+)+$/, 'Not a text key of this study');

/** The longest translated text a field (or a translator's file) may hold. */
export const MAX_TRANSLATION_LENGTH = 6000;
const translationText = z.string().max(MAX_TRANSLATION_LENGTH, 'At most 6,000 characters');

/** Texts of one language by key; an empty text removes the translation. */
export const saveTranslationsSchema = z.object({
  texts: z
    .record(textKeySchema, translationText)
    .refine((t) => Object.keys(t).length > 0, 'Nothing to save')
    .refine((t) => Object.keys(t).length <= 5000, 'At most 5,000 texts at once'),
});
export type SaveTranslationsInput = z.input<typeof saveTranslationsSchema>;

/** Translations checked against a changed source wording and still right. */
export const confirmTranslationsSchema = z.object({
  keys: z
    .array(textKeySchema)
    .min(1, 'Name the texts to confirm')
    .max(5000, 'At most 5,000 texts at once')
    .refine((k) => new Set(k).size === k.length, 'A text is listed twice'),
});
export type ConfirmTranslationsInput = z.input<typeof confirmTranslationsSchema>;

export const languageParamsSchema = z.object({
  teamId: z.uuid(),
  studyId: z.uuid(),
  lang: languageTagSchema,
});

/** As stored in studies.translations and study_versions.translations. */
export const storedTranslationsSchema = z.record(z.string(), z.record(z.string(), z.string()));

export type StudyTextRow = { key: string; where: string; source: string; long: boolean };

/** GET …/texts: every text, its source wording and each language's translation. */
export type StudyTextsView = {
  languages: string[];
  editable: boolean;
  texts: StudyTextRow[];
  /** language → key → text (the source language only holds the app's words, if any). */
  translations: Record<string, Record<string, string>>;
  /** language → how many texts it still lacks. */
  missing: Record<string, number>;
  /**
   * language → key → the source wording its translation was made from, for translations whose
   * source has changed since ("source changed"): re-save or confirm them.
   */
  stale: Record<string, Record<string, string>>;
};

export const translationFormatSchema = z.enum(['xliff', 'csv']);
export type TranslationFormat = z.infer<typeof translationFormatSchema>;

export const exportTranslationsQuerySchema = z.object({
  format: translationFormatSchema.default('xliff'),
});

/** A translator's file, as text (the browser reads it): at most 2 MB. */
export const importTranslationsSchema = z.object({
  format: translationFormatSchema,
  content: z.string().min(1, 'The file is empty').max(2_000_000, 'The file is larger than 2 MB'),
});
export type ImportTranslationsInput = z.input<typeof importTranslationsSchema>;

/** What an import did: texts taken, the study's texts still missing, the file's unknown keys. */
export type TranslationImportReport = {
  imported: number;
  missing: Array<{ key: string; where: string; interface: boolean }>;
  /** Keys the study does not have (a removed page, another study's file), as the file has them. */
  extra: Array<{ key: string; where: string; line: number }>;
};
