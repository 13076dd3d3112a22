/**
 * Run by scripts/e2e-server.sh while the demo seed runs beside it: returns once the seed has
 * committed the demo team with one account per role (the seed migrates first, so the tables
 * may not exist yet), so the server only answers its health check when every journey can sign
 * in. Exits non-zero as soon as the seed has failed (its marker file, given as the argument).
 */
import fs from 'node:fs';
import pg from 'pg';
import { DEMO_TEAM_NAME } from '../../server/seed/demo-accounts';
import { roles } from '../../shared/permissions';

const failedMarker = process.argv[2];
if (!failedMarker || !process.env.DATABASE_URL)
  throw new Error('usage: DATABASE_URL=… wait-for-demo-accounts.ts <seed failure marker>');

async function demoMembers(): Promise<number> {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  try {
    await db.connect();
    const { rows } = await db.query(
      `select count(*)::int as n from memberships m join teams t on t.id = m.team_id
        where t.name = $1`,
      [DEMO_TEAM_NAME],
    );
    return rows[0].n as number;
  } catch {
    return 0; // not migrated yet
  } finally {
    await db.end().catch(() => {});
  }
}

const deadline = Date.now() + 240_000;
while ((await demoMembers()) < roles.length) {
  if (fs.existsSync(failedMarker)) {
    console.error('the demo seed failed before its accounts were written');
    process.exit(1);
  }
  if (Date.now() > deadline) {
    console.error('the demo accounts were not written within 240 s');
    process.exit(1);
  }
  await new Promise((r) => setTimeout(r, 200));
}
