/**
 * Pilot → priors → redesign through the API: a finished run's estimates as priors, a candidate
 * design compared with the current one under the new priors, adopting it on a live study (a new
 * version: in-progress respondents keep theirs, new ones get the new tasks) or discarding it.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { runDesignJob } from '../../../server/jobs/design-job';
import { createDesignPool } from '../../../server/engine/design/run-design-in-worker';
import { runs } from '../../../db/schema/models';
import { respondents } from '../../../db/schema/fieldwork';
import { studies, studyVersions } from '../../../db/schema/studies';
import { getCodedColumns } from '../../../shared/engine/coding/coded-columns';
import type { Role } from '../../../shared/permissions';
import { parse } from 'csv-parse/sync';
import {
  answerFor,
  definition,
  insertStudy,
  sendAnswer,
  type LiveSession,
} from './respond-fixtures';

const t = useTestApp({}, { signIn: 'team' });
const sent: Array<{ designJobId: string }> = [];
const pool = createDesignPool({ maxThreads: 1 });

beforeAll(async () => {
  t.deps.jobs = {
    send: async (_name, data) => {
      sent.push(data as { designJobId: string });
    },
  };
});
afterAll(async () => {
  await pool.destroy();
});

const columns = getCodedColumns(definition);
/** Hand-made MNL estimates: column k has estimate 0.1·(k+1) (bill −0.2), SE 0.05·(k+1). */
const mnlEstimate = (k: number) => (columns[k].key === 'attr:bill' ? -0.2 : 0.1 * (k + 1));
const codeOf = (key: string) => key.replace(/[^A-Za-z0-9]+/g, '_');

function mnlResults(keys = columns.map((c) => c.key)) {
  const cols = keys.map((key) => ({ key, coefficient: codeOf(key), label: key }));
  return {
    model: 'mnl',
    columns: cols,
    // The MNL names its estimates by data column (the engine's fit-mnl), its moments by coefficient.
    estimates: cols.map((c, k) => ({
      name: c.key,
      estimate: mnlEstimate(k),
      se: 0.05 * (k + 1),
      robustSe: 0.06 * (k + 1),
    })),
    population: cols.map((c, k) => ({
      name: c.coefficient,
      distribution: 'fixed',
      mean: mnlEstimate(k),
      sd: 0,
      location: mnlEstimate(k),
      spread: 0,
    })),
    derived: [],
  };
}

/** Mixed logit: bill negative lognormal, river_good normal, the rest fixed. */
function mixedResults() {
  const base = mnlResults();
  const random: Record<string, { distribution: string; mean: number; sd: number }> = {
    attr_bill: { distribution: 'neg_lognormal', mean: -0.3, sd: 0.2 },
    attr_river_good: { distribution: 'normal', mean: 0.9, sd: 0.7 },
  };
  return {
    ...base,
    model: 'mixed',
    // The mixed logit names them by coefficient: "x" (fixed), "x.mean" / "x.sd" (random).
    estimates: base.estimates.map((e) => {
      const name = codeOf(e.name);
      return random[name] ? { ...e, name: `${name}.mean`, se: 0.11 } : { ...e, name };
    }),
    population: base.population.map((p) =>
      random[p.name] ? { ...p, ...random[p.name], location: 0, spread: 0 } : p,
    ),
    derived: [{ name: 'attr_bill', quantity: 'mean', label: '', estimate: -0.3, se: 0.04 }],
  };
}

async function insertRun(
  studyId: string,
  model: 'mnl' | 'mixed' | 'hb',
  results: unknown,
  status: 'done' | 'queued' = 'done',
) {
  const distributions: Record<string, string> =
    model === 'mixed' ? { attr_bill: 'neg_lognormal', attr_river_good: 'normal' } : {};
  const spec = {
    model,
    coefficients: columns.map((c) => ({
      name: codeOf(c.key),
      column: c.key,
      distribution: model === 'hb' ? 'normal' : (distributions[codeOf(c.key)] ?? 'fixed'),
    })),
  };
  const [row] = await t.deps.db
    .insert(runs)
    .values({
      studyId,
      teamId: t.team.teamId,
      name: `${model} pilot`,
      model,
      spec,
      status,
      results: status === 'done' ? results : null,
    })
    .returning({ id: runs.id });
  return row.id;
}

const base = (studyId: string) => `/api/teams/${t.team.teamId}/studies/${studyId}/design`;

async function liveStudy() {
  const study = await insertStudy(t, t.team.teamId);
  await t.team.agents.owner
    .post(`/api/teams/${t.team.teamId}/studies/${study.id}/lifecycle/go-live`)
    .expect(200);
  return study;
}

