/**
 * Block assignment by an atomic counter per version (schema: respondentBlockCounts). One
 * UPDATE reads the row's latest counts, takes the least-filled block (ties to the lowest
 * number) and stores the increment; concurrent session starts queue on that row for the
 * length of one statement, so blocks stay exactly balanced however many arrive at once.
 * Tenant: the version id comes from the respondent's own study (their link); counters hold
 * nothing personal.
 */
import { sql } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { respondentBlockCounts as counts, respondents } from '../schema/fieldwork';
import { studyVersions } from '../schema/studies';

/** 1-based index of the smallest element of the row's `filling`, ties to the lowest. */
const LEAST_FILLED = `(select v.i from unnest(filling) with ordinality v(c, i)
                        order by v.c, v.i limit 1)`;

/**
 * The SET list of an UPDATE of a counter row that takes a place in its least-filled block;
 * `returning last_block` reads the block back. Plain text, so that the session start's own
 * statement (session-start.ts) takes its place exactly as assignBlock does.
 */
export const TAKE_LEAST_FILLED = `filling = (select array_agg(case when u.i = ${LEAST_FILLED}
                                                   then u.c + 1 else u.c end order by u.i)
                      from unnest(filling) with ordinality u(c, i)),
       last_block = ${LEAST_FILLED}`;

/*
 * Every session start of a version updates this one row, and a row lock is held until commit.
 * A synchronous commit waits for the write-ahead log to reach the disk (an fdatasync, 1–3 ms
 * here), so starts would queue one flush at a time behind each other. On its own statement
 * (outside a caller's transaction) the update therefore commits without waiting for the flush
 * (set_config(…, true) lasts until the end of this statement's implicit transaction). Nothing
 * acknowledged is lost by that: the respondent that takes the place is inserted afterwards by
 * a synchronous commit, and the log is flushed in order, so once the respondent is on disk so
 * is this increment. A crash before that loses only a place whose respondent never existed.
 */
export const COMMIT_WITHOUT_WAITING = `(select set_config('synchronous_commit', 'off', true)) as cfg`;
const commitWithoutWaiting = sql.raw(`from ${COMMIT_WITHOUT_WAITING}`);

async function takeLeastFilled(
  db: DbOrTx,
  versionId: string,
  standalone: boolean,
): Promise<number | null> {
  const r = await db.execute<{ block: number }>(sql`
    update ${counts}
       set ${sql.raw(TAKE_LEAST_FILLED)}
      ${standalone ? commitWithoutWaiting : sql``}
     where version_id = ${versionId}
    returning last_block as block`);
  return r.rows[0]?.block ?? null;
}

/**
 * Creates the counter of a version that has none yet, counted from its respondents (for
 * versions frozen before the counters existed, or after resetBlockCounts).
 */
async function ensureBlockCounts(db: DbOrTx, params: { versionId: string; blocks: number }) {
  await db.execute(sql`
    insert into ${counts} (version_id, filling)
    select ${params.versionId}::uuid, array_agg((
             select count(*) from ${respondents}
              where ${respondents.versionId} = ${params.versionId}
                and ${respondents.block} = b
                and ${respondents.status} in ('in_progress', 'completed'))::int order by b)
      from generate_series(1, ${params.blocks}::int) as b
    on conflict do nothing`);
}

/**
 * Takes a place in the least-filled block of the version and returns the block number.
 * `standalone`: db is the pool, not a transaction — the update then commits without waiting
 * for the log flush (see commitWithoutWaiting); inside a transaction it never changes how the
 * caller's transaction commits.
 */
export async function assignBlock(
  db: DbOrTx,
  params: { versionId: string; blocks: number; standalone?: boolean },
): Promise<number> {
  const standalone = params.standalone ?? false;
  const block = await takeLeastFilled(db, params.versionId, standalone);
  if (block !== null) return block;
  await ensureBlockCounts(db, params);
  const retried = await takeLeastFilled(db, params.versionId, standalone);
  if (retried === null) throw new Error(`version ${params.versionId} has no block counter`);
  return retried;
}

/** Gives a place back: its respondent stopped counting (screened out, over quota, not created). */
export async function releaseBlock(db: DbOrTx, params: { versionId: string; block: number }) {
  await db.execute(sql`
    update ${counts} set filling[${params.block}::int] = greatest(filling[${params.block}::int] - 1, 0)
     where version_id = ${params.versionId}`);
}

/**
 * Forgets the counters of a study's versions; they are counted again from the respondents at
 * the next session start (after respondents were deleted in bulk, e.g. by the demo seed).
 */
export async function resetBlockCounts(db: DbOrTx, params: { studyId: string }) {
  await db.execute(sql`
    delete from ${counts} where version_id in
      (select ${studyVersions.id} from ${studyVersions}
        where ${studyVersions.studyId} = ${params.studyId})`);
}
