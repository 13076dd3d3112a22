/**
 * Compiles the processes the end-to-end server starts (the web server, the job worker, the demo
 * seed, the estimate command, the wait for the demo accounts) ahead into plain JavaScript, as the
 * engine worker bundles are (scripts/lib/esbuild-bundles.ts): a process started from its bundle
 * skips the tsx loader, which transpiles a few hundred files at every start (start to healthy
 * took about twice the CPU through tsx). Packages stay in node_modules (native bindings, one
 * instance of each). `npm run build` and the build job of scripts/test.sh build them;
 * scripts/e2e-server.sh starts them when CW_PROCESS_BUNDLES=use, and through tsx otherwise.
 * Usage: npm run build:processes [-- --if-stale]
 */
import path from 'node:path';
import { ensureBuilt, runBuildCommand, type BuildStep } from './lib/build-step';
import { buildBundles } from './lib/esbuild-bundles';
import {
  arePrebuiltWorkersStale,
  prebuiltWorkerFile,
} from '../server/engine/parallel/prebuilt-workers';

const ROOT = path.resolve(import.meta.dirname, '..');

/** Where the process bundles go, each named after its source path (server/main.ts.mjs…). */
export const PROCESS_BUNDLES_DIR = path.join(ROOT, 'dist/processes');

export const PROCESS_SOURCES = [
  'server/main.ts',
  'server/worker.ts',
  'server/seed.ts',
  'scripts/estimate.ts',
  'e2e/support/wait-for-demo-accounts.ts',
].map((f) => path.join(ROOT, f));

const step: BuildStep = {
  name: 'Process bundles',
  output: PROCESS_BUNDLES_DIR,
  isStale: () => arePrebuiltWorkersStale(PROCESS_SOURCES, PROCESS_BUNDLES_DIR),
  build: () =>
    buildBundles({
      sources: PROCESS_SOURCES,
      outdir: PROCESS_BUNDLES_DIR,
      packagesExternal: true,
      allowDirname: true,
      // The bundle keeps its source's path in its name (and so in the process's command line).
      namedBySourcePath: true,
    }),
};

/**
 * The up-to-date bundle of a process source (repository-relative, e.g. `server/main.ts`) when
 * CW_PROCESS_BUNDLES=use, else null (started through tsx): a bundle older than one of its
 * sources is never used.
 */
export function processBundleOf(source: string): string | null {
  if (process.env.CW_PROCESS_BUNDLES !== 'use') return null;
  return prebuiltWorkerFile(path.join(ROOT, source), PROCESS_BUNDLES_DIR);
}

/** Builds when missing or stale; quick when up to date. */
export const ensureProcessBundlesBuilt = (): Promise<void> => ensureBuilt(step);

await runBuildCommand(step, import.meta.url);
