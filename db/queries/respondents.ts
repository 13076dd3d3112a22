/**
 * Respondents (one per answering session) and what the respondent link needs to find. Tenant:
 * respondents have no team: the public id of the link, or the study the link found, is in every
 * where-clause, with the session token, invitee or panel key; getRespondentAnswerState takes the
 * id their session token resolved.
 */
import { and, eq, sql, type SQL } from 'drizzle-orm';
import type { Db, DbOrTx } from '../client';
import { studies } from '../schema/studies';
import { respondents } from '../schema/fieldwork';

export const respondentColumns = {
  id: respondents.id,
  studyId: respondents.studyId,
  versionId: respondents.versionId,
  sessionToken: respondents.sessionToken,
  inviteeId: respondents.inviteeId,
  externalId: respondents.externalId,
  block: respondents.block,
  plan: respondents.plan,
  status: respondents.status,
  startedAt: respondents.startedAt,
  finishedAt: respondents.finishedAt,
  durationMs: respondents.durationMs,
  language: respondents.language,
};
export type RespondentRow = Pick<typeof respondents.$inferSelect, keyof typeof respondentColumns>;

/*
 * A panel launch starts hundreds of sessions a second, and building a query is a measurable
 * part of a start (about half a millisecond of the web process's CPU each for this select and
 * the respondent insert in the bench:fieldwork profile). The two statements every start runs
 * on the pool are therefore built once per database handle and sent as named prepared
 * statements (PostgreSQL parses and plans them once per connection); the values travel as
 * parameters. Weakly keyed: a transaction handle gets its own and is forgotten with it.
 */
function preparedFor<Q>(cache: WeakMap<object, Q>, db: DbOrTx, build: () => Q): Q {
  let q = cache.get(db);
  if (!q) cache.set(db, (q = build()));
  return q;
}

const studyByPublicId = (db: DbOrTx) =>
  db
    .select({
      id: studies.id,
      teamId: studies.teamId,
      name: studies.name,
      publicTitle: studies.publicTitle,
      status: studies.status,
      settings: studies.settings,
      currentVersion: studies.currentVersion,
      archivedAt: studies.archivedAt,
      // The version a new respondent answers, read in the same round trip (session starts).
      // Qualified by hand: drizzle leaves the columns of a one-table select unqualified, and
      // inside the subquery an unqualified "id" named the version's own id, so this was always
      // null and every start read the latest version in a round trip of its own.
      latestVersionId: sql<string | null>`(select sv.id from study_versions sv
        where sv.study_id = "studies"."id"
        order by sv.version desc limit 1)`,
    })
    .from(studies)
    .where(eq(studies.publicId, sql.placeholder('publicId')))
    .prepare('study_by_public_id_v2');
const studyByPublicIdCache = new WeakMap<object, ReturnType<typeof studyByPublicId>>();

/** The study a public link points to, whatever its status (the service decides what to show). */
export async function getStudyByPublicId(db: DbOrTx, params: { publicId: string }) {
  const query = preparedFor(studyByPublicIdCache, db, () => studyByPublicId(db));
  const [row] = await query.execute({ publicId: params.publicId });
  return row ?? null;
}

const startedRespondentColumns = [
  'studyId',
  'versionId',
  'sessionToken',
  'inviteeId',
  'externalId',
  'panelKey',
  'block',
  'plan',
  'device',
  'language',
] as const;
// Only what the database makes is sent back (the id and the start time): the rest of the row
// is what the caller has just sent, or the columns' defaults for a started session, and
// reading it back (the plan's JSON above all) cost the web process CPU on every start.
const insertStarted = (db: DbOrTx) =>
  db
    .insert(respondents)
    .values(
      Object.fromEntries(startedRespondentColumns.map((c) => [c, sql.placeholder(c)])) as never,
    )
    .returning({ id: respondents.id, startedAt: respondents.startedAt })
    .prepare('insert_started_respondent_v3');
const insertStartedCache = new WeakMap<object, ReturnType<typeof insertStarted>>();

/** A session start's row: everything else is the columns' defaults. */
export type StartedRespondent = {
  studyId: string;
  versionId: string;
  sessionToken: string;
  inviteeId: string | null;
  externalId: string | null;
  panelKey: string | null;
  block: number;
  plan: unknown;
  device: string;
  language: string;
};

