/**
 * Per-process indexes of what never changes once a study is live: which questionnaire page a
 * screen key belongs to (per frozen version) and each respondent's built screens (their
 * version and plan are fixed when the session starts). The answer path reads these instead
 * of rebuilding the questionnaire on every answer.
 */
import {
  respondentPlanSchema,
  type RespondentPlan,
  type RespondentScreen,
} from '../../shared/schemas/respondent';
import { screenKeys, type QuestionnairePage } from '../../shared/schemas/questionnaire';
import { buildScreens, type FrozenVersion } from './respondent-screens';

/** The questionnaire page behind a screen key (not the design tasks), indexed once per version. */
const pageIndex = new WeakMap<FrozenVersion, Map<string, QuestionnairePage>>();

function screenKeyOfPage(p: QuestionnairePage): string | null {
  switch (p.kind) {
    case 'consent':
      return screenKeys.consent();
    case 'question':
    case 'screening':
      return screenKeys.question(p.question.key);
    case 'instructions':
      return screenKeys.instructions(p.id);
    case 'warmup':
    case 'holdout':
    case 'repeat':
    case 'dominance':
      return screenKeys.special(p.kind, p.id);
    default:
      return null;
  }
}

export function pageOfScreen(
  version: FrozenVersion,
  screenKey: string,
): QuestionnairePage | undefined {
  let index = pageIndex.get(version);
  if (!index) {
    index = new Map();
    for (const p of version.questionnaire.pages) {
      const key = screenKeyOfPage(p);
      // The first page wins, as a linear search would.
      if (key !== null && !index.has(key)) index.set(key, p);
    }
    pageIndex.set(version, index);
  }
  return index.get(screenKey);
}

/**
 * A respondent's screens, built once from their stored plan and then kept (least recently
 * used first out): every answer of theirs needs them, and neither version nor plan changes.
 */
const screensCache = new Map<
  string,
  { versionId: string; screens: RespondentScreen[]; plan: RespondentPlan }
>();
const SCREENS_CACHE_LIMIT = 2_000;

export function screensOfRespondent(
  version: FrozenVersion,
  respondent: { id: string; versionId: string; plan: unknown },
  /** The plan this process has just built for a new respondent: not checked again. */
  builtPlan?: RespondentPlan,
): { screens: RespondentScreen[]; plan: RespondentPlan } {
  const hit = screensCache.get(respondent.id);
  if (hit && hit.versionId === version.id) {
    screensCache.delete(respondent.id);
    screensCache.set(respondent.id, hit);
    return hit;
  }
  // A stored plan is read back from jsonb and checked; one built here is checked by its type.
  const plan = builtPlan ?? respondentPlanSchema.parse(respondent.plan);
  const entry = { versionId: version.id, screens: buildScreens(version, plan), plan };
  if (screensCache.size >= SCREENS_CACHE_LIMIT)
    screensCache.delete(screensCache.keys().next().value!);
  screensCache.set(respondent.id, entry);
  return entry;
}
