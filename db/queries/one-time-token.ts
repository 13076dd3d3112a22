/**
 * Consuming a one-time token (e-mail confirmations, password resets): the row is found by the
 * token's hash and marked used in the same statement, so two requests with one token cannot
 * both succeed. Tenant: none applies; these tokens belong to a user account, and the token is
 * the proof.
 */
import { and, eq, gt, isNull } from 'drizzle-orm';
import type { PgColumn, PgTable, PgUpdateSetSource } from 'drizzle-orm/pg-core';
import type { DbOrTx } from '../client';

type OneTimeTokenTable = PgTable & {
  tokenHash: PgColumn;
  usedAt: PgColumn;
  expiresAt: PgColumn;
  userId: PgColumn;
};

/** Returns the token's user id, or null when the token is unknown, used or expired. */
export async function consumeOneTimeToken<T extends OneTimeTokenTable>(
  db: DbOrTx,
  table: T,
  params: { tokenHash: string; now: Date },
): Promise<string | null> {
  const [row] = (await db
    .update(table)
    .set({ usedAt: params.now } as PgUpdateSetSource<T>)
    .where(
      and(
        eq(table.tokenHash, params.tokenHash),
        isNull(table.usedAt),
        gt(table.expiresAt, params.now),
      ),
    )
    .returning({ userId: table.userId })) as Array<{ userId: string }>;
  return row?.userId ?? null;
}
