/**
 * What the phone is sent besides the respondent's screens (the study's name and languages,
 * the app's words, the attributes, the end page), and the session reply as JSON text.
 *
 * Those parts come from the frozen version alone (or the version and the respondent's
 * attribute order), and a version never changes: so they are built once per version object
 * and their JSON is written once, then reused by every session start (sessionJson). A start
 * serialised the app's words and the attributes again each time (bench:session-start profile).
 * Parts shared this way are never modified; the Preview's draft versions are new objects each
 * time, so nothing of a draft is kept past its own request.
 */
import type { Questionnaire } from '../../shared/schemas/questionnaire';
import type {
  RespondentPlan,
  RespondentScreen,
  RespondentSession,
  SurveyView,
} from '../../shared/schemas/respondent';
import type { StudyDefinition } from '../../shared/schemas/study-definition';
import { englishInterfaceTexts } from '../../shared/languages/interface-texts';
import { nativeLanguageName, textDirection } from '../../shared/languages/language-tags';
import { buildScreens, pick, type FrozenVersion } from './respondent-screens';

/** JSON text of objects that never change, written at their first serialisation. */
const frozenJson = new WeakMap<object, string | null>();

function frozenPart<T extends object>(value: T): T {
  if (!frozenJson.has(value)) frozenJson.set(value, null);
  return value;
}

type VersionParts = Pick<SurveyView, 'languages' | 'end' | 'back'> & {
  /** The attributes in the definition's own order (respondents without an attribute order). */
  definition: SurveyView['definition'];
};
const partsOfVersion = new WeakMap<FrozenVersion, VersionParts>();

function versionParts(version: FrozenVersion): VersionParts {
  let parts = partsOfVersion.get(version);
  if (parts) return parts;
  const { attributes, alternatives, fixedAlternative } = version.definition;
  parts = {
    languages: frozenPart(
      (version.languages ?? ['en']).map((tag) => ({
        tag,
        name: nativeLanguageName(tag),
        dir: textDirection(tag),
      })),
    ),
    definition: frozenPart({ attributes, alternatives, fixedAlternative }),
    end: frozenPart(endPageOf(version.questionnaire)),
    back: frozenPart(pick(version.questionnaire.options, 'allowBack', 'backOnTasks')),
  };
  partsOfVersion.set(version, parts);
  return parts;
}

/**
 * Everything a respondent's screens are built from: the one path for live sessions and the
 * Preview section, so the preview cannot differ from what respondents see.
 */
export function buildSurveyView(
  version: FrozenVersion,
  plan: RespondentPlan,
  studyName: string,
  /** The plan's screens when the caller already holds them (the per-respondent cache). */
  screens: RespondentScreen[] = buildScreens(version, plan),
): SurveyView {
  const parts = versionParts(version);
  const languages = version.languages ?? ['en'];
  const language = version.language ?? languages[0];
  return {
    studyName,
    language,
    dir: textDirection(language),
    languages: parts.languages,
    ui: frozenPart(version.ui ?? englishInterfaceTexts),
    definition: plan.attributeOrder
      ? { ...parts.definition, attributes: attributesInOrder(version.definition, plan) }
      : parts.definition,
    screens,
    end: parts.end,
    back: parts.back,
  };
}

/** The attributes as this respondent sees them: the plan's order when it has one. */
function attributesInOrder(definition: StudyDefinition, plan: RespondentPlan) {
  const order = plan.attributeOrder;
  if (!order) return definition.attributes;
  const byId = new Map(definition.attributes.map((a) => [a.id, a]));
  // An attribute missing from the stored order (never expected: versions are frozen) keeps
  // its place at the end rather than vanishing from the respondent's cards.
  const listed = order.flatMap((id) => (byId.has(id) ? [byId.get(id)!] : []));
  return [...listed, ...definition.attributes.filter((a) => !order.includes(a.id))];
}

export function endPageOf(questionnaire: Questionnaire): { title: string; body: string } {
  const end = questionnaire.pages.find((p) => p.kind === 'end');
  return end && end.kind === 'end'
    ? { title: end.title, body: end.body }
    : { title: 'Thank you', body: 'Your answers have been saved.' };
}

/**
 * The session as JSON, exactly as JSON.stringify writes it: its version's parts as written
 * the first time, the rest (the screens, the answers) as they are now.
 */
export function sessionJson(session: RespondentSession): string {
  let out = '';
  for (const [key, value] of Object.entries(session)) {
    if (value === undefined) continue;
    let text: string | null | undefined = null;
    if (value !== null && typeof value === 'object') {
      text = frozenJson.get(value);
      if (text === null) frozenJson.set(value, (text = JSON.stringify(value)));
    }
    out += `${out ? ',' : '{'}${JSON.stringify(key)}:${text ?? JSON.stringify(value)}`;
  }
  return out ? `${out}}` : '{}';
}
