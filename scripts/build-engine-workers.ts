/**
 * Compiles the engine's worker files (the piscina thread entries) ahead into plain JavaScript
 * bundles with esbuild, so that engine threads start without the tsx loader (about half a second
 * of CPU per thread; server/engine/parallel/prebuilt-workers.ts picks a bundle only while it is
 * up to date). The packages they use are bundled too (one file parses faster than zod's many
 * modules: 0.15 s instead of 0.3 s of CPU per thread, `npm run bench:worker-start`), except
 * piscina, whose worker runtime and transfer markers must be the one instance from node_modules. `npm run build` runs it; the test setup and start call
 * ensureEngineWorkersBuilt(), quick when nothing changed.
 * Usage: npm run build:workers [-- --if-stale]
 */
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureBuilt, runBuildCommand, type BuildStep } from './lib/build-step';
import { buildBundles } from './lib/esbuild-bundles';
import {
  PREBUILT_WORKERS_DIR,
  arePrebuiltWorkersStale,
} from '../server/engine/parallel/prebuilt-workers';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

/** Every file that a pool starts threads from (createTsPiscina / createTsWorkerPool callers). */
export const ENGINE_WORKER_SOURCES = [
  'server/engine/design/design-worker.ts',
  'server/engine/parallel/estimation-worker.ts',
  'server/engine/parallel/mixed-logit-worker.ts',
  'server/engine/parallel/hb-worker.ts',
  'server/engine/parallel/latent-class-worker.ts',
  'scripts/lib/hb-bench-worker.ts',
].map((f) => path.join(ROOT, f));

/** True when some worker has no bundle, or one of a bundle's sources (packages too) is newer. */
export function areEngineWorkersStale(): boolean {
  return arePrebuiltWorkersStale(ENGINE_WORKER_SOURCES);
}

/** Bundles every worker file and writes the manifest that prebuilt-workers.ts reads. */
export const buildEngineWorkers = (): Promise<void> =>
  buildBundles({
    sources: ENGINE_WORKER_SOURCES,
    outdir: PREBUILT_WORKERS_DIR,
    external: ['piscina'],
  });

const step: BuildStep = {
  name: 'Engine worker bundles',
  output: PREBUILT_WORKERS_DIR,
  isStale: areEngineWorkersStale,
  build: buildEngineWorkers,
};

/** Builds when missing or stale; quick when up to date. */
export const ensureEngineWorkersBuilt = (): Promise<void> => ensureBuilt(step);

await runBuildCommand(step, import.meta.url);
