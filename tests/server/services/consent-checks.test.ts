import { describe, expect, it } from 'vitest';
import { checkConsentIdentifiability } from '../../../server/services/consent-checks';
import { defaultQuestionnaire } from '../../../shared/schemas/questionnaire-defaults';
import { demoDefinition } from '../../../server/seed/demo-definition';

const q = defaultQuestionnaire(demoDefinition);
const withConsent = (body: string) => ({
  ...q,
  pages: q.pages.map((p) => (p.kind === 'consent' ? { ...p, body } : p)),
});

describe('checkConsentIdentifiability', () => {
  it('the default consent says that names are not asked for', () => {
    const consent = q.pages[0];
    expect(consent.kind === 'consent' && consent.body).toContain('We do not ask for your name');
  });

  it('asks nothing more of an anonymous link', () => {
    expect(checkConsentIdentifiability(q, { personalLinks: false, panelIds: false })).toEqual([]);
  });

  it('with personal links, requires the consent to say answers are linked to the person', () => {
    const problems = checkConsentIdentifiability(q, { personalLinks: true, panelIds: false });
    expect(problems).toEqual([
      expect.objectContaining({
        code: 'consent_identifiable',
        path: 'questionnaire.pages.0',
        message: expect.stringContaining('personal links'),
      }),
    ]);
    const fixed = withConsent(
      'We do not ask for your name. Your answers are linked to the personal link we e-mailed you.',
    );
    expect(checkConsentIdentifiability(fixed, { personalLinks: true, panelIds: false })).toEqual(
      [],
    );
  });

  it('with panel ids sent back to a panel, requires the same', () => {
    const problems = checkConsentIdentifiability(q, { personalLinks: false, panelIds: true });
    expect(problems[0].message).toContain('panel id');
  });
});
