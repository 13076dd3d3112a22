/**
 * The fast answer path under concurrency: blocks stay balanced when a panel's respondents
 * arrive at once, a quota of completes is never exceeded however many finish together, and a
 * client id is bound to one screen and one value. The one-statement path (answer-fast-path.ts)
 * stores only plain in-order answers of a live session and writes nothing in every other case,
 * which it leaves to the full path: a retry, an answer out of order, a closed or closing
 * study, a completion under a quota, an ended session, a respondent this process does not know.
 */
import { describe, expect, it } from 'vitest';
import { and, eq, sql } from 'drizzle-orm';
import { createDb, type DbOrTx } from '../../../db/client';
import { assignBlock } from '../../../db/queries/respondent-blocks';
import { useTestApp } from '../../support/test-app';
import { answers, respondentBlockCounts, respondents } from '../../../db/schema/fieldwork';
import { saveAnswer, type AnswerInput } from '../../../server/services/answers';
import { fastAnswerBatcherOf, saveAnswerFast } from '../../../server/services/answer-fast-path';
import {
  insertAnswerIfOpen,
  insertAnswersIfOpen,
  type FastAnswer,
} from '../../../db/queries/answer-fast-path';
import { rememberRespondent } from '../../../server/services/known-respondents';
import { buildSession, createRespondent } from '../../../server/services/respondent-session';
import { closeStudy, goLive } from '../../../server/services/lifecycle';
import { getStudyById } from '../../../db/queries/studies';
import { answerFor, insertStudy } from '../routes/respond-fixtures';

const t = useTestApp({}, { signIn: 'owner' });

async function liveStudyWithLink(settings: object = {}) {
  const study = await insertStudy(t, t.teamId, { settings });
  await goLive(t.deps, t.teamId, study.id);
  return study;
}
const liveStudy = async (settings: object = {}) => (await liveStudyWithLink(settings)).id;

async function newRespondent(studyId: string) {
  const { respondent, sessionToken } = await createRespondent(t.deps.db, { studyId });
  const study = { id: studyId, publicTitle: 'x', status: 'live', settings: {} };
  const session = await buildSession(t.deps.db, study, respondent, { isNew: true });
  return { sessionToken, session, respondent };
}

const answerOf = (screen: Parameters<typeof answerFor>[0]) => answerFor(screen) as AnswerInput;

async function answerUpTo(
  studyId: string,
  r: Awaited<ReturnType<typeof newRespondent>>,
  n: number,
) {
  for (const screen of r.session.screens.slice(0, n))
    await saveAnswer(t.deps.db, {
      studyId,
      sessionToken: r.sessionToken,
      answer: answerOf(screen),
    });
}

describe('block assignment', () => {
  it('keeps the two blocks balanced when 40 sessions start at the same moment', async () => {
    const studyId = await liveStudy();
    const made = await Promise.all(
      Array.from({ length: 40 }, () => createRespondent(t.deps.db, { studyId })),
    );
    const perBlock = [1, 2].map((b) => made.filter((m) => m.respondent.block === b).length);
    expect(perBlock).toEqual([20, 20]);
  });

  it('stays balanced when the counter commits without waiting for the log flush (session starts)', async () => {
    const studyId = await liveStudy();
    const made = await Promise.all(
      Array.from({ length: 40 }, () => createRespondent(t.deps.db, { studyId, standalone: true })),
    );
    const perBlock = [1, 2].map((b) => made.filter((m) => m.respondent.block === b).length);
    expect(perBlock).toEqual([20, 20]);
  });

  it("skips the flush wait only for its own statement, never for a caller's transaction", async () => {
    const studyId = await liveStudy();
    const { respondent } = await createRespondent(t.deps.db, { studyId });
    const target = { versionId: respondent.versionId, blocks: 2 };
    const setting = async (db: DbOrTx) =>
      (await db.execute<{ v: string }>(sql`select current_setting('synchronous_commit') as v`))
        .rows[0].v;
    // One connection, so the statement after the assignment runs where the assignment ran.
    const one = createDb(t.testDb.url, 1);
    try {
      await assignBlock(one.db, { ...target, standalone: true });
      expect(await setting(one.db)).toBe('on');
      await one.db
        .transaction(async (tx) => {
          await assignBlock(tx, { ...target, standalone: true });
          // The mechanism: set for the rest of the (here explicit) transaction only.
          expect(await setting(tx)).toBe('off');
          tx.rollback();
        })
        .catch(() => {});
      await one.db.transaction(async (tx) => {
        await assignBlock(tx, target);
        expect(await setting(tx)).toBe('on');
      });
    } finally {
      await one.pool.end();
    }
  });

  it('gives the place back when a respondent is screened out, so the next start takes it', async () => {
    const studyId = await liveStudy();
    const a = await newRespondent(studyId);
    const b = await newRespondent(studyId);
    expect(new Set([a.respondent.block, b.respondent.block])).toEqual(new Set([1, 2]));
    // consent, then "no" to the screening question
    await answerUpTo(studyId, a, 1);
    const screening = a.session.screens[1];
    await saveAnswer(t.deps.db, {
      studyId,
      sessionToken: a.sessionToken,
      answer: { ...answerOf(screening), value: { kind: 'single', optionId: 'no' } },
    });
    const [counts] = await t.deps.db
      .select({ filling: respondentBlockCounts.filling })
      .from(respondentBlockCounts)
      .where(eq(respondentBlockCounts.versionId, a.respondent.versionId));
    expect(counts.filling[a.respondent.block - 1]).toBe(0);
    expect(counts.filling[b.respondent.block - 1]).toBe(1);
    const c = await newRespondent(studyId);
    expect(c.respondent.block).toBe(a.respondent.block);
  });
});

