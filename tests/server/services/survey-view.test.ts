/**
 * The per-version caches of a session start: task screens built once per version, page, task
 * and on-screen order, and the version's parts of the reply serialised once. What a cache
 * returns must be exactly what a fresh build returns: a fresh build here is one from a deep
 * copy of the version (a new object, so no cache of the first applies).
 */
import { describe, expect, it } from 'vitest';
import { createRespondentPlan } from '../../../server/services/respondent-plan';
import { buildScreens, type FrozenVersion } from '../../../server/services/respondent-screens';
import { buildSurveyView, sessionJson } from '../../../server/services/survey-view';
import type { Questionnaire } from '../../../shared/schemas/questionnaire';
import type { RespondentSession } from '../../../shared/schemas/respondent';
import { definition, design, fullQuestionnaire } from '../routes/respond-fixtures';

const versionOf = (options: Partial<Questionnaire['options']> = {}): FrozenVersion => {
  const q = fullQuestionnaire();
  return {
    id: 'v',
    studyId: 's',
    version: 1,
    definition,
    design,
    questionnaire: { ...q, options: { ...q.options, ...options } },
  };
};

const planOf = (version: FrozenVersion, block: number, seed: number) =>
  createRespondentPlan({ ...version, block, seed });

/** A session reply as startSession shapes it around a survey view. */
const sessionOf = (version: FrozenVersion, seed: number, block = 1): RespondentSession => {
  const view = buildSurveyView(version, planOf(version, block, seed), 'Water services 2026');
  return {
    sessionToken: `token-${seed}`,
    ...view,
    status: 'in_progress',
    answered: [],
    redirectUrl: null,
    surveyOpen: true,
    given: {},
  };
};

describe('buildScreens (task screens kept per version)', () => {
  it('gives every respondent what a fresh build of the same plan gives', () => {
    const version = versionOf();
    for (let seed = 1; seed <= 30; seed++) {
      const plan = planOf(version, 1 + (seed % 2), seed);
      const fresh = buildScreens(structuredClone(version), plan);
      expect(buildScreens(version, plan)).toEqual(fresh);
      // Built twice on the same version (the second from the cache): still the same.
      expect(buildScreens(version, plan)).toEqual(fresh);
    }
  });

  it("gives a respondent of another block that block's own tasks", () => {
    const version = versionOf();
    const keys = (block: number) =>
      buildScreens(version, planOf(version, block, 5))
        .filter((s) => s.kind === 'task')
        .map((s) => s.key)
        .sort();
    // The fixture's design: tasks 1 and 2 in block 1, tasks 3 and 4 in block 2.
    expect(keys(1)).toEqual(['task:1', 'task:2']);
    expect(keys(2)).toEqual(['task:3', 'task:4']);
  });

  it("shows the alternatives in each respondent's own order, with their own labels", () => {
    const version = versionOf();
    const seen = new Map<string, string>();
    for (let seed = 1; seed <= 40; seed++) {
      const plan = planOf(version, 1, seed);
      for (const screen of buildScreens(version, plan)) {
        if (screen.kind !== 'task') continue;
        expect(screen.alternatives.map((a) => a.index)).toEqual(plan.positions[screen.key]);
        // Unlabeled alternatives are lettered by place on screen, whichever design card sits there.
        expect(screen.alternatives.filter((a) => !a.fixed).map((a) => a.label)).toEqual([
          'Option A',
          'Option B',
        ]);
        seen.set(`${screen.key} ${plan.positions[screen.key].join()}`, '');
      }
    }
    // Both orders of both tasks came up (so shared screens did not freeze one order).
    expect(seen.size).toBe(4);
  });
});

describe('sessionJson', () => {
  it('writes exactly what JSON.stringify writes, first and again from the cached parts', () => {
    const version = versionOf();
    for (const seed of [1, 2, 3]) {
      const session = sessionOf(version, seed, 1 + (seed % 2));
      expect(sessionJson(session)).toBe(JSON.stringify(session));
      expect(sessionJson(session)).toBe(
        JSON.stringify(sessionOf(structuredClone(version), seed, 1 + (seed % 2))),
      );
    }
  });

  it("writes each respondent's own attribute order when attributes are shuffled", () => {
    const version = versionOf({ shuffleAttributes: true });
    const orders = new Set<string>();
    for (let seed = 1; seed <= 10; seed++) {
      const session = sessionOf(version, seed);
      const written = JSON.parse(sessionJson(session)) as RespondentSession;
      expect(sessionJson(session)).toBe(JSON.stringify(session));
      orders.add(written.definition.attributes.map((a) => a.id).join());
    }
    expect(orders.size).toBeGreaterThan(1);
  });

  it('leaves out undefined members and writes null ones, as JSON.stringify does', () => {
    const session = { ...sessionOf(versionOf(), 4), redirectUrl: null, extra: undefined };
    expect(sessionJson(session as RespondentSession)).toBe(JSON.stringify(session));
  });
});
