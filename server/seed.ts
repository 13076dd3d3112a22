/**
 * Migrates the database and fills it with the demo data (idempotent: a second run changes
 * nothing that is already there). Prints the demo sign-ins.
 */
import path from 'node:path';
import { createDb, migrateDb } from '../db/client';
import { seedDemoAccounts } from './seed/demo-accounts';
import { ensureDemoStudy } from './seed/demo-study';
import { ensureDemoResponses } from './seed/demo-responses';
import { loadEnv } from './env';

async function main() {
  const env = loadEnv();
  const { db, pool } = createDb(env.DATABASE_URL, 4);
  try {
    await migrateDb(db);
    const credentialsFile =
      process.env.CW_DEMO_CREDENTIALS_FILE ?? path.join(env.DATA_DIR, 'demo-credentials.json');
    const { credentials, teamId, ownerId } = await seedDemoAccounts(db, credentialsFile);
    const studyId = await ensureDemoStudy(db, { teamId, ownerId });
    const responses = await ensureDemoResponses(db, { studyId });
    if (responses.created > 0)
      console.log(`  Demo study: ${responses.created} synthetic respondents simulated and stored.`);
    console.log('\n  DEMO CREDENTIALS (local demo data only; not for real studies)');
    for (const c of credentials)
      console.log(`    ${c.role.padEnd(8)} ${c.email.padEnd(34)} ${c.password}`);
    console.log('');
  } finally {
    await pool.end();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