describe('quota of completes', () => {
  it('when 12 respondents finish at once with room for 5, completes exactly 5 and closes the study', async () => {
    const studyId = await liveStudy({ quotaCompletes: 5 });
    const people = await Promise.all(Array.from({ length: 12 }, () => newRespondent(studyId)));
    for (const p of people) await answerUpTo(studyId, p, p.session.screens.length - 1);
    const outcomes = await Promise.allSettled(
      people.map((p) =>
        saveAnswer(t.deps.db, {
          studyId,
          sessionToken: p.sessionToken,
          answer: answerOf(p.session.screens[p.session.screens.length - 1]),
        }),
      ),
    );
    // Each of the other 7 is told "over quota": as a receipt when its answer raced the close,
    // or as the 410 over_quota refusal when it arrived after the quota had closed the study
    // (which happens on a loaded machine). Nobody gets any other answer.
    const said = outcomes.map((o) =>
      o.status === 'fulfilled' ? o.value.status : (o.reason as { code?: string }).code,
    );
    expect(said.filter((x) => x === 'completed')).toHaveLength(5);
    expect(said.filter((x) => x === 'over_quota')).toHaveLength(7);
    const completed = await t.deps.db
      .select({ id: respondents.id })
      .from(respondents)
      .where(and(eq(respondents.studyId, studyId), eq(respondents.status, 'completed')));
    expect(completed).toHaveLength(5);
    const study = await getStudyById(t.deps.db, { id: studyId, teamId: t.teamId });
    expect(study?.status).toBe('closed');
    expect((study?.settings as { closedReason: string }).closedReason).toBe('quota');
  });
});

describe('client ids', () => {
  it('when a client id comes again with another value, returns 409 naming the screen and changes nothing', async () => {
    const studyId = await liveStudy();
    const r = await newRespondent(studyId);
    const task = r.session.screens.find((s) => s.kind === 'task')!;
    await answerUpTo(studyId, r, r.session.screens.indexOf(task));
    const first = { ...answerOf(task), value: { kind: 'choice' as const, position: 0 } };
    await saveAnswer(t.deps.db, { studyId, sessionToken: r.sessionToken, answer: first });
    await expect(
      saveAnswer(t.deps.db, {
        studyId,
        sessionToken: r.sessionToken,
        answer: { ...first, value: { kind: 'choice', position: 1 } },
      }),
    ).rejects.toMatchObject({
      status: 409,
      code: 'client_id_reused',
      message: expect.stringContaining(`"${task.key}"`),
    });
    const [row] = await t.deps.db
      .select({ position: answers.chosenPosition })
      .from(answers)
      .where(and(eq(answers.respondentId, r.respondent.id), eq(answers.screenKey, task.key)));
    expect(row.position).toBe(0);
  });

  it('when the last answer is sent again after completing, returns the same receipt', async () => {
    const studyId = await liveStudy();
    const r = await newRespondent(studyId);
    const screens = r.session.screens;
    await answerUpTo(studyId, r, screens.length - 1);
    const last = answerOf(screens[screens.length - 1]);
    const done = await saveAnswer(t.deps.db, {
      studyId,
      sessionToken: r.sessionToken,
      answer: last,
    });
    const again = await saveAnswer(t.deps.db, {
      studyId,
      sessionToken: r.sessionToken,
      answer: last,
    });
    expect(done).toMatchObject({ status: 'completed', replay: false, nextScreenKey: null });
    expect(again).toMatchObject({ status: 'completed', replay: true, nextScreenKey: null });
  });
});

