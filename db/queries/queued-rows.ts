/**
 * The orphan sweep's two queries (server/jobs/orphan-sweep.ts), written once for every table
 * whose rows wait in a 'queued' status: design jobs, runs and the mail outbox. The sweep takes
 * ids from these tables' own rows, not from a request, so no team filter applies.
 */
import { and, eq, inArray, lt } from 'drizzle-orm';
import type { PgColumn, PgTable, PgUpdateSetSource } from 'drizzle-orm/pg-core';
import type { DbOrTx } from '../client';

type QueuedTable = PgTable & { id: PgColumn; status: PgColumn; createdAt: PgColumn };

/** Rows still queued that were created before `createdBefore`. */
export async function listQueuedRows(
  db: DbOrTx,
  table: QueuedTable,
  createdBefore: Date,
): Promise<Array<{ id: string; createdAt: Date }>> {
  return (await db
    .select({ id: table.id, createdAt: table.createdAt })
    .from(table as PgTable)
    .where(and(eq(table.status, 'queued'), lt(table.createdAt, createdBefore)))) as Array<{
    id: string;
    createdAt: Date;
  }>;
}

/** Sets `failed` on these rows if they are still queued; returns the ids it changed. */
export async function failQueuedRows<T extends QueuedTable>(
  db: DbOrTx,
  table: T,
  ids: string[],
  failed: PgUpdateSetSource<T>,
): Promise<string[]> {
  const rows = (await db
    .update(table)
    .set(failed)
    .where(and(inArray(table.id, ids), eq(table.status, 'queued')))
    .returning({ id: table.id })) as Array<{ id: string }>;
  return rows.map((r) => r.id);
}
