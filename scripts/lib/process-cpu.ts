/**
 * CPU time spent by processes during a benchmark phase, read from /proc (Linux): user + system
 * time of the server process (all its threads) and of the PostgreSQL backends serving the
 * benchmark's database. Unlike latencies, CPU time per request hardly depends on what else the
 * shared machine runs, so it shows where a request's cost goes even on a busy machine.
 */
import fs from 'node:fs';
import type pg from 'pg';

/** Clock ticks per second of /proc/<pid>/stat times (USER_HZ; 100 on Linux). */
const TICKS_PER_SECOND = 100;

function cpuMsOf(pid: number): number | null {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
    // Fields after the command name (which may hold spaces) start at its closing parenthesis.
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    const utime = Number(fields[11]);
    const stime = Number(fields[12]);
    return ((utime + stime) * 1000) / TICKS_PER_SECOND;
  } catch {
    return null; // gone, or no /proc here
  }
}

async function backendPids(pool: pg.Pool, database: string): Promise<number[]> {
  const r = await pool.query<{ pid: number }>(
    'select pid from pg_stat_activity where datname = $1 and pid <> pg_backend_pid()',
    [database],
  );
  return r.rows.map((row) => row.pid);
}

/**
 * Starts counting; stop() returns the CPU milliseconds of the server and of the database's
 * backends since then (backends that ended meanwhile are missed; pooled ones live on).
 */
export async function measureCpu(serverPid: number, pool: pg.Pool, database: string) {
  const before = new Map<number, number>();
  const server0 = cpuMsOf(serverPid);
  for (const pid of await backendPids(pool, database)) before.set(pid, cpuMsOf(pid) ?? 0);
  return {
    async stop() {
      const server1 = cpuMsOf(serverPid);
      let database1 = 0;
      for (const pid of new Set([...before.keys(), ...(await backendPids(pool, database))])) {
        const now = cpuMsOf(pid);
        if (now !== null) database1 += now - (before.get(pid) ?? 0);
      }
      return {
        serverMs: server0 === null || server1 === null ? null : Math.round(server1 - server0),
        databaseMs: Math.round(database1),
      };
    },
  };
}
