/**
 * Import benchmark, measured from outside as deployed. In a scratch database (never the demo
 * database) it seeds the demo (for its sign-ins), writes a seeded long-format choice file of
 * about `--rows` rows (scripts/lib/synthetic-choice-file.ts: 12 tasks × 3 alternatives per
 * respondent), starts the server as its own process (`node --import tsx server/main.ts`,
 * production settings) and runs the client in another process (scripts/import-client.ts): a
 * preview upload, then the save with the inferred set-up. Afterwards it counts the stored
 * respondents and answers.
 *
 * With `--compare-with <another checkout>` (e.g. a worktree of an earlier commit) that
 * checkout's server imports the same file first, against the same database on the same
 * machine, so two implementations are compared side by side in one run (`baseline`).
 *
 * Usage: npm run bench:import [-- --rows 1000000] [-- --port 5291] [-- --compare-with <dir>]
 *        [-- --json]
 * Target (issue 16): a file of 1 million rows imports in under 60 s.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { once } from 'node:events';
import { sql } from 'drizzle-orm';
import { benchServerEnv, startProcess, waitForHealth } from './lib/server-process';
import { runClientProcess } from './lib/load-client-process';
import { sampleLoadAverage } from './lib/load-stats';
import { seedScratchDemo } from './lib/bench-demo-run';
import { syntheticChoiceLines, syntheticHeader } from './lib/synthetic-choice-file';
import { readBenchCli, runBench } from './lib/bench-cli';
import { openBenchWorkspace } from './lib/bench-workspace';

const cli = readBenchCli();
const { asJson, log } = cli;
const arg = cli.number;
const ROWS = arg('rows', 1_000_000);
const PORT = arg('port', 5291);
const ROWS_PER_RESPONDENT = 36;
const BASELINE_DIR = cli.path('compare-with');
const root = path.resolve(import.meta.dirname, '..');

async function writeChoiceFile(file: string, respondents: number): Promise<number> {
  const out = fs.createWriteStream(file);
  let rows = 0;
  let chunk = `${syntheticHeader}\n`;
  for (const line of syntheticChoiceLines(respondents)) {
    chunk += `${line}\n`;
    rows++;
    if (chunk.length > 1 << 16) {
      if (!out.write(chunk)) await once(out, 'drain');
      chunk = '';
    }
  }
  out.end(chunk);
  await once(out, 'finish');
  return rows;
}

type ClientResult = {
  previewSeconds: number;
  importSeconds: number;
  saved: { studyId: string; respondents: number; rows: number };
};

async function main() {
  const workspace = await openBenchWorkspace('cw-bench-import', { max: 2 });
  const { scratch, work, db } = workspace;
  const base = `http://127.0.0.1:${PORT}`;
  let server: ReturnType<typeof startProcess> | null = null as ReturnType<
    typeof startProcess
  > | null;
  try {
    log(`bench:import — scratch database ${scratch.name}; seeding the demo for its sign-ins…`);
    const credentialsFile = await seedScratchDemo(scratch.url, work);
    const file = path.join(work, 'choices.csv');
    const rows = await writeChoiceFile(file, Math.ceil(ROWS / ROWS_PER_RESPONDENT));
    const megabytes = fs.statSync(file).size / 1024 / 1024;
    log(`  choice file: ${rows} rows, ${megabytes.toFixed(1)} MB`);
    const serverEnv = {
      ...benchServerEnv({
        port: PORT,
        appUrl: base,
        databaseUrl: scratch.url,
        dataDir: work,
        embeddedWorker: true,
      }),
      SMTP_PORT: '9',
    };
    const measure = async (name: string, cwd?: string) => {
      server = startProcess({
        entry: 'server/main.ts',
        cwd,
        logFile: path.join(root, '.data', 'bench', `import-${name}-server.log`),
        env: serverEnv,
      });
      try {
        await waitForHealth(base);
        const load = sampleLoadAverage(os.loadavg);
        const client = await runClientProcess<ClientResult>('scripts/import-client.ts', {
          base,
          credentialsFile,
          file,
          name: `Bench import (${name})`,
        });
        const loadAverage = load.stop();
        const stored = await db.execute<{ respondents: number; answers: number }>(sql`
          select (select count(*)::int from respondents where study_id = ${client.saved.studyId}) as respondents,
                 (select count(*)::int from answers where study_id = ${client.saved.studyId}) as answers`);
        return {
          seconds: Number(client.importSeconds.toFixed(2)),
          rowsPerSecond: Math.round(rows / client.importSeconds),
          previewSeconds: Number(client.previewSeconds.toFixed(2)),
          previewRowsPerSecond: Math.round(rows / client.previewSeconds),
          storedRespondents: stored.rows[0].respondents,
          storedAnswers: stored.rows[0].answers,
          /** Other processes share the machine: the 1-minute load average during the uploads. */
          loadAverage,
        };
      } finally {
        await server.stop();
      }
    };
    const baseline = BASELINE_DIR ? await measure('baseline', BASELINE_DIR) : null;
    const current = await measure('current');
    const result = {
      rows,
      megabytes: Number(megabytes.toFixed(1)),
      ...current,
      targetSeconds: 60,
      expectedAnswers: rows / 3,
      baseline: baseline ? { checkout: BASELINE_DIR, ...baseline } : null,
      node: process.version,
      cpus: os.cpus().length,
    };
    if (asJson) console.log(JSON.stringify(result));
    else
      for (const [name, r] of [
        ...(baseline ? ([['baseline', baseline]] as const) : []),
        ['current', current],
      ] as const)
        log(
          `  ${name.padEnd(8)} import ${r.seconds} s (${r.rowsPerSecond} rows/s; target < 60 s) · preview ${r.previewSeconds} s · stored ${r.storedRespondents} respondents, ${r.storedAnswers} answers · load ${r.loadAverage.mean} (max ${r.loadAverage.max})`,
        );
    if ([current, baseline].some((r) => r && r.storedAnswers !== result.expectedAnswers))
      process.exitCode = 1;
  } finally {
    await workspace.close(server);
  }
}

runBench(main);
