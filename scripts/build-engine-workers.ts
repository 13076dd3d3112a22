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
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureBuilt, runBuildCommand, type BuildStep } from './lib/build-step';
import type { Plugin } from 'esbuild';
import {
  PREBUILT_WORKERS_DIR,
  PREBUILT_WORKERS_MANIFEST,
  arePrebuiltWorkersStale,
  repoRelative,
  type PrebuiltWorkersManifest,
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

/**
 * Each module keeps the `import.meta.url` of its source file (as a path relative to the bundle),
 * so files found next to a source (the WebAssembly kernel, other worker files) are found from
 * the bundle too, wherever the checkout lives.
 */
function sourceLocationPlugin(outdir: string): Plugin {
  return {
    name: 'source-import-meta',
    setup(build) {
      build.onLoad({ filter: /\.ts$/ }, async (args) => {
        if (args.path.includes(`${path.sep}node_modules${path.sep}`)) return undefined;
        const source = await fs.promises.readFile(args.path, 'utf8');
        if (/import\.meta\.(dirname|filename)/.test(source))
          throw new Error(`${args.path}: engine worker code locates files with import.meta.url`);
        const relative = path.relative(outdir, args.path).split(path.sep).join('/');
        const contents = source.replaceAll(
          'import.meta.url',
          `new URL(${JSON.stringify(relative)}, import.meta.url).href`,
        );
        return { contents, loader: 'ts' };
      });
    },
  };
}

/** True when some worker has no bundle, or one of a bundle's sources (packages too) is newer. */
export function areEngineWorkersStale(): boolean {
  return arePrebuiltWorkersStale(ENGINE_WORKER_SOURCES);
}

function writeAtomically(file: string, contents: string | Uint8Array): void {
  const temporary = `${file}.${process.pid}.tmp`;
  fs.writeFileSync(temporary, contents);
  fs.renameSync(temporary, file);
}

/** Bundles every worker file and writes the manifest that prebuilt-workers.ts reads. */
export async function buildEngineWorkers(): Promise<void> {
  const { build } = await import('esbuild');
  const builtAt = Date.now();
  const outdir = PREBUILT_WORKERS_DIR;
  const entryPoints = Object.fromEntries(
    ENGINE_WORKER_SOURCES.map((f) => [path.basename(f, '.ts'), f]),
  );
  const result = await build({
    entryPoints,
    absWorkingDir: ROOT,
    outdir,
    outExtension: { '.js': '.mjs' },
    bundle: true,
    format: 'esm',
    platform: 'node',
    target: 'node20',
    external: ['piscina'],
    sourcemap: true,
    metafile: true,
    write: false,
    logLevel: 'warning',
    plugins: [sourceLocationPlugin(outdir)],
  });
  // Each file replaced whole (written beside, then renamed), so that a thread starting meanwhile
  // (another test run building too) reads the old bundle or the new one, never half of one.
  fs.mkdirSync(outdir, { recursive: true });
  for (const file of result.outputFiles) writeAtomically(file.path, file.contents);
  const workers: PrebuiltWorkersManifest['workers'] = {};
  for (const [output, meta] of Object.entries(result.metafile.outputs)) {
    if (!meta.entryPoint) continue;
    workers[repoRelative(path.resolve(ROOT, meta.entryPoint))] = {
      bundle: path.basename(output),
      inputs: Object.fromEntries(
        Object.keys(meta.inputs).map((input) => {
          const file = path.resolve(ROOT, input);
          return [repoRelative(file), fs.statSync(file).size];
        }),
      ),
    };
  }
  const manifest: PrebuiltWorkersManifest = { builtAt, workers };
  writeAtomically(
    path.join(outdir, PREBUILT_WORKERS_MANIFEST),
    `${JSON.stringify(manifest, null, 1)}\n`,
  );
}

const step: BuildStep = {
  name: 'Engine worker bundles',
  output: PREBUILT_WORKERS_DIR,
  isStale: areEngineWorkersStale,
  build: buildEngineWorkers,
};

/** Builds when missing or stale; quick when up to date. */
export const ensureEngineWorkersBuilt = (): Promise<void> => ensureBuilt(step);

await runBuildCommand(step, import.meta.url);
