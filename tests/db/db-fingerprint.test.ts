/**
 * The fingerprint that the matrix, fuzz and origin tests compare before and after refused
 * requests (tests/support/db-fingerprint.ts): it must change with every insert, update and
 * delete, an update that writes the same values included, and stay put for what it leaves out
 * (the "last seen" stamp of sign-in sessions, rate-limit counters) and for a rolled-back write.
 */
import { describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { useTestApp } from '../support/test-app';
import { databaseFingerprint } from '../support/db-fingerprint';

const t = useTestApp({}, { signIn: 'owner' });

const run = (statement: string) => t.deps.db.execute(sql.raw(statement));

describe('databaseFingerprint', () => {
  it('changes with an insert, an update (even to the same values) and a delete', async () => {
    let before = await databaseFingerprint(t.deps.db);
    await run(`insert into teams (name) values ('Fingerprint probe')`);
    let after = await databaseFingerprint(t.deps.db);
    expect(after.teams).not.toBe(before.teams);
    expect({ ...after, teams: '' }).toEqual({ ...before, teams: '' });

    before = after;
    await run(`update teams set name = name where name = 'Fingerprint probe'`);
    after = await databaseFingerprint(t.deps.db);
    expect(after.teams).not.toBe(before.teams);

    before = after;
    await run(`delete from teams where name = 'Fingerprint probe'`);
    expect((await databaseFingerprint(t.deps.db)).teams).not.toBe(before.teams);
  });

  it("sees a session's revocation but not its last-seen stamp", async () => {
    const before = await databaseFingerprint(t.deps.db);
    await run(`update user_sessions set last_seen_at = now() + interval '1 minute'`);
    expect(await databaseFingerprint(t.deps.db)).toEqual(before);
    await run(`update user_sessions set device = device || ' (probe)'`);
    expect((await databaseFingerprint(t.deps.db)).user_sessions).not.toBe(before.user_sessions);
  });

  it('stays put for a rolled-back write and a row lock', async () => {
    const before = await databaseFingerprint(t.deps.db);
    await expect(
      t.deps.db.transaction(async (tx) => {
        await tx.execute(sql`update teams set name = 'Renamed' where id = ${t.teamId}`);
        await tx.execute(sql`select id from teams where id = ${t.teamId} for update`);
        throw new Error('rolled back');
      }),
    ).rejects.toThrow('rolled back');
    await t.deps.db.transaction(async (tx) => {
      await tx.execute(sql`select id from teams where id = ${t.teamId} for update`);
    });
    expect(await databaseFingerprint(t.deps.db)).toEqual(before);
  });
});
