/** Applies the committed migrations (also done automatically when the server starts). */
import { createDb, migrateDb } from '../db/client';
import { loadEnv } from '../server/env';

const { db, pool } = createDb(loadEnv().DATABASE_URL, 2);
await migrateDb(db);
await pool.end();
console.log('migrations applied');
