/**
 * Two ways to run the command-line estimator in tests: in-process through runEstimateCli (what
 * most cases need: the exit code and the messages), and as the real command in its own process
 * (for the process's own exit code, streams and files; each start costs a process start, so
 * only a few tests do it).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { runEstimateCli } from '../../../scripts/lib/estimate-cli';
import { processBundleOf } from '../../../scripts/build-process-bundles';

const root = path.resolve(import.meta.dirname, '../../..');
const tsx = pathToFileURL(createRequire(import.meta.url).resolve('tsx')).href;

export interface CliRun {
  status: number | null;
  stdout: string;
  stderr: string;
}

/** `npm run estimate -- --quiet …` in this process. */
export async function runCli(args: string[]): Promise<CliRun> {
  let stdout = '';
  let stderr = '';
  const status = await runEstimateCli(['--quiet', ...args], {
    stdout: (text) => (stdout += text),
    stderr: (text) => (stderr += text),
  });
  return { status, stdout, stderr };
}

/**
 * `npm run estimate -- --quiet …` as its own process: from the command's prebuilt bundle while
 * it is up to date and CW_PROCESS_BUNDLES=use (scripts/test.sh, after its build job), as the
 * journeys' server starts its processes; a start through tsx took about 0.85 s of CPU, from
 * the bundle 0.3 s. Through tsx otherwise.
 */
export function spawnCli(args: string[]): CliRun {
  const bundle = processBundleOf('scripts/estimate.ts');
  const start = bundle ? [bundle] : ['--import', tsx, path.join(root, 'scripts/estimate.ts')];
  return spawnSync(process.execPath, [...start, '--quiet', ...args], {
    encoding: 'utf8',
    cwd: root,
    timeout: 180_000,
  });
}

/** A scratch folder and a writer of files into it. */
export function scratchFiles(prefix: string): (name: string, content: string) => string {
  const dir = mkdtempSync(path.join(tmpdir(), prefix));
  return (name, content) => {
    const file = path.join(dir, name);
    writeFileSync(file, content);
    return file;
  };
}
