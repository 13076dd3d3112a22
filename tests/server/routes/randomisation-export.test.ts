/**
 * randomisation.csv says what each respondent saw: the order of the design tasks and, per choice
 * screen, which alternative stood at each position — checked against the screens the respondent
 * app was sent, not against the stored plan the file is read from.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type supertest from 'supertest';
import { parse } from 'csv-parse/sync';
import { useTestApp } from '../../support/test-app';
import { signUpOwner } from '../../support/factories';
import {
  definition,
  fullQuestionnaire,
  startLiveSession,
  type LiveSession,
} from './respond-fixtures';

const t = useTestApp();
let owner: supertest.Agent;
let teamId: string;
beforeAll(async () => {
  ({ agent: owner, teamId } = await signUpOwner(t));
});

type TaskScreen = { key: string; kind: string; alternatives?: { index: number }[] };

describe('GET …/exports/randomisation.csv', () => {
  it('gives each respondent their task order and the alternatives left to right as shown', async () => {
    const { study, session } = await startLiveSession(t, owner, teamId);
    const second = (
      await t.request().post(`/api/r/${study.publicId}/sessions`).send({}).expect(201)
    ).body as LiveSession;
    const res = await owner
      .get(`/api/teams/${teamId}/studies/${study.id}/exports/randomisation.csv`)
      .expect(200);
    expect(res.headers['content-disposition']).toMatch(/randomisation/);
    const rows = parse(res.text, { columns: true }) as Record<string, string>[];
    expect(new Set(rows.map((r) => r.number))).toEqual(new Set(['1', '2']));
    // New respondents' plans are drawn by the current plan generator, and say so.
    expect(new Set(rows.map((r) => r.plan_generator))).toEqual(new Set(['2']));

    for (const [n, s] of [session, second].entries()) {
      const mine = rows.filter((r) => r.number === String(n + 1));
      const shown = (s.screens as TaskScreen[]).filter((x) => x.key.startsWith('task:'));
      // Design tasks in the order the respondent meets them: shown as 1, 2, …
      const byKey = new Map(mine.map((r) => [r.screen, r]));
      shown.forEach((screen, k) => {
        const row = byKey.get(screen.key)!;
        expect(row.task_shown_as).toBe(String(k + 1));
        expect(row.alternatives_left_to_right).toBe(
          screen.alternatives!.map((a) => (a.index < 0 ? 'none' : String(a.index + 1))).join(' '),
        );
      });
      // Every choice screen of the session is in the record, and nothing else.
      const choiceScreens = (s.screens as TaskScreen[]).filter((x) => x.kind === 'task');
      expect(new Set(mine.map((r) => r.screen))).toEqual(new Set(choiceScreens.map((x) => x.key)));
    }
  });

  it('names each respondent’s attribute order, top to bottom as their cards showed it', async () => {
    const q = fullQuestionnaire();
    const { study, session } = await startLiveSession(t, owner, teamId, {
      ...q,
      options: { ...q.options, shuffleAttributes: true },
    });
    const names = new Map(definition.attributes.map((a) => [a.id, a.name]));
    const shownOrder = (
      session as unknown as { definition: { attributes: { id: string }[] } }
    ).definition.attributes.map((a) => names.get(a.id));
    expect([...shownOrder].sort()).toEqual([...names.values()].sort());
    const res = await owner
      .get(`/api/teams/${teamId}/studies/${study.id}/exports/randomisation.csv`)
      .expect(200);
    const rows = parse(res.text, { columns: true }) as Record<string, string>[];
    expect(rows.length).toBeGreaterThan(0);
    for (const row of rows) expect(row.attributes_top_to_bottom).toBe(shownOrder.join(' | '));
  });

  it('leaves the attribute order empty when the study shows attributes as defined', async () => {
    const { study } = await startLiveSession(t, owner, teamId);
    const res = await owner
      .get(`/api/teams/${teamId}/studies/${study.id}/exports/randomisation.csv`)
      .expect(200);
    const rows = parse(res.text, { columns: true }) as Record<string, string>[];
    expect(rows.every((r) => r.attributes_top_to_bottom === '')).toBe(true);
  });

  it('is refused to a non-member (404) and needs a sign-in (401)', async () => {
    const { study } = await startLiveSession(t, owner, teamId);
    const other = await signUpOwner(t);
    const path = `/api/teams/${teamId}/studies/${study.id}/exports/randomisation.csv`;
    expect((await other.agent.get(path)).status).toBe(404);
    expect((await t.request().get(path)).status).toBe(401);
  });
});
