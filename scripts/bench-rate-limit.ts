/**
 * What a shared rate-limit counter costs on the respondent answer path. Counts N hits from 500
 * respondent sessions (keys apart, as the per-session limiter sees them) at a concurrency of 50,
 * three ways side by side in one run: the in-memory store (one process only, the old set-up),
 * the PostgreSQL store on the UNLOGGED counters table we use, and the same store on an ordinary
 * (logged) table. Prints hits per second and per-hit latency p50/p99 with the load average;
 * `--json` prints one JSON line. Uses a scratch database of its own, dropped at the end.
 * Usage: npm run bench:rate-limit [-- --hits 20000] [-- --json]
 */
import os from 'node:os';
import { MemoryStore, type Options, type Store } from 'express-rate-limit';
import { createDb, migrateDb } from '../db/client';
import { adminUrl, createScratchDatabase } from './lib/scratch-db';
import { PostgresRateLimitStore, RATE_LIMIT_TABLE } from '../server/middleware/rate-limit-store';
import { readBenchCli, runBench } from './lib/bench-cli';

const { asJson, number } = readBenchCli();
const HITS = number('hits', 20_000);
const SESSIONS = 500;
const CONCURRENCY = 50;

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
  const scratch = await createScratchDatabase(adminUrl(), 'cw_bench_rl');
  const { db, pool } = createDb(scratch.url, 20);
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
    await scratch.drop();
  }
}

runBench(main);
