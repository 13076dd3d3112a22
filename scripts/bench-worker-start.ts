/**
 * What an engine thread costs to start, side by side: from its prebuilt bundle
 * (scripts/build-engine-workers.ts) and from its TypeScript source through the tsx loader, for
 * every engine worker file. Each round starts one thread per file and way, alternately, and
 * gives it one malformed task (answered or refused at once), so the figure is the thread's
 * start and module loading. Prints the CPU (all threads of this process) and wall time per
 * thread, and the load average.
 * Usage: npm run bench:worker-start [-- --json] [-- --rounds N]
 */
import os from 'node:os';
import path from 'node:path';
import { Piscina } from 'piscina';
import { workerEntry } from '../server/engine/parallel/ts-worker-pool';
import { ENGINE_WORKER_SOURCES, ensureEngineWorkersBuilt } from './build-engine-workers';
import { readBenchCli } from './lib/bench-cli';

const cli = readBenchCli();
const rounds = cli.number('rounds', 3);
const loadStart = os.loadavg();
await ensureEngineWorkersBuilt();

/** The export each pool runs (as its callers name it; the others use the default export). */
const HANDLERS: Record<string, string> = {
  'mixed-logit-worker': 'handleSliceMessage',
  'hb-worker': 'handleHbMessage',
  'latent-class-worker': 'handleLatentClassMessage',
  'hb-bench-worker': 'runBenchChain',
};

/** CPU seconds (this process, every thread) and wall seconds of starting one thread. */
async function startOne(source: string, prebuilt: boolean): Promise<[number, number]> {
  const cpu = process.cpuUsage();
  const wall = performance.now();
  const name = HANDLERS[path.basename(source, '.ts')];
  const pool = new Piscina({
    ...workerEntry(source, { prebuilt }),
    ...(name ? { name } : {}),
    minThreads: 0,
    maxThreads: 1,
  });
  await pool.run(null).catch(() => undefined);
  await pool.destroy();
  const used = process.cpuUsage(cpu);
  return [(used.user + used.system) / 1e6, (performance.now() - wall) / 1000];
}

const ways = { prebuilt: true, tsx: false } as const;
const totals = { prebuilt: [0, 0], tsx: [0, 0] };
const perFile: Record<string, Record<keyof typeof ways, number>> = {};
for (let round = 0; round < rounds; round++) {
  for (const source of ENGINE_WORKER_SOURCES) {
    const name = path.basename(source, '.ts');
    perFile[name] ??= { prebuilt: 0, tsx: 0 };
    for (const way of Object.keys(ways) as (keyof typeof ways)[]) {
      const [cpu, wall] = await startOne(source, ways[way]);
      totals[way][0] += cpu;
      totals[way][1] += wall;
      perFile[name][way] += cpu / rounds;
    }
  }
}
const threads = rounds * ENGINE_WORKER_SOURCES.length;
const figures = {
  bench: 'worker-start',
  threadsPerWay: threads,
  cpuSecondsPerThread: {
    prebuilt: +(totals.prebuilt[0] / threads).toFixed(3),
    tsx: +(totals.tsx[0] / threads).toFixed(3),
  },
  wallSecondsPerThread: {
    prebuilt: +(totals.prebuilt[1] / threads).toFixed(3),
    tsx: +(totals.tsx[1] / threads).toFixed(3),
  },
  cpuSecondsPerFile: Object.fromEntries(
    Object.entries(perFile).map(([k, v]) => [
      k,
      { prebuilt: +v.prebuilt.toFixed(3), tsx: +v.tsx.toFixed(3) },
    ]),
  ),
  loadAverage: {
    start: loadStart.map((l) => +l.toFixed(2)),
    end: os.loadavg().map((l) => +l.toFixed(2)),
  },
};
if (cli.asJson) console.log(JSON.stringify(figures));
else {
  console.log(
    `engine thread start, ${threads} threads per way (load ${figures.loadAverage.start.join(' ')}):`,
  );
  for (const way of Object.keys(ways) as (keyof typeof ways)[])
    console.log(
      `  ${way.padEnd(9)} ${figures.cpuSecondsPerThread[way].toFixed(3)} s CPU, ${figures.wallSecondsPerThread[way].toFixed(3)} s wall per thread`,
    );
}