/** The row a session start made, from what it sent and what the database made. */
function startedRow(
  values: StartedRespondent,
  made: { id: string; startedAt: Date },
): RespondentRow {
  return {
    id: made.id,
    studyId: values.studyId,
    versionId: values.versionId,
    sessionToken: values.sessionToken,
    inviteeId: values.inviteeId,
    externalId: values.externalId,
    block: values.block,
    plan: values.plan,
    status: 'in_progress',
    startedAt: made.startedAt,
    finishedAt: null,
    durationMs: null,
    language: values.language,
  } satisfies RespondentRow;
}

const INSERT_STARTED_BATCH = 'insert_started_respondents_batch_v1';
/*
 * Many session starts' rows in one statement (one round trip and one commit): $1 is the rows
 * as a JSON array, one parameter whatever their number. A unique index that refuses one row
 * (a personal link or panel id started twice at once) refuses the statement; the caller then
 * inserts each row on its own (server/lib/keyed-batcher.ts).
 * Tenant: each row carries its own study, which the caller read through the survey's link.
 */
const INSERT_STARTED_BATCH_TEXT = `
insert into respondents (study_id, version_id, session_token, invitee_id, external_id,
                         panel_key, block, plan, device, language)
select study_id, version_id, session_token, invitee_id, external_id, panel_key, block, plan,
       device, language
  from jsonb_to_recordset($1::jsonb) as x(study_id uuid, version_id uuid, session_token text,
       invitee_id uuid, external_id text, panel_key text, block int, plan jsonb, device text,
       language text)
returning id, started_at, session_token`;

/** insertRespondent for several session starts at once; rows in the order given. */
export async function insertStartedRespondents(
  db: Db,
  rows: readonly StartedRespondent[],
): Promise<RespondentRow[]> {
  const r = await db.$client.query<{ id: string; started_at: Date; session_token: string }>({
    name: INSERT_STARTED_BATCH,
    text: INSERT_STARTED_BATCH_TEXT,
    values: [
      JSON.stringify(
        rows.map((v) => ({
          study_id: v.studyId,
          version_id: v.versionId,
          session_token: v.sessionToken,
          invitee_id: v.inviteeId,
          external_id: v.externalId,
          panel_key: v.panelKey,
          block: v.block,
          plan: v.plan,
          device: v.device,
          language: v.language,
        })),
      ),
    ],
  });
  const made = new Map(r.rows.map((m) => [m.session_token, m]));
  return rows.map((v) => {
    const m = made.get(v.sessionToken);
    if (!m) throw new Error('a started respondent was not inserted');
    return startedRow(v, { id: m.id, startedAt: m.started_at });
  });
}

export async function insertRespondent(
  db: DbOrTx,
  params: {
    studyId: string;
    versionId: string;
    sessionToken: string;
    inviteeId?: string | null;
    externalId?: string | null;
    panelKey?: string | null;
    block: number;
    plan: unknown;
    device?: string;
    language?: string;
    status?: 'in_progress' | 'completed' | 'screened_out' | 'over_quota';
    startedAt?: Date;
    simulatedTruth?: unknown;
  },
) {
  // A session start (status, start time and the rest by default): the prepared statement.
  const { status, startedAt, simulatedTruth, device, language } = params;
  if (status === undefined && startedAt === undefined && simulatedTruth === undefined)
    if (device !== undefined && language !== undefined) {
      const query = preparedFor(insertStartedCache, db, () => insertStarted(db));
      const values = {
        ...params,
        inviteeId: params.inviteeId ?? null,
        externalId: params.externalId ?? null,
        panelKey: params.panelKey ?? null,
      };
      const [made] = await query.execute(values);
      return startedRow({ ...values, device, language }, made);
    }
  const [row] = await db.insert(respondents).values(params).returning(respondentColumns);
  return row as RespondentRow;
}

/** The respondents of a study that `where` picks, with the columns every caller reads. */
const selectStudyRespondents = (db: DbOrTx, studyId: string, where: SQL) =>
  db
    .select(respondentColumns)
    .from(respondents)
    .where(and(eq(respondents.studyId, studyId), where));

export async function getRespondentByToken(
  db: DbOrTx,
  params: { studyId: string; sessionToken: string; forUpdate?: boolean },
) {
  const q = selectStudyRespondents(
    db,
    params.studyId,
    eq(respondents.sessionToken, params.sessionToken),
  );
  const [row] = params.forUpdate ? await q.for('update') : await q;
  return (row as RespondentRow | undefined) ?? null;
}

