/**
 * Block assignment by an atomic counter per version (schema: respondentBlockCounts). One
 * UPDATE reads the row's latest counts, takes the least-filled block (ties to the lowest
 * number) and stores the increment; concurrent session starts queue on that row for the
 * length of one statement, so blocks stay exactly balanced however many arrive at once.
 */
import { sql } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { respondentBlockCounts as counts, respondents } from '../schema/fieldwork';
import { studyVersions } from '../schema/studies';

/** 1-based index of the smallest element of the row's `filling`, ties to the lowest. */
const leastFilled = sql`(select v.i from unnest(filling) with ordinality v(c, i)
                          order by v.c, v.i limit 1)`;

async function takeLeastFilled(db: DbOrTx, versionId: string): Promise<number | null> {
  const r = await db.execute<{ block: number }>(sql`
    update ${counts}
       set filling = (select array_agg(case when u.i = ${leastFilled} then u.c + 1 else u.c end
                                       order by u.i)
                        from unnest(filling) with ordinality u(c, i)),
           last_block = ${leastFilled}
     where version_id = ${versionId}
    returning last_block as block`);
  return r.rows[0]?.block ?? null;
}

/**
 * Creates the counter of a version that has none yet, counted from its respondents (for
 * versions frozen before the counters existed, or after resetBlockCounts).
 */
export async function ensureBlockCounts(db: DbOrTx, params: { versionId: string; blocks: number }) {
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

/** Takes a place in the least-filled block of the version and returns the block number. */
export async function assignBlock(
  db: DbOrTx,
  params: { versionId: string; blocks: number },
): Promise<number> {
  const block = await takeLeastFilled(db, params.versionId);
  if (block !== null) return block;
  await ensureBlockCounts(db, params);
  const retried = await takeLeastFilled(db, params.versionId);
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
