/** Runs a load client (scripts/respondent-load.ts, scripts/import-client.ts) in a process of its own and reads its result. */
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { emptyLoadResult, type LoadOptions, type LoadResult } from './respondent-load';

const root = path.resolve(import.meta.dirname, '../..');

function startClient(script: string, options: unknown): { child: ChildProcess; lines: string[] } {
  // Profiling the load client: BENCH_CLIENT_NODE_ARGS='--cpu-prof --cpu-prof-dir=…'.
  const nodeArgs = process.env.BENCH_CLIENT_NODE_ARGS?.split(' ').filter(Boolean) ?? [];
  const child = spawn(
    process.execPath,
    [...nodeArgs, '--import', 'tsx', script, JSON.stringify(options)],
    {
      cwd: root,
      stdio: ['pipe', 'pipe', 'inherit'],
    },
  );
  const lines: string[] = [];
  let partial = '';
  child.stdout!.on('data', (d: Buffer) => {
    const parts = (partial + d.toString()).split('\n');
    partial = parts.pop()!;
    for (const line of parts) {
      lines.push(line);
      child.emit('line', line);
    }
  });
  child.stdout!.on('end', () => {
    if (partial) lines.push(partial);
  });
  return { child, lines };
}

function resultOf<T>(c: { child: ChildProcess; lines: string[] }): Promise<T> {
  return new Promise((resolve, reject) => {
    c.child.once('error', reject);
    c.child.once('close', (code) => {
      if (code !== 0) return reject(new Error(`load client exited with code ${code}`));
      try {
        resolve(JSON.parse(c.lines.filter((l) => l.trim()).pop()!) as T);
      } catch (err) {
        reject(err instanceof Error ? err : new Error(String(err)));
      }
    });
  });
}

/** Starts `script` with its options as one JSON argument; resolves with its last stdout line, parsed. */
export function runClientProcess<T>(script: string, options: unknown): Promise<T> {
  const c = startClient(script, options);
  c.child.stdin!.end();
  return resultOf<T>(c);
}

/** Several load processes' results as one: times moved to the earliest start, counts added. */
export function mergeLoadResults(parts: LoadResult[]): LoadResult {
  const startedAt = Math.min(...parts.map((p) => p.startedAt));
  const merged: LoadResult = {
    ...emptyLoadResult(startedAt),
    endedAt: Math.max(...parts.map((p) => p.endedAt)),
    longestOutageMs: Math.max(...parts.map((p) => p.longestOutageMs)),
    processes: parts.length,
  };
  const counts = [
    'unsent',
    'replaysAsked',
    'replaysConfirmed',
    'errors5xx',
    'errors429',
    'networkErrors',
    'respondentsStarted',
    'respondentsFinished',
    'cpuMs',
  ] as const;
  for (const k of counts) merged[k] = parts.reduce((sum, p) => sum + p[k], 0);
  for (const p of parts) {
    const shift = p.startedAt - startedAt;
    merged.answerMs.push(...p.answerMs);
    merged.answerDoneAt.push(...p.answerDoneAt.map((t) => t + shift));
    merged.sessionMs.push(...p.sessionMs);
    merged.ackAt.push(...p.ackAt.map((t) => t + shift));
    merged.spans.push(...p.spans.map(([a, b]): [number, number] => [a + shift, b + shift]));
    merged.acknowledged.push(...p.acknowledged);
    merged.errorsOther.push(...p.errorsOther);
  }
  return merged;
}

/**
 * Runs one load in `processes` load processes (each simulates every processes-th respondent
 * at its own arrival time); they begin together once all have started, and their results are
 * merged. Spread the load when one process's CPU would limit it.
 */
export async function runLoadClient(options: LoadOptions, processes = 1): Promise<LoadResult> {
  if (processes <= 1) return runClientProcess<LoadResult>('scripts/respondent-load.ts', options);
  const clients = Array.from({ length: processes }, (_, index) =>
    startClient('scripts/respondent-load.ts', { ...options, part: { index, of: processes } }),
  );
  const results = clients.map((c) => resultOf<LoadResult>(c));
  // Awaited below; a client that fails early rejects the ready wait first.
  for (const r of results) r.catch(() => {});
  await Promise.all(
    clients.map(
      (c) =>
        new Promise<void>((resolve, reject) => {
          if (c.lines.includes('ready')) return resolve();
          c.child.on('line', (l: string) => l === 'ready' && resolve());
          c.child.once('close', () => reject(new Error('load client ended before it was ready')));
        }),
    ),
  );
  for (const c of clients) c.child.stdin!.end('go\n');
  return mergeLoadResults(await Promise.all(results));
}
