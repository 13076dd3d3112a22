/**
 * Checks of the demo seed (ensureDemoResponses), run by tests/server/seed/demo-data.test.ts on the
 * demo it seeds once (tests/support/demo-world.ts).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { asc, eq } from 'drizzle-orm';
import type { Db } from '../../../db/client';
import {
  DEMO_TRUTH,
  mapDemoDefinition,
  simulateChoice,
  type SimulatedTruth,
} from '../../../server/seed/simulate-choices';
import { ensureDemoResponses } from '../../../server/seed/demo-responses';
import { answers, respondents } from '../../../db/schema/fieldwork';
import { studies } from '../../../db/schema/studies';
import { buildScreens, loadFrozenVersion } from '../../../server/services/respondent-screens';
import { refreshQualityFlags } from '../../../server/services/responses';
import { respondentPlanSchema } from '../../../shared/schemas/respondent';
import { studyDefinitionSchema } from '../../../shared/schemas/study-definition';
import type { AppDeps } from '../../../server/deps';
import type { DemoWorld } from '../../support/demo-world';

export function describeDemoResponses(world: () => DemoWorld) {
  describe('ensureDemoResponses', () => {
    let t: { db: Db };
    let studyId: string;
    let firstRun: { created: number; total: number };
    let seedSeconds = 0;
    beforeAll(() => {
      const w = world();
      t = { db: w.t.deps.db };
      ({ studyId, firstRun, seedSeconds } = w);
    });

    const total = DEMO_TRUTH.completes + DEMO_TRUTH.dropouts;
    const loadRespondents = () =>
      t.db
        .select()
        .from(respondents)
        .where(eq(respondents.studyId, studyId))
        .orderBy(asc(respondents.id));
    const loadAnswers = () =>
      t.db.select().from(answers).where(eq(answers.studyId, studyId)).orderBy(asc(answers.id));

    it('fills a closed study with 400 completes and a few drop-outs', async () => {
      console.info(`demo responses seeded in ${seedSeconds.toFixed(1)} s`);
      expect(firstRun).toEqual({ created: total, total });
      const people = await loadRespondents();
      const count = (s: string) => people.filter((p) => p.status === s).length;
      expect(count('completed')).toBe(DEMO_TRUTH.completes);
      expect(count('in_progress')).toBe(DEMO_TRUTH.dropouts);
      const [study] = await t.db.select().from(studies).where(eq(studies.id, studyId));
      expect(study.status).toBe('closed');
      const completes = people.filter((p) => p.status === 'completed');
      expect(completes.every((p) => p.durationMs! > 0 && p.finishedAt! > p.startedAt)).toBe(true);
      // Least-filled assignment keeps the two blocks within one respondent of each other.
      const perBlock = [1, 2].map((b) => people.filter((p) => p.block === b).length);
      expect(Math.abs(perBlock[0] - perBlock[1])).toBeLessThanOrEqual(1);
    });

    it('stores every choice exactly as the simulation makes it', async () => {
      const [study] = await t.db.select().from(studies).where(eq(studies.id, studyId));
      const coding = mapDemoDefinition(studyDefinitionSchema.parse(study.definition));
      const byRespondent = new Map<string, (typeof answers.$inferSelect)[]>();
      for (const a of await loadAnswers())
        byRespondent.set(a.respondentId, [...(byRespondent.get(a.respondentId) ?? []), a]);
      let checked = 0;
      for (const r of await loadRespondents()) {
        const version = await loadFrozenVersion(t.db, { id: r.versionId, studyId });
        const screens = buildScreens(version, respondentPlanSchema.parse(r.plan));
        const stored = byRespondent.get(r.id) ?? [];
        if (r.status === 'completed') expect(stored).toHaveLength(screens.length);
        for (const a of stored) {
          const screen = screens.find((s) => s.key === a.screenKey)!;
          if (screen.kind !== 'task') continue;
          const position = simulateChoice(r.simulatedTruth as SimulatedTruth, screen, coding);
          expect(a.chosenPosition).toBe(position);
          expect(a.chosenAlternative).toBe(screen.alternatives[position].index);
          checked++;
        }
      }
      // 400 completes × (8 design tasks + the dominance test), plus the drop-outs' tasks.
      expect(checked).toBeGreaterThanOrEqual(DEMO_TRUTH.completes * 9);
    });

    it('a second run changes nothing', async () => {
      const before = { people: await loadRespondents(), answers: await loadAnswers() };
      const again = await ensureDemoResponses(t.db, { studyId });
      expect(again).toEqual({ created: 0, total });
      const after = { people: await loadRespondents(), answers: await loadAnswers() };
      expect(after.people.map((p) => p.id)).toEqual(before.people.map((p) => p.id));
      expect(after.answers.map((a) => [a.id, a.chosenPosition])).toEqual(
        before.answers.map((a) => [a.id, a.chosenPosition]),
      );
    });

    it('gives every complete the three background answers', async () => {
      const done = new Set(
        (await loadRespondents()).filter((p) => p.status === 'completed').map((p) => p.id),
      );
      const all = await loadAnswers();
      for (const key of ['q:household_size', 'q:age_band', 'q:filters_water'])
        expect(all.filter((a) => a.screenKey === key && done.has(a.respondentId))).toHaveLength(
          DEMO_TRUTH.completes,
        );
    });

    it('draws individual tastes from the population it claims', async () => {
      const truths = (await loadRespondents()).map((r) => r.simulatedTruth as SimulatedTruth);
      const c = DEMO_TRUTH.coefficients;
      const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
      // The sample mean of n draws has standard error sd/√n (closed form); 4 SE bounds.
      const within = (xs: number[], mu: number, sd: number) =>
        expect(Math.abs(mean(xs) - mu)).toBeLessThan((4 * sd) / Math.sqrt(xs.length));
      for (const name of ['interruptions', 'warnings', 'river_good', 'renewables'] as const)
        within(
          truths.map((x) => x.coefficients[name]),
          c[name].mean,
          c[name].sd,
        );
      // ln(−β_cost) is normal(mu, sigma) by construction.
      within(
        truths.map((x) => Math.log(-x.coefficients.cost)),
        c.cost.mu,
        c.cost.sigma,
      );
      expect(truths.every((x) => x.coefficients.cost < 0)).toBe(true);
    });

    it('plants speeders and dominance failures that the quality flags find', async () => {
      const [study] = await t.db.select().from(studies).where(eq(studies.id, studyId));
      const summary = await refreshQualityFlags({ db: t.db } as unknown as AppDeps, study);
      const b = DEMO_TRUTH.behaviours;
      expect(summary.flagged.dominanceFailed).toBe(b.dominance_failure);
      expect(summary.flagged.speeder).toBeGreaterThanOrEqual(
        b.speeder_random + b.speeder_same_position,
      );
      expect(summary.flagged.samePosition).toBeGreaterThanOrEqual(b.speeder_same_position);
    });
  });
}
