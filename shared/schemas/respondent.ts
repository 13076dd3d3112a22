/**
 * The respondent API (/api/r/:publicId/...): starting or resuming a session, the screens a
 * respondent walks through, and the answers they send. Respondents have no account; a secret
 * session token (header X-Respondent-Token) reaches only their own session.
 */
import { z } from 'zod';
import type { CertaintyScale, Question, ShowIf } from './questionnaire';
import type { StudyDefinition } from './study-definition';
import type { BackOptions } from '../survey/going-back';
import type { InterfaceTexts } from '../languages/interface-texts';
import { languageTagSchema } from './study-texts';

export { RESPONDENT_TOKEN_HEADER } from '../respondent-token-header';

export const publicIdParamsSchema = z.object({
  publicId: z.string().regex(/^[A-Za-z0-9_-]{6,40}$/, 'Unknown survey'),
});

export const sessionTokenSchema = z.string().regex(/^[A-Za-z0-9_-]{20,80}$/, 'Unknown session');

export const startSessionSchema = z.object({
  /** A token this browser holds from an earlier visit: resumes that session when it is valid. */
  sessionToken: sessionTokenSchema.optional(),
  /** The link's query parameters (personal link token, panel id). */
  params: z
    .record(z.string().max(40), z.string().max(200))
    .refine((p) => Object.keys(p).length <= 20, 'Too many link parameters')
    .default({}),
  device: z.string().max(200).default(''),
});
export type StartSessionInput = z.input<typeof startSessionSchema>;

/**
 * The generator new respondent plans are drawn with (docs/methods.md "Plan generator
 * versions"): 2 is xoshiro128** with unbiased integers; a stored plan without a version was
 * drawn by version 1 (sfc32), and its seed rebuilds it only with that generator.
 */
export type PlanGeneratorVersion = 1 | 2;
export const PLAN_GENERATOR_VERSION: PlanGeneratorVersion = 2;

/** Per-respondent randomisation, stored in respondents.plan so every screen is reproducible. */
export const respondentPlanSchema = z.object({
  seed: z.number().int(),
  /** The generator the seed was drawn with; absent in plans made by version 1. */
  generatorVersion: z.number().int().min(2).optional(),
  block: z.number().int().min(1),
  /** Design task numbers in the order this respondent sees them. */
  taskOrder: z.array(z.number().int().min(1)),
  /**
   * Screen key -> alternatives in display order: positions[key][p] is the alternative shown at
   * position p (designed alternatives 0..J-1; -1 is the opt-out / status quo).
   */
  positions: z.record(z.string(), z.array(z.number().int().min(-1))),
  /**
   * Attribute ids in the order this respondent sees them on every task, when the questionnaire
   * randomises attribute order; absent means the order of the study definition.
   */
  attributeOrder: z.array(z.string()).optional(),
});
export type RespondentPlan = z.infer<typeof respondentPlanSchema>;

export const answerValueSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('consent'), agreed: z.literal(true) }),
  /** Instructions pages: the respondent read them and went on. */
  z.object({ kind: z.literal('ack') }),
  z.object({ kind: z.literal('single'), optionId: z.string().max(40).nullable() }),
  z.object({ kind: z.literal('multiple'), optionIds: z.array(z.string().max(40)).max(30) }),
  z.object({ kind: z.literal('number'), number: z.number().finite().nullable() }),
  z.object({ kind: z.literal('text'), text: z.string().max(2000) }),
  /** A page whose skip rule did not match: gone past, not asked (shared/survey/skip-logic.ts). */
  z.object({ kind: z.literal('skipped') }),
  /**
   * Choice tasks: the on-screen position (0-based) of the chosen card, and the answer to the
   * certainty question when the task asks one (1 = least sure).
   */
  z.object({
    kind: z.literal('choice'),
    position: z.number().int().min(0).max(5),
    certainty: z.number().int().min(1).max(10).optional(),
  }),
]);
export type AnswerValue = z.infer<typeof answerValueSchema>;

export const submitAnswerSchema = z.object({
  /** Made by the client (crypto.randomUUID); a retry with the same id never creates a second row. */
  clientId: z
    .string()
    .regex(/^[A-Za-z0-9_-]{8,64}$/, 'A client id of 8-64 letters, digits, _ or -'),
  screenKey: z.string().min(1).max(80),
  value: answerValueSchema,
  /** Time from the screen being shown to the answer. */
  responseMs: z
    .number()
    .int()
    .min(0)
    .max(24 * 3600 * 1000),
  /**
   * How long ago, by the phone's own clock, the answer was given (it may have waited in the
   * phone's outbox). A difference of two readings of one clock, so a wrong phone clock does
   * not matter; the server subtracts it from the arrival time to tell answers given before a
   * close from answers given after it.
   */
  ageMs: z
    .number()
    .int()
    .min(0)
    .max(60 * 24 * 3600 * 1000)
    .optional(),
});
export type SubmitAnswerInput = z.input<typeof submitAnswerSchema>;