describe('GET /design/priors-from-run', () => {
  let studyId: string;
  let mnlRun: string;
  let mixedRun: string;
  beforeAll(async () => {
    studyId = (await liveStudy()).id;
    mnlRun = await insertRun(studyId, 'mnl', mnlResults());
    mixedRun = await insertRun(studyId, 'mixed', mixedResults());
  });

  it.each<Role>(['owner', 'editor', 'analyst', 'viewer'])(
    'as %s, turns an MNL run into normal priors (mean = estimate, SD = SE)',
    async (role) => {
      const res = await t.team.agents[role]
        .get(`${base(studyId)}/priors-from-run?runId=${mnlRun}`)
        .expect(200);
      expect(res.body.priors.kind).toBe('bayesian');
      expect(res.body.priors.columns).toEqual(
        columns.map((c, k) => ({ key: c.key, mean: mnlEstimate(k), sd: 0.05 * (k + 1) })),
      );
    },
  );

  it('for someone outside the team, returns 404', async () => {
    await t.team.outsider.get(`${base(studyId)}/priors-from-run?runId=${mnlRun}`).expect(404);
  });

  it('takes the robust SE when the run reports robust standard errors', async () => {
    const robust = await insertRun(studyId, 'mnl', {
      ...mnlResults(),
      covariance: { used: 'robust' },
    });
    const res = await t.team.agents.owner
      .get(`${base(studyId)}/priors-from-run?runId=${robust}`)
      .expect(200);
    expect(res.body.columns[0].sd).toBeCloseTo(0.06, 12);
  });

  it('mixed logit: population means, with the SE or the population SD as spread', async () => {
    const se = await t.team.agents.editor
      .get(`${base(studyId)}/priors-from-run?runId=${mixedRun}`)
      .expect(200);
    const bySe = Object.fromEntries(se.body.columns.map((c: { key: string }) => [c.key, c]));
    // Lognormal: the SE of its population mean (delta method, derived); normal: SE of ".mean".
    expect(bySe['attr:bill']).toMatchObject({ mean: -0.3, sd: 0.04, spreadFrom: 'se' });
    expect(bySe['attr:river:good']).toMatchObject({ mean: 0.9, sd: 0.11, spreadFrom: 'se' });
    const pop = await t.team.agents.editor
      .get(`${base(studyId)}/priors-from-run?runId=${mixedRun}&spread=population`)
      .expect(200);
    const byPop = Object.fromEntries(pop.body.columns.map((c: { key: string }) => [c.key, c]));
    expect(byPop['attr:bill']).toMatchObject({ sd: 0.2, spreadFrom: 'population' });
    expect(byPop['attr:river:good']).toMatchObject({ sd: 0.7, spreadFrom: 'population' });
    // A fixed coefficient has no population spread: its SE stays.
    expect(byPop['asc:fixed']).toMatchObject({ sd: 0.05 * columns.length, spreadFrom: 'se' });
  });

  it('when the run id is not a uuid, returns 400 with the runId field', async () => {
    const res = await t.team.agents.editor
      .get(`${base(studyId)}/priors-from-run?runId=pilot`)
      .expect(400);
    expect(res.body.error.fields).toEqual([expect.objectContaining({ path: 'runId' })]);
  });

  it('when the run does not exist, returns 404', async () => {
    await t.team.agents.editor
      .get(`${base(studyId)}/priors-from-run?runId=${crypto.randomUUID()}`)
      .expect(404);
  });

  it('when the population spread is asked of an MNL, returns 400 with the spread field', async () => {
    const res = await t.team.agents.editor
      .get(`${base(studyId)}/priors-from-run?runId=${mnlRun}&spread=population`)
      .expect(400);
    expect(res.body.error.fields).toEqual([
      { path: 'spread', message: expect.stringMatching(/no population spread/) },
    ]);
  });

  it('when the run codes the attributes differently, refuses with coding_mismatch on runId', async () => {
    const keys = columns.map((c) => c.key).filter((k) => k !== 'attr:interrupt');
    const partial = await insertRun(studyId, 'mnl', mnlResults([...keys, 'attr:meter']));
    const res = await t.team.agents.editor
      .get(`${base(studyId)}/priors-from-run?runId=${partial}`)
      .expect(400);
    expect(res.body.error.code).toBe('coding_mismatch');
    expect(res.body.error.fields[0].path).toBe('runId');
    expect(res.body.error.message).toMatch(/no coefficient for Supply interruptions/);
    expect(res.body.error.message).toMatch(/no longer has attr:meter/);
  });

  it('when a level value changed since the run, refuses with coding_mismatch', async () => {
    const study = await liveStudy();
    const run = await insertRun(study.id, 'mnl', mnlResults());
    const changed = structuredClone(definition);
    changed.attributes[0].levels[1].value = 4;
    await t.deps.db.update(studies).set({ definition: changed }).where(eq(studies.id, study.id));
    const res = await t.team.agents.editor
      .get(`${base(study.id)}/priors-from-run?runId=${run}`)
      .expect(400);
    expect(res.body.error).toMatchObject({ code: 'coding_mismatch' });
    expect(res.body.error.message).toMatch(/coded differently/);
  });

  it('when the run is hierarchical Bayes, returns 400; when it is not finished, 409', async () => {
    const hb = await insertRun(studyId, 'hb', { ...mnlResults(), model: 'hb' });
    const res = await t.team.agents.editor
      .get(`${base(studyId)}/priors-from-run?runId=${hb}`)
      .expect(400);
    expect(res.body.error.fields[0]).toMatchObject({ path: 'runId' });
    const queued = await insertRun(studyId, 'mnl', null, 'queued');
    const busy = await t.team.agents.editor
      .get(`${base(studyId)}/priors-from-run?runId=${queued}`)
      .expect(409);
    expect(busy.body.error.code).toBe('run_not_finished');
  });
});

