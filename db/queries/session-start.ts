/**
 * The first statement of a session start: everything the start decides on, in one round trip
 * instead of up to four — the study behind the link with its latest version, its completes
 * when it has a quota of them, the respondent the phone's session token, the personal link's
 * invitee or the de-duplicated panel id already started, and, when none of those resumes a
 * session and the study is live, a place in the least-filled block of the latest version
 * (the atomic counter of respondent-blocks.ts, committed without waiting for the log flush as
 * assignBlock does on the pool, and for the same reason). The service then decides exactly as
 * before from what was read, and gives the place back whenever it does not make a respondent.
 *
 * A named prepared statement on the pool (parsed and planned once per connection); the text
 * is fixed and every value travels as a parameter. Tenant: the survey's public id is the
 * scope (respondents have no team); every other row is reached through the study it found.
 */
import type { Db } from '../client';
import type { studies } from '../schema/studies';
import type { RespondentRow } from './respondents';
import { COMMIT_WITHOUT_WAITING, TAKE_LEAST_FILLED } from './respondent-blocks';

const STATEMENT = 'session_start_read_v2';

/** RespondentRow as JSON (its times as ISO text). */
const RESPONDENT = `json_build_object('id', r.id, 'studyId', r.study_id, 'versionId', r.version_id,
         'sessionToken', r.session_token, 'inviteeId', r.invitee_id, 'externalId', r.external_id,
         'block', r.block, 'plan', r.plan, 'status', r.status, 'startedAt', r.started_at,
         'finishedAt', r.finished_at, 'durationMs', r.duration_ms, 'language', r.language)`;

/*
 * $1 public id, $2 session token or null, $3 personal link token or null, $4 the link's
 * parameters (jsonb).
 * The panel key follows the settings' defaults (panelParam 'pid', dedupePanelIds on) and is
 * returned, so that the service can check it against the settings it validates itself.
 * The respondent found comes in the order the service resumes them: this phone's own session,
 * else the invitee's, else the panel id's (only without a personal link).
 */
const TEXT = `
with s as (
  select s.id, s.team_id, s.name, s.public_title, s.status, s.settings, s.current_version,
         s.archived_at,
         (select sv.id from study_versions sv where sv.study_id = s.id
           order by sv.version desc limit 1) as latest_version_id,
         case when coalesce(s.settings->'dedupePanelIds', 'true'::jsonb) = 'true'::jsonb
              then nullif($4::jsonb ->> coalesce(s.settings->>'panelParam', 'pid'), '')
         end as panel_key
    from studies s
   where s.public_id = $1
),
inv as (
  select i.id, i.external_id
    from invitees i join s on i.study_id = s.id
   where $3::text is not null and i.token = $3
),
found as (
  select * from (
    select 1 as rank, ${RESPONDENT} as respondent
      from respondents r join s on r.study_id = s.id
     where $2::text is not null and r.session_token = $2
    union all
    select 2, ${RESPONDENT}
      from respondents r join s on r.study_id = s.id join inv on r.invitee_id = inv.id
    union all
    select 3, ${RESPONDENT}
      from respondents r join s on r.study_id = s.id
     where $3::text is null and s.panel_key is not null and r.panel_key = s.panel_key
  ) f
  order by f.rank
  limit 1
),
b as (
  update respondent_block_counts
     set ${TAKE_LEAST_FILLED}
    from ${COMMIT_WITHOUT_WAITING}, s
   where respondent_block_counts.version_id = s.latest_version_id
     and s.status = 'live' and s.archived_at is null
     and not exists (select 1 from found)
     and ($3::text is null or exists (select 1 from inv))
  returning respondent_block_counts.last_block
)
select json_build_object(
         'study', json_build_object('id', s.id, 'teamId', s.team_id, 'name', s.name,
           'publicTitle', s.public_title, 'status', s.status, 'settings', s.settings,
           'currentVersion', s.current_version, 'archivedAt', s.archived_at,
           'latestVersionId', s.latest_version_id),
         'panelKey', s.panel_key,
         'completes',
         case when jsonb_typeof(s.settings->'quotaCompletes') = 'number' and s.status = 'live'
              then (select count(*) from respondents c
                     where c.study_id = s.id and c.status = 'completed')
         end,
         'invitee', case when inv.id is not null
                         then json_build_object('id', inv.id, 'externalId', inv.external_id) end,
         'foundBy', found.rank,
         'respondent', found.respondent,
         'block', (select last_block from b)) as start
  from s
  left join inv on true
  left join found on true`;

/*
 * One JSON column rather than thirty: node-postgres builds a row template and looks up a
 * parser per column for every result, which cost more than parsing the JSON (profile).
 */
type Json<T> = {
  [K in keyof T]: T[K] extends Date ? string : T[K] extends Date | null ? string | null : T[K];
};
type Row = {
  start: {
    study: Json<SessionStartRead['study']>;
    panelKey: string | null;
    completes: number | null;
    invitee: SessionStartRead['invitee'];
    foundBy: 1 | 2 | 3 | null;
    respondent: Json<RespondentRow> | null;
    block: number | null;
  };
};

export type SessionStartRead = {
  /** As getStudyByPublicId reads it. */
  study: {
    id: string;
    teamId: string;
    name: string;
    publicTitle: string;
    status: (typeof studies.$inferSelect)['status'];
    settings: unknown;
    currentVersion: number;
    archivedAt: Date | null;
    latestVersionId: string | null;
  };
  /** Respondents that completed, read only for a live study with a quota of completes. */
  completes: number | null;
  /** The panel key the statement looked for (settings' defaults applied), or null. */
  panelKey: string | null;
  /** The personal link's invitee (null without one, or when the token is not this study's). */
  invitee: { id: string; externalId: string | null } | null;
  /** Who resumes: this phone's own session, the invitee's or the panel id's respondent. */
  found: { by: 'token' | 'invitee' | 'panel'; respondent: RespondentRow } | null;
  /** The block place taken (1-based), or null when none was. */
  block: number | null;
};

const FOUND_BY = [null, 'token', 'invitee', 'panel'] as const;

const dateOf = (iso: string | null) => (iso === null ? null : new Date(iso));

/** Null when no study has this public id. */
export async function readSessionStart(
  db: Db,
  params: {
    publicId: string;
    sessionToken: string | null;
    inviteToken: string | null;
    linkParams: Record<string, string>;
  },
): Promise<SessionStartRead | null> {
  const r = await db.$client.query<Row>({
    name: STATEMENT,
    text: TEXT,
    values: [
      params.publicId,
      params.sessionToken,
      params.inviteToken,
      JSON.stringify(params.linkParams),
    ],
  });
  const row = r.rows[0]?.start;
  if (!row) return null;
  const by = row.foundBy === null ? null : FOUND_BY[row.foundBy];
  const found = row.respondent;
  return {
    study: { ...row.study, archivedAt: dateOf(row.study.archivedAt) },
    completes: row.completes,
    panelKey: row.panelKey,
    invitee: row.invitee,
    found:
      by && found
        ? {
            by,
            respondent: {
              ...found,
              startedAt: new Date(found.startedAt),
              finishedAt: dateOf(found.finishedAt),
            },
          }
        : null,
    block: row.block,
  };
}
