/**
 * CPU time spent by processes during a benchmark phase, read from /proc (Linux): user + system
 * time of the server process and its child processes (all their threads: several web
 * processes under WEB_INSTANCES) and of the PostgreSQL backends serving the benchmark's
 * database. Unlike latencies, CPU time per request hardly depends on what else the shared
 * machine runs, so it shows where a request's cost goes even on a busy machine.
 */
import fs from 'node:fs';
import type pg from 'pg';

/** Clock ticks per second of /proc/<pid>/stat times (USER_HZ; 100 on Linux). */
const TICKS_PER_SECOND = 100;

function statFields(pid: number): string[] | null {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
    // Fields after the command name (which may hold spaces) start at its closing parenthesis.
    return stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  } catch {
    return null; // gone, or no /proc here
  }
}

function cpuMsOf(pid: number): number | null {
  const fields = statFields(pid);
  if (!fields) return null;
  return ((Number(fields[11]) + Number(fields[12])) * 1000) / TICKS_PER_SECOND;
}

/** `pid` and every process below it. */
function processTree(pid: number): number[] {
  let pids: number[];
  try {
    pids = fs
      .readdirSync('/proc')
      .filter((d) => /^\d+$/.test(d))
      .map(Number);
  } catch {
    return [pid];
  }
  const children = new Map<number, number[]>();
  for (const p of pids) {
    const ppid = Number(statFields(p)?.[1]);
    if (ppid) children.set(ppid, [...(children.get(ppid) ?? []), p]);
  }
  const tree: number[] = [];
  const stack = [pid];
  while (stack.length) {
    const p = stack.pop()!;
    tree.push(p);
    stack.push(...(children.get(p) ?? []));
  }
  return tree;
}

async function backendPids(pool: pg.Pool, database: string): Promise<number[]> {
  const r = await pool.query<{ pid: number }>(
    'select pid from pg_stat_activity where datname = $1 and pid <> pg_backend_pid()',
    [database],
  );
  return r.rows.map((row) => row.pid);
}

/** CPU ms since `before` of the processes in `before` and `now` (ones that ended meanwhile are missed). */
function cpuSince(before: Map<number, number>, now: number[]): number {
  let total = 0;
  for (const pid of new Set([...before.keys(), ...now])) {
    const ms = cpuMsOf(pid);
    if (ms !== null) total += ms - (before.get(pid) ?? 0);
  }
  return Math.round(total);
}

const snapshot = (pids: number[]) => new Map(pids.map((p) => [p, cpuMsOf(p) ?? 0]));

/**
 * Starts counting; stop() returns the CPU milliseconds of the server (with its child
 * processes) and of the database's backends since then (pooled backends live on).
 */
export async function measureCpu(serverPid: number, pool: pg.Pool, database: string) {
  const server0 = snapshot(processTree(serverPid));
  const database0 = snapshot(await backendPids(pool, database));
  return {
    async stop() {
      const serverAlive = cpuMsOf(serverPid) !== null;
      return {
        serverMs: serverAlive ? cpuSince(server0, processTree(serverPid)) : null,
        databaseMs: cpuSince(database0, await backendPids(pool, database)),
      };
    },
  };
}