describe('candidate designs: compare, adopt, keep', () => {
  let study: { id: string; publicId: string };
  let priors: unknown;
  beforeAll(async () => {
    study = await liveStudy();
    const run = await insertRun(study.id, 'mnl', mnlResults());
    priors = (
      await t.team.agents.editor.get(`${base(study.id)}/priors-from-run?runId=${run}`).expect(200)
    ).body.priors;
  });
  const candidateSpec = () => ({
    method: 'd_efficient',
    tasks: 8,
    blocks: 2,
    starts: 1,
    seed: sent.length + 3,
    priors,
  });

  async function generateCandidate() {
    const res = await t.team.agents.editor
      .post(`${base(study.id)}/candidates`)
      .send(candidateSpec())
      .expect(202);
    expect(res.body.purpose).toBe('candidate');
    await runDesignJob(t.deps, pool, res.body.id);
    const state = await t.team.agents.viewer.get(base(study.id)).expect(200);
    expect(state.body.job.status).toBe('done');
    return state.body;
  }

  it.each<Role>(['analyst', 'viewer'])('as %s, starting a candidate returns 403', async (role) => {
    const before = sent.length;
    await t.team.agents[role]
      .post(`${base(study.id)}/candidates`)
      .send(candidateSpec())
      .expect(403);
    expect(sent.length).toBe(before);
  });

  it('for someone outside the team, returns 404', async () => {
    await t.team.outsider
      .post(`${base(study.id)}/candidates`)
      .send(candidateSpec())
      .expect(404);
  });

  it('when the spec is invalid, returns 400 with the field and queues nothing', async () => {
    const before = sent.length;
    const res = await t.team.agents.owner
      .post(`${base(study.id)}/candidates`)
      .send({ ...candidateSpec(), tasks: 7 })
      .expect(400);
    expect(res.body.error.fields).toEqual([expect.objectContaining({ path: 'blocks' })]);
    expect(sent.length).toBe(before);
  });

  it('when the study has no design yet, returns 409 no_current_design', async () => {
    const bare = await insertStudy(t, t.team.teamId, { withDesign: false });
    const res = await t.team.agents.owner
      .post(`${base(bare.id)}/candidates`)
      .send(candidateSpec())
      .expect(409);
    expect(res.body.error.code).toBe('no_current_design');
  });

  it('generates beside the live design and compares both under the new priors', async () => {
    const before = await t.team.agents.viewer.get(base(study.id)).expect(200);
    const state = await generateCandidate();
    expect(state.design.id).toBe(before.body.design.id);
    expect(state.candidate.design.tasks).toHaveLength(8);
    expect(state.candidate.comparison.map((c: { criterion: string }) => c.criterion)).toEqual([
      'd_error',
      'a_error',
      's_estimate',
      'c_error',
    ]);
    // The live 4-task design gives at most 2 directions per task (3 rows): 8 < 9 parameters,
    // so it is singular (null) under any priors; the 8-task candidate identifies them all.
    for (const c of state.candidate.comparison) {
      expect(c.current).toBeNull();
      expect(c.candidate).toBeGreaterThan(0);
      expect(c.unavailable).toBeNull();
    }
  });

  it('adopting: 403 for viewers, 400 for a bad id, 404 for another design', async () => {
    const state = (await t.team.agents.viewer.get(base(study.id)).expect(200)).body;
    const id = state.candidate.id;
    await t.team.agents.viewer.post(`${base(study.id)}/candidates/${id}/adopt`).expect(403);
    await t.team.agents.analyst.post(`${base(study.id)}/candidates/${id}/adopt`).expect(403);
    await t.team.outsider.post(`${base(study.id)}/candidates/${id}/adopt`).expect(404);
    const bad = await t.team.agents.editor.post(`${base(study.id)}/candidates/x/adopt`).expect(400);
    expect(bad.body.error.fields).toEqual([expect.objectContaining({ path: 'designId' })]);
    await t.team.agents.editor
      .post(`${base(study.id)}/candidates/${state.design.id}/adopt`)
      .expect(404);
  });

  it('adopting on a live study freezes version 2: in-progress respondents keep version 1', async () => {
    const first = (await t.request().post(`/api/r/${study.publicId}/sessions`).send({}).expect(201))
      .body as LiveSession;
    const taskKeys = (s: LiveSession) =>
      s.screens.filter((x) => x.kind === 'task').map((x) => x.key);
    expect(taskKeys(first)).toHaveLength(2);

    const state = (await t.team.agents.viewer.get(base(study.id)).expect(200)).body;
    const adopted = await t.team.agents.editor
      .post(`${base(study.id)}/candidates/${state.candidate.id}/adopt`)
      .expect(200);
    expect(adopted.body).toMatchObject({ version: 2, designId: state.candidate.id });
    const after = (await t.team.agents.viewer.get(base(study.id)).expect(200)).body;
    expect(after.design.id).toBe(state.candidate.id);
    expect(after.candidate).toBeNull();

    const resumed = await t
      .request()
      .get(`/api/r/${study.publicId}/session`)
      .set('x-respondent-token', first.sessionToken)
      .expect(200);
    expect(taskKeys(resumed.body)).toEqual(taskKeys(first));

    const second = (
      await t.request().post(`/api/r/${study.publicId}/sessions`).send({}).expect(201)
    ).body as LiveSession;
    expect(taskKeys(second)).toHaveLength(4);
    const versions = await t.deps.db
      .select({ version: studyVersions.version })
      .from(respondents)
      .innerJoin(studyVersions, eq(studyVersions.id, respondents.versionId))
      .where(eq(respondents.studyId, study.id))
      .orderBy(respondents.startedAt);
    expect(versions.map((v) => v.version)).toEqual([1, 2]);
    const [row] = await t.deps.db
      .select({ currentVersion: studies.currentVersion })
      .from(studies)
      .where(eq(studies.id, study.id));
    expect(row.currentVersion).toBe(2);

    // Both answer up to their first choice task; the exports say which version each saw.
    for (const session of [first, second])
      for (const screen of session.screens) {
        await sendAnswer(
          t,
          study.publicId,
          session.sessionToken,
          'answers',
          answerFor(screen),
        ).expect(201);
        if (screen.key.startsWith('task:')) break;
      }
    const exports = `/api/teams/${t.team.teamId}/studies/${study.id}/exports`;
    const long = parse(
      (await t.team.agents.viewer.get(`${exports}/choices.csv`).expect(200)).text,
      {
        columns: true,
      },
    ) as Record<string, string>[];
    expect([...new Set(long.map((r) => r.version))].sort()).toEqual(['1', '2']);
    const background = parse(
      (await t.team.agents.viewer.get(`${exports}/background-answers.csv`).expect(200)).text,
      { columns: true },
    ) as Record<string, string>[];
    expect(background.map((r) => r.version).sort()).toEqual(['1', '2']);
  });

  it('keeping the current design deletes the candidate and changes nothing else', async () => {
    const state = await generateCandidate();
    // Now the current design (adopted above) identifies everything: both columns are finite,
    // and the current one was itself searched under these priors with another seed.
    for (const c of state.candidate.comparison) {
      expect(c.current).toBeGreaterThan(0);
      expect(c.candidate).toBeGreaterThan(0);
    }
    await t.team.agents.viewer
      .delete(`${base(study.id)}/candidates/${state.candidate.id}`)
      .expect(403);
    await t.team.agents.owner
      .delete(`${base(study.id)}/candidates/${state.candidate.id}`)
      .expect(204);
    const after = (await t.team.agents.viewer.get(base(study.id)).expect(200)).body;
    expect(after.candidate).toBeNull();
    expect(after.design.id).toBe(state.design.id);
    await t.team.agents.owner
      .delete(`${base(study.id)}/candidates/${state.candidate.id}`)
      .expect(404);
  });
});