async function liveRespondent(settings: object = {}, remember = true) {
  const study = await liveStudyWithLink(settings);
  const { respondent, sessionToken, session } = await newRespondent(study.id);
  if (remember) rememberRespondent(study.publicId, respondent);
  const fast = (answer: AnswerInput, now = new Date()) =>
    saveAnswerFast(t.deps.db, { publicId: study.publicId, sessionToken, answer, now });
  const full = (answer: AnswerInput) =>
    saveAnswer(t.deps.db, { publicId: study.publicId, sessionToken, answer });
  const stored = () =>
    t.deps.db
      .select({ screenKey: answers.screenKey, clientId: answers.clientId })
      .from(answers)
      .where(eq(answers.respondentId, respondent.id));
  return { study, respondent, screens: session.screens, fast, full, stored };
}

describe('saveAnswerFast', () => {
  it('stores an in-order answer once and gives the next screen', async () => {
    const r = await liveRespondent();
    const a = answerOf(r.screens[0]);
    const receipt = await r.fast(a);
    expect(receipt).toMatchObject({
      screenKey: r.screens[0].key,
      nextScreenKey: r.screens[1].key,
      status: 'in_progress',
      replay: false,
    });
    expect(await r.stored()).toEqual([{ screenKey: r.screens[0].key, clientId: a.clientId }]);
  });

  it('answers a retry with the receipt the full path gives, and writes nothing', async () => {
    const r = await liveRespondent();
    const a = answerOf(r.screens[0]);
    await r.fast(a);
    const again = await r.fast(a);
    expect(again).toMatchObject({ replay: true, nextScreenKey: r.screens[1].key });
    expect(again).toEqual(await r.full(a));
    expect(await r.stored()).toHaveLength(1);
  });

  it('gives the redirect of the study settings with the answer that ends the session, and none before', async () => {
    const r = await liveRespondent({
      redirects: { complete: 'https://panel.example/done?id={pid}' },
    });
    const receipts = [];
    for (const screen of r.screens) receipts.push(await r.fast(answerOf(screen)));
    expect(receipts.slice(0, -1).every((x) => x?.redirectUrl === null)).toBe(true);
    expect(receipts.at(-1)).toMatchObject({ status: 'completed', replay: false });
    expect(receipts.at(-1)?.redirectUrl).toMatch(/^https:\/\/panel\.example\/done\?id=/);
  });

  it('answers a retry of the last answer with the final status, as the full path does', async () => {
    const r = await liveRespondent({
      redirects: { complete: 'https://panel.example/done?id={pid}' },
    });
    const last = r.screens.map(answerOf);
    for (const a of last) expect(await r.fast(a)).not.toBeNull();
    const again = await r.fast(last.at(-1)!);
    expect(again).toMatchObject({ replay: true, status: 'completed', nextScreenKey: null });
    expect(again).toEqual(await r.full(last.at(-1)!));
  });

  it('leaves a reused client id with another value, or a retry in an archived study, to the full path', async () => {
    const r = await liveRespondent();
    const a = answerOf(r.screens[0]);
    await r.fast(a);
    expect(await r.fast({ ...a, value: { kind: 'ack' } })).toBeNull();
    expect(await r.fast({ ...a, screenKey: r.screens[1].key })).toBeNull();
    await t.deps.db.execute(sql`update studies set archived_at = now() where id = ${r.study.id}`);
    expect(await r.fast(a)).toBeNull();
    expect(await r.stored()).toHaveLength(1);
  });

  it('writes nothing for a screen out of order or a second answer to a screen', async () => {
    const r = await liveRespondent();
    expect(await r.fast(answerOf(r.screens[1]))).toBeNull();
    await r.fast(answerOf(r.screens[0]));
    expect(await r.fast(answerOf(r.screens[0]))).toBeNull();
    expect(await r.stored()).toHaveLength(1);
  });

  it('writes nothing for a respondent this process does not know', async () => {
    const r = await liveRespondent({}, false);
    expect(await r.fast(answerOf(r.screens[0]))).toBeNull();
    expect(await r.stored()).toHaveLength(0);
  });

  it('writes nothing once the study is closed, or its closing date has passed', async () => {
    const closed = await liveRespondent();
    await closeStudy(t.deps, t.teamId, closed.study.id);
    expect(await closed.fast(answerOf(closed.screens[0]))).toBeNull();

    const closeAt = new Date(Date.now() + 60_000);
    const due = await liveRespondent({ closeAt: closeAt.toISOString() });
    expect(await due.fast(answerOf(due.screens[0]), new Date(closeAt.getTime() + 1))).toBeNull();
    expect(await due.fast(answerOf(due.screens[0]))).not.toBeNull();
    expect(await closed.stored()).toHaveLength(0);
    expect(await due.stored()).toHaveLength(1);
  });

  it('completes the session on the last screen, but leaves a completion under a quota alone', async () => {
    for (const quota of [null, 10]) {
      const r = await liveRespondent(quota ? { quotaCompletes: quota } : {});
      for (const screen of r.screens.slice(0, -1))
        expect(await r.fast(answerOf(screen))).not.toBeNull();
      const last = await r.fast(answerOf(r.screens.at(-1)!));
      const [row] = await t.deps.db
        .select({ status: respondents.status })
        .from(respondents)
        .where(eq(respondents.id, r.respondent.id));
      if (quota === null) {
        expect(last).toMatchObject({ status: 'completed', nextScreenKey: null });
        expect(row.status).toBe('completed');
        // An ended session takes nothing more on this path.
        expect(await r.fast(answerOf(r.screens[0]))).toBeNull();
      } else {
        expect(last).toBeNull();
        expect(row.status).toBe('in_progress');
        expect(await r.full(answerOf(r.screens.at(-1)!))).toMatchObject({ status: 'completed' });
      }
    }
  });

  it('screens out and gives the block place back in the same statement', async () => {
    const r = await liveRespondent();
    await r.fast(answerOf(r.screens[0]));
    const out = await r.fast({
      ...answerOf(r.screens[1]),
      value: { kind: 'single', optionId: 'no' },
    });
    expect(out).toMatchObject({ status: 'screened_out', nextScreenKey: null });
    const [counts] = await t.deps.db
      .select({ filling: respondentBlockCounts.filling })
      .from(respondentBlockCounts)
      .where(eq(respondentBlockCounts.versionId, r.respondent.versionId));
    expect(counts.filling.reduce((s, n) => s + n, 0)).toBe(0);
  });

  it('stores one of twelve different answers sent for the same screen at once', async () => {
    const r = await liveRespondent();
    const results = await Promise.all(
      Array.from({ length: 12 }, () => r.fast(answerOf(r.screens[0]))),
    );
    expect(results.filter((x) => x !== null)).toHaveLength(1);
    expect(await r.stored()).toHaveLength(1);
  });
});

