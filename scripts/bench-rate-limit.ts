/**
 * What a shared rate-limit counter costs on the respondent answer path. Counts N hits from 500
 * respondent sessions (keys apart, as the per-session limiter sees them) at a concurrency of 50,
 * three ways side by side in one run: the in-memory store (one process only, the old set-up),
 * the PostgreSQL store on the UNLOGGED counters table we use, and the same store on an ordinary
 * (logged) table. Prints hits per second and per-hit latency p50/p99 with the load average;
 * `--json` prints one JSON line. Uses a scratch database of its own, dropped at the end.
 * Usage: npm run bench:rate-limit [-- --hits 20000] [-- --json]
 */
import { execFileSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { MemoryStore, type Options, type Store } from 'express-rate-limit';
import { createDb, migrateDb } from '../db/client';
import { databaseUrl, dropDatabase } from '../tests/support/template-db';
import { PostgresRateLimitStore, RATE_LIMIT_TABLE } from '../server/middleware/rate-limit-store';

const args = process.argv.slice(2);
const asJson = args.includes('--json');
const hitsArg = args.indexOf('--hits');
const HITS = hitsArg >= 0 ? Number(args[hitsArg + 1]) : 20_000;
const SESSIONS = 500;
const CONCURRENCY = 50;
const root = path.resolve(import.meta.dirname, '..');

function adminUrl(): string {
  if (process.env.DATABASE_URL) return process.env.DATABASE_URL;
  execFileSync(path.join(root, 'scripts/pg.sh'), ['start'], {
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  return execFileSync(path.join(root, 'scripts/pg.sh'), ['url', 'postgres']).toString().trim();
}

const quantile = (sorted: number[], q: number) =>
  sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))] ?? 0;

async function measure(store: Store) {
  store.init?.({ limit: 1_000_000, windowMs: 15 * 60_000 } as Options);
  const latencies: number[] = [];
  let next = 0;
  const started = performance.now();
  await Promise.all(
    Array.from({ length: CONCURRENCY }, async () => {
      for (let i = next++; i < HITS; i = next++) {
        const t0 = performance.now();
        await store.increment(`session:bench-${i % SESSIONS}`);
        latencies.push(performance.now() - t0);
      }
    }),
  );
  const seconds = (performance.now() - started) / 1000;
  latencies.sort((a, b) => a - b);
  return {
    hitsPerSecond: Math.round(HITS / seconds),
    p50Ms: Number(quantile(latencies, 0.5).toFixed(3)),
    p99Ms: Number(quantile(latencies, 0.99).toFixed(3)),
  };
}

async function main() {
  const admin = adminUrl();
  const name = `cw_bench_rl_${randomBytes(4).toString('hex')}`;
  const c = new pg.Client({ connectionString: admin });
  await c.connect();
  await c.query(`create database "${name}"`);
  await c.end();
  const { db, pool } = createDb(databaseUrl(admin, name), 20);
  pool.on('error', () => {});
  try {
    await migrateDb(db);
    const memory = await measure(new MemoryStore());
    const unlogged = await measure(new PostgresRateLimitStore(pool, 'bench-unlogged'));
    // The same counters in an ordinary table: every hit also writes the write-ahead log.
    await pool.query(`alter table ${RATE_LIMIT_TABLE} set logged`);
    const logged = await measure(new PostgresRateLimitStore(pool, 'bench-logged'));
    const result = {
      bench: 'rate-limit',
      hits: HITS,
      sessions: SESSIONS,
      concurrency: CONCURRENCY,
      memory,
      postgresUnlogged: unlogged,
      postgresLogged: logged,
      loadavg: os.loadavg().map((x) => Number(x.toFixed(2))),
      cpus: os.cpus().length,
    };
    if (asJson) console.log(JSON.stringify(result));
    else {
      console.log(
        `rate-limit counters: ${HITS} hits from ${SESSIONS} sessions, ${CONCURRENCY} at a time`,
      );
      for (const [k, v] of Object.entries({
        memory,
        postgresUnlogged: unlogged,
        postgresLogged: logged,
      }))
        console.log(
          `  ${k.padEnd(17)} ${String(v.hitsPerSecond).padStart(7)} hits/s  p50 ${v.p50Ms} ms  p99 ${v.p99Ms} ms`,
        );
      console.log(`  load average ${result.loadavg.join(' ')} on ${result.cpus} cores`);
    }
  } finally {
    await pool.end();
    await dropDatabase(admin, name);
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