/** One alternative as shown: designed (index in the design task) or the fixed opt-out / status quo. */
export type DisplayAlternative = {
  /** Design index 0..J-1, or -1 for the opt-out / status quo. */
  index: number;
  label: string;
  /** attribute id -> level id; empty for an opt-out. */
  levels: Record<string, string>;
  fixed: boolean;
};

export type TaskKind = 'design' | 'warmup' | 'holdout' | 'repeat' | 'dominance';

export type RespondentScreen =
  | { key: string; kind: 'consent'; title: string; body: string; agreeLabel: string }
  | { key: string; kind: 'instructions'; title: string; body: string; showIf?: ShowIf }
  | {
      key: string;
      kind: 'question';
      question: Question;
      screening: boolean;
      showIf?: ShowIf;
      /** A later page's skip rule reads this answer, so it stands once given (no Back). */
      decidesSkips?: true;
    }
  | {
      key: string;
      kind: 'task';
      taskKind: TaskKind;
      title: string;
      /** 1-based count among the task screens, and how many there are. */
      taskIndex: number;
      taskCount: number;
      alternatives: DisplayAlternative[];
      /** Design tasks of a questionnaire that asks it: the certainty question under the cards. */
      certainty?: CertaintyScale;
    };

export type RespondentStatus = 'in_progress' | 'completed' | 'screened_out' | 'over_quota';

/** A language the respondent may answer in, named in itself ("Deutsch", "العربية"). */
export type SurveyLanguage = { tag: string; name: string; dir: 'ltr' | 'rtl' };

/** The respondent's choice of language on the first screen (before any answer). */
export const chooseLanguageSchema = z.object({ language: languageTagSchema });

/** What the respondent app needs to walk through the whole questionnaire, even offline. */
export type RespondentSession = {
  sessionToken: string;
  /** The study's public title (never its internal name). */
  studyName: string;
  /** The language of every text below, its direction, the study's languages and the app's words. */
  language: string;
  dir: 'ltr' | 'rtl';
  languages: SurveyLanguage[];
  ui: InterfaceTexts;
  status: RespondentStatus;
  definition: Pick<StudyDefinition, 'attributes' | 'alternatives' | 'fixedAlternative'>;
  screens: RespondentScreen[];
  /** Keys of the screens already answered, in order. */
  answered: string[];
  end: { title: string; body: string };
  /** Where to send the respondent when they finish (panel redirects), or null. */
  redirectUrl: string | null;
  /** False once the survey has closed: the app shows a closed page instead of the next screen. */
  surveyOpen: boolean;
  /** Where Back may lead (shared/survey/going-back.ts). */
  back: BackOptions;
  /**
   * The current answers of the screens Back may lead to, by screen key, so a screen seen again
   * shows what was chosen (also after a resume on another device).
   */
  given: Record<string, AnswerValue>;
};

/** What a respondent's screens are built from: the same for a live session and the Preview. */
export type SurveyView = Pick<
  RespondentSession,
  'studyName' | 'definition' | 'screens' | 'end' | 'back' | 'language' | 'dir' | 'languages' | 'ui'
>;

/** The Preview section: the study as one respondent of a block (seed) would walk through it. */
export type StudyPreview = {
  block: number;
  blocks: number;
  seed: number;
  /** False while the questionnaire is the default one (never saved). */
  questionnaireSaved: boolean;
  survey: SurveyView;
};

export const studyPreviewQuerySchema = z.object({
  block: z.coerce.number().int().min(1).max(50).default(1),
  seed: z.coerce.number().int().min(0).max(2147483647).default(1),
  /** One of the study's languages; the source language when absent. */
  lang: languageTagSchema.optional(),
});

export type AnswerReceipt = {
  screenKey: string;
  /** The screen to show next, or null when the questionnaire is over. */
  nextScreenKey: string | null;
  status: RespondentStatus;
  redirectUrl: string | null;
  /** True when this answer was already stored (a retry); nothing new was written. */
  replay: boolean;
};

/** What a link shows before any session: whether the survey is open. */
export type SurveyLinkState = 'live' | 'closed' | 'over_quota' | 'not_open';
export type SurveyLinkInfo = {
  state: SurveyLinkState;
  /** Hidden unless the survey is or was live (in the page's language). */
  studyName: string | null;
  /** Over-quota panel redirect, with the panel id filled in. */
  redirectUrl: string | null;
  /**
   * A closed or full survey's page in the language the link asks for (?lang=) when the study
   * offers it, else its source language; null when the survey is live or not open yet.
   */
  page: { language: string; dir: 'ltr' | 'rtl'; title: string; body: string } | null;
};

/** A frozen version's languages and translations (as stored). */
export type StoredLanguages = {
  languages?: string[] | null;
  translations?: Record<string, Record<string, string>> | null;
};