describe('answers gathered into one statement', () => {
  /**
   * One answer of each kind the one-answer statement tells apart, each from its own respondent
   * in its own study: stored; sent again (same client id); out of order; in a closed study;
   * after the closing date; in an archived study; from a respondent that is gone.
   */
  async function kinds(): Promise<{ name: string; answer: FastAnswer }[]> {
    const row = async (settings: object, screenAt: number, before?: 'answered' | 'archived') => {
      const r = await liveRespondent(settings);
      const a = answerOf(r.screens[screenAt]);
      if (before) await r.full(a);
      if (before === 'archived')
        await t.deps.db.execute(
          sql`update studies set archived_at = now() where id = ${r.study.id}`,
        );
      return {
        respondentId: r.respondent.id,
        studyId: r.study.id,
        versionId: r.respondent.versionId,
        block: r.respondent.block ?? 1,
        clientId: a.clientId,
        screenKey: a.screenKey,
        taskNumber: null,
        chosenAlternative: null,
        chosenPosition: null,
        value: a.value,
        responseMs: a.responseMs,
        createdAt: new Date(),
        // As the service sends it: the screens before this one must be the ones answered.
        answeredBefore: r.screens.slice(0, screenAt).map((x) => x.key),
        status: 'in_progress' as const,
        durationMs: 0,
      };
    };
    const closed = await row({}, 0);
    await closeStudy(t.deps, t.teamId, closed.studyId);
    // A closing date can only be set ahead; this one has since passed.
    const due = await row({}, 0);
    const past = new Date(Date.now() - 60_000).toISOString();
    await t.deps.db.execute(
      sql`update studies set settings = settings || jsonb_build_object('closeAt', ${past}::text)
           where id = ${due.studyId}`,
    );
    return [
      { name: 'stored', answer: await row({}, 0) },
      { name: 'sent again', answer: await row({}, 0, 'answered') },
      { name: 'out of order', answer: await row({}, 1) },
      { name: 'closed study', answer: closed },
      { name: 'closing date passed', answer: due },
      { name: 'archived study', answer: await row({}, 0, 'archived') },
      {
        name: 'respondent gone',
        answer: { ...(await row({}, 0)), respondentId: crypto.randomUUID() },
      },
    ];
  }

  /** A result without its new id and times (each run has its own), and the rows it left. */
  async function outcome(result: Awaited<ReturnType<typeof insertAnswerIfOpen>>, a: FastAnswer) {
    const rows = await t.deps.db
      .select({ screenKey: answers.screenKey, clientId: answers.clientId, value: answers.value })
      .from(answers)
      .where(eq(answers.respondentId, a.respondentId));
    return {
      result: result && {
        ...result,
        id: result.id === null ? null : 'new',
        // The two runs' studies closed (or were due) at their own moments.
        settings: result.settings && {
          ...(result.settings as object),
          closeAt: 'closeAt' in (result.settings as object),
          closedAt: 'closedAt' in (result.settings as object),
        },
      },
      rows: rows.map((x) => ({ ...x, clientId: x.clientId === a.clientId ? 'this' : 'other' })),
    };
  }

  it('gives each answer exactly what the one-answer statement gives it, and stores the same', async () => {
    const alone = await kinds();
    const together = await kinds();
    const one: Awaited<ReturnType<typeof outcome>>[] = [];
    for (const k of alone)
      one.push(await outcome(await insertAnswerIfOpen(t.deps.db, k.answer), k.answer));
    const many = await insertAnswersIfOpen(
      t.deps.db,
      together.map((k) => k.answer),
    );
    const batched = [];
    for (const [i, k] of together.entries()) batched.push(await outcome(many[i], k.answer));
    expect(batched).toEqual(one);
    // The kinds come out as named, so the comparison above compares something.
    const kindOf = (o: Awaited<ReturnType<typeof outcome>>) =>
      o.result === null
        ? 'gone'
        : o.result.id
          ? 'stored'
          : o.result.refused?.mine
            ? 'retry'
            : 'refused';
    expect(one.map(kindOf)).toEqual([
      'stored',
      'retry',
      'refused',
      'refused',
      'refused',
      'retry',
      'gone',
    ]);
  });

  it('refuses a batch with two answers of one respondent, or one that ends a session', async () => {
    const [k] = await kinds();
    await expect(insertAnswersIfOpen(t.deps.db, [k.answer, k.answer])).rejects.toThrow(
      'one answer per respondent',
    );
    await expect(
      insertAnswersIfOpen(t.deps.db, [{ ...k.answer, status: 'completed' }]),
    ).rejects.toThrow('ends a session');
  });

  it('stores once each of 60 respondents answering at the same moment, most in one statement', async () => {
    const study = await liveStudyWithLink();
    const people = await Promise.all(
      Array.from({ length: 60 }, async () => {
        const r = await newRespondent(study.id);
        rememberRespondent(study.publicId, r.respondent);
        return r;
      }),
    );
    const batcher = fastAnswerBatcherOf(t.deps.db);
    const gatheredBefore = batcher.gathered;
    const sent = people.map((p) => ({ p, a: answerOf(p.session.screens[0]) }));
    const receipts = await Promise.all(
      sent.map(({ p, a }) =>
        saveAnswerFast(t.deps.db, {
          publicId: study.publicId,
          sessionToken: p.sessionToken,
          answer: a,
          now: new Date(),
        }),
      ),
    );
    expect(receipts.every((x) => x?.status === 'in_progress' && x.replay === false)).toBe(true);
    const stored = await t.deps.db
      .select({ clientId: answers.clientId })
      .from(answers)
      .where(eq(answers.studyId, study.id));
    expect(stored.map((x) => x.clientId).sort()).toEqual(sent.map((x) => x.a.clientId).sort());
    // Two went out alone (two statements in flight); the others waited and went together.
    expect(batcher.gathered).toBeGreaterThan(gatheredBefore);
  });
});
