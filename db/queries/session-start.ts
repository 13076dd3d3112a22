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

const STATEMENT = 'session_start_read_v1';

/** The respondent columns of RespondentRow, read as r_<column>. */
const RESPONDENT = `r.id as r_id, r.study_id as r_study_id, r.version_id as r_version_id,
       r.session_token as r_session_token, r.invitee_id as r_invitee_id,
       r.external_id as r_external_id, r.block as r_block, r.plan as r_plan,
       r.status as r_status, r.started_at as r_started_at, r.finished_at as r_finished_at,
       r.duration_ms as r_duration_ms, r.language as r_language`;

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
    select 1 as rank, ${RESPONDENT}
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
select s.id, s.team_id, s.name, s.public_title, s.status, s.settings, s.current_version,
       s.archived_at, s.latest_version_id, s.panel_key,
       case when jsonb_typeof(s.settings->'quotaCompletes') = 'number' and s.status = 'live'
            then (select count(*)::int from respondents c
                   where c.study_id = s.id and c.status = 'completed')
       end as completes,
       inv.id as inv_id, inv.external_id as inv_external_id,
       found.*,
       (select last_block from b) as block
  from s
  left join inv on true
  left join found on true`;

type Row = {
  id: string;
  team_id: string;
  name: string;
  public_title: string;
  status: (typeof studies.$inferSelect)['status'];
  settings: unknown;
  current_version: number;
  archived_at: Date | null;
  latest_version_id: string | null;
  panel_key: string | null;
  completes: number | null;
  inv_id: string | null;
  inv_external_id: string | null;
  rank: number | null;
  block: number | null;
} & { [K in `r_${string}`]: unknown };

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

function respondentOf(row: Row): RespondentRow {
  return {
    id: row.r_id as string,
    studyId: row.r_study_id as string,
    versionId: row.r_version_id as string,
    sessionToken: row.r_session_token as string,
    inviteeId: row.r_invitee_id as string | null,
    externalId: row.r_external_id as string | null,
    block: row.r_block as number,
    plan: row.r_plan,
    status: row.r_status as RespondentRow['status'],
    startedAt: row.r_started_at as Date,
    finishedAt: row.r_finished_at as Date | null,
    durationMs: row.r_duration_ms as number | null,
    language: row.r_language as string,
  };
}

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
  const row = r.rows[0];
  if (!row) return null;
  const by = row.rank === null ? null : FOUND_BY[row.rank];
  return {
    study: {
      id: row.id,
      teamId: row.team_id,
      name: row.name,
      publicTitle: row.public_title,
      status: row.status,
      settings: row.settings,
      currentVersion: row.current_version,
      archivedAt: row.archived_at,
      latestVersionId: row.latest_version_id,
    },
    completes: row.completes,
    panelKey: row.panel_key,
    invitee: row.inv_id === null ? null : { id: row.inv_id, externalId: row.inv_external_id },
    found: by ? { by, respondent: respondentOf(row) } : null,
    block: row.block,
  };
}
