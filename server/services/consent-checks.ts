/**
 * What the consent page must say when answers can be traced to a person. The default consent
 * says "We do not ask for your name"; a study that sends personal links, or receives a panel's
 * pass-through id and sends respondents back to the panel, links answers to an e-mail address
 * or a panel member, and informed consent has to say so (docs/methods.md, "Consent and
 * identifiability").
 */
import type { Questionnaire } from '../../shared/schemas/questionnaire';
import type { ReadinessProblem } from '../../shared/schemas/study-lifecycle';

/** Words that show the consent text speaks about linking answers to the person. */
const MENTIONS_LINKING = /\b(linked|link|identif\w*|trace\w*|e-?mail|panel)\b/i;

export type Identifiability = { personalLinks: boolean; panelIds: boolean };

export function checkConsentIdentifiability(
  questionnaire: Questionnaire,
  identifiability: Identifiability,
): ReadinessProblem[] {
  if (!identifiability.personalLinks && !identifiability.panelIds) return [];
  const at = questionnaire.pages.findIndex((p) => p.kind === 'consent');
  const consent = questionnaire.pages[at];
  if (!consent || consent.kind !== 'consent' || MENTIONS_LINKING.test(consent.body)) return [];
  const how = identifiability.personalLinks
    ? 'personal links (each invitee’s e-mail address)'
    : 'the panel id passed in the link';
  return [
    {
      code: 'consent_identifiable',
      path: `questionnaire.pages.${at}`,
      message: `Answers can be traced to the person through ${how}. Say so on the consent page, for example: "Your answers are linked to the personal link or panel id you arrived with."`,
    },
  ];
}