export async function getRespondentByInvitee(
  db: DbOrTx,
  params: { studyId: string; inviteeId: string },
) {
  const [row] = await selectStudyRespondents(
    db,
    params.studyId,
    eq(respondents.inviteeId, params.inviteeId),
  )
    .orderBy(sql`${respondents.startedAt} desc`)
    .limit(1);
  return (row as RespondentRow | undefined) ?? null;
}

/** The respondent a de-duplicated panel id started in the study, if any. */
export async function getRespondentByPanelKey(
  db: DbOrTx,
  params: { studyId: string; panelKey: string },
) {
  const [row] = await selectStudyRespondents(
    db,
    params.studyId,
    eq(respondents.panelKey, params.panelKey),
  ).limit(1);
  return (row as RespondentRow | undefined) ?? null;
}

/** Ends a session; with onlyInProgress, only one still answering (null if it had ended). */
export async function finishRespondent(
  db: DbOrTx,
  params: {
    id: string;
    status: 'completed' | 'screened_out' | 'over_quota';
    finishedAt: Date;
    durationMs: number;
    onlyInProgress?: boolean;
  },
) {
  const [row] = await db
    .update(respondents)
    .set({ status: params.status, finishedAt: params.finishedAt, durationMs: params.durationMs })
    .where(
      and(
        eq(respondents.id, params.id),
        params.onlyInProgress ? eq(respondents.status, 'in_progress') : undefined,
      ),
    )
    .returning(respondentColumns);
  return (row as RespondentRow | undefined) ?? null;
}

/** A respondent's status and answers (the rare path: a write the unique indexes refused). */
export async function getRespondentAnswerState(db: DbOrTx, params: { respondentId: string }) {
  const [row] = await db
    .select({
      status: respondents.status,
      answers: sql<Array<{ clientId: string; screenKey: string; value: unknown }>>`coalesce(
        (select json_agg(json_build_object('clientId', a.client_id, 'screenKey', a.screen_key,
                'value', a.value)) from answers a where a.respondent_id = respondents.id),
        '[]'::json)`,
    })
    .from(respondents)
    .where(eq(respondents.id, params.respondentId));
  return row ?? null;
}

export async function countCompletes(db: DbOrTx, params: { studyId: string }) {
  return db.$count(
    respondents,
    and(eq(respondents.studyId, params.studyId), eq(respondents.status, 'completed')),
  );
}

/**
 * Everything saving an answer needs, in one round trip: the study behind the link, the
 * respondent holding the session token (null when the token is not theirs), and the screens
 * they have answered. Read without locks; the write that follows is guarded by unique indexes.
 */
export async function getAnswerContext(
  db: DbOrTx,
  params: ({ publicId: string } | { studyId: string }) & { sessionToken: string },
) {
  const [row] = await db
    .select({
      study: {
        id: studies.id,
        teamId: studies.teamId,
        status: studies.status,
        settings: studies.settings,
        archivedAt: studies.archivedAt,
      },
      respondent: respondentColumns,
      answered: sql<string[]>`coalesce((select array_agg(a.screen_key) from answers a
        where a.respondent_id = respondents.id), '{}')`,
    })
    .from(studies)
    .leftJoin(
      respondents,
      and(eq(respondents.studyId, studies.id), eq(respondents.sessionToken, params.sessionToken)),
    )
    .where(
      'publicId' in params ? eq(studies.publicId, params.publicId) : eq(studies.id, params.studyId),
    );
  if (!row) return null;
  return {
    study: row.study,
    respondent: row.respondent as RespondentRow | null,
    answered: new Set(row.answered ?? []),
  };
}

/**
 * Sets the respondent's language, only while they have no answer: the check is part of the
 * write, so an answer arriving at the same moment cannot end up in another language.
 */
export async function setRespondentLanguage(
  db: DbOrTx,
  params: { id: string; language: string },
): Promise<boolean> {
  const rows = await db
    .update(respondents)
    .set({ language: params.language })
    .where(
      and(
        eq(respondents.id, params.id),
        sql`not exists (select 1 from answers a where a.respondent_id = ${respondents.id})`,
      ),
    )
    .returning({ id: respondents.id });
  return rows.length > 0;
}
