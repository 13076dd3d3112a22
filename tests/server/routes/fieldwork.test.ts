import { beforeAll, describe, expect, it } from 'vitest';
import { useTestApp } from '../../support/test-app';
import {
  addVersion,
  eightChoices,
  fixtureScreenKeys,
  insertRespondent,
  insertStudy,
} from './fieldwork-fixtures';
import { invitees } from '../../../db/schema/fieldwork';
import type { Role } from '../../../shared/permissions';

const t = useTestApp({}, { signIn: 'team' });
let studyId: string;
beforeAll(async () => {
  studyId = await arrangeStudy();
});

const url = (id: string) => `/api/teams/${t.team.teamId}/studies/${id}/fieldwork`;

const before = [
  { screenKey: 'consent', value: { kind: 'consent', agreed: true } },
  { screenKey: 'q:household_size', value: { kind: 'number', number: 3 } },
  { screenKey: 'page:intro1', value: { kind: 'ack' } },
];
const after = [
  { screenKey: 'dominance:dom1', chosenAlternative: 0, value: { taskKind: 'dominance' } },
  { screenKey: 'repeat:rep1', chosenAlternative: 0, value: { taskKind: 'repeat' } },
];

/**
 * Ten starts: five completes (three on version 1 in block 1, two on version 2 in block 2), one
 * screen-out, one over quota, and three unfinished (no answer; three tasks; all eight tasks).
 */
async function arrangeStudy() {
  const { studyId: id, versionId: v1 } = await insertStudy(t.deps.db, { teamId: t.team.teamId });
  const v2 = await addVersion(t.deps.db, id, 2);
  const [inv] = await t.deps.db
    .insert(invitees)
    .values([
      {
        studyId: id,
        email: 'done@example.test',
        token: 'tok-done-0000000000001',
        invitedAt: new Date(),
      },
      { studyId: id, email: 'idle@example.test', token: 'tok-idle-0000000000002' },
    ])
    .returning({ id: invitees.id });
  const complete = (versionId: string, block: number, minutes: number, inviteeId?: string) =>
    insertRespondent(t.deps.db, {
      studyId: id,
      versionId,
      block,
      durationMs: minutes * 60_000,
      inviteeId,
      other: before,
      choices: eightChoices((k) => k % 2),
      special: after,
    });
  await complete(v1, 1, 5, inv.id);
  await complete(v1, 1, 6);
  await complete(v1, 1, 7);
  await complete(v2, 2, 8);
  await complete(v2, 2, 10);
  await insertRespondent(t.deps.db, {
    studyId: id,
    versionId: v2,
    block: 2,
    status: 'screened_out',
    other: before.slice(0, 2),
  });
  await insertRespondent(t.deps.db, { studyId: id, versionId: v2, block: 2, status: 'over_quota' });
  const unfinished = (choices: number) =>
    insertRespondent(t.deps.db, {
      studyId: id,
      versionId: v2,
      block: 2,
      status: 'in_progress',
      other: choices > 0 ? before : [],
      choices: eightChoices(() => 0).slice(0, choices),
    });
  await unfinished(0);
  await unfinished(3);
  await unfinished(8);
  return id;
}

describe('GET /fieldwork', () => {
  it('counts the sample flow, timing, blocks and versions', async () => {
    const res = await t.team.agents.owner.get(url(studyId)).expect(200);
    expect(res.body.counts).toEqual({
      starts: 10,
      inProgress: 3,
      completed: 5,
      screenedOut: 1,
      overQuota: 1,
    });
    // 5 completes of 10 − 1 screened out − 1 over quota.
    expect(res.body.completionRate).toBeCloseTo(5 / 8, 12);
    // 5, 6, 7, 8, 10 minutes -> median 7 minutes.
    expect(res.body.medianDurationMs).toBe(420_000);
    expect(res.body.byBlock).toEqual([
      { block: 1, starts: 3, completed: 3 },
      { block: 2, starts: 7, completed: 2 },
    ]);
    expect(res.body.byVersion).toEqual([
      { version: 1, starts: 3, completed: 3 },
      { version: 2, starts: 7, completed: 2 },
    ]);
    expect(res.body.daily.reduce((s: number, d: { starts: number }) => s + d.starts, 0)).toBe(10);
    expect(res.body.invitations).toEqual({
      total: 2,
      sent: 1,
      reminded: 0,
      unsubscribed: 0,
      started: 1,
      completed: 1,
    });
  });

  it('shows how far respondents got, screen by screen, and where the unfinished stopped', async () => {
    const res = await t.team.agents.viewer.get(url(studyId)).expect(200);
    const steps = res.body.dropOff as Array<{
      key: string;
      label: string;
      reached: number;
      stoppedHere: number;
    }>;
    expect(steps.map((s) => s.key)).toEqual(fixtureScreenKeys);
    const row = (key: string) => steps.find((s) => s.key === key)!;
    expect(row('consent')).toMatchObject({ reached: 8, stoppedHere: 1 });
    expect(row('q:household_size')).toMatchObject({ reached: 8, stoppedHere: 0 });
    expect(row('page:intro1').reached).toBe(7);
    expect(row('tasks#3')).toMatchObject({ reached: 7, stoppedHere: 0 });
    expect(row('tasks#4')).toMatchObject({ reached: 6, stoppedHere: 1 });
    expect(row('dominance:dom1')).toMatchObject({ reached: 5, stoppedHere: 1 });
    expect(row('tasks#1').label).toBe('Choice task 1');
  });

  it.each(['owner', 'editor', 'analyst', 'viewer'] as Role[])(
    '%s may read the figures',
    async (role) => {
      await t.team.agents[role].get(url(studyId)).expect(200);
    },
  );

  it('a member of another team gets 404; without a session 401; a bad id 400', async () => {
    await t.team.outsider.get(url(studyId)).expect(404);
    await t.request().get(url(studyId)).expect(401);
    await t.team.agents.owner.get(url('not-a-study')).expect(400);
  });

  it('a study without respondents has zero counts and no median', async () => {
    const { studyId: empty } = await insertStudy(t.deps.db, { teamId: t.team.teamId });
    const res = await t.team.agents.editor.get(url(empty)).expect(200);
    expect(res.body.counts.starts).toBe(0);
    expect(res.body.medianDurationMs).toBeNull();
    expect(res.body.completionRate).toBeNull();
    expect(res.body.dropOff.every((s: { reached: number }) => s.reached === 0)).toBe(true);
  });
});
