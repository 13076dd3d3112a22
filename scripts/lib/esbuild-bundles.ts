/**
 * Compiles TypeScript entry files ahead into plain JavaScript bundles with esbuild and writes the
 * manifest that server/engine/parallel/prebuilt-workers.ts reads to tell whether a bundle is
 * still up to date. Shared by the engine worker bundles (scripts/build-engine-workers.ts) and
 * the process bundles (scripts/build-process-bundles.ts): one way to build, locate and check.
 */
import fs from 'node:fs';
import path from 'node:path';
import type { Plugin } from 'esbuild';
import {
  PREBUILT_WORKERS_MANIFEST,
  repoRelative,
  type PrebuiltWorkersManifest,
} from '../../server/engine/parallel/prebuilt-workers';

const ROOT = path.resolve(import.meta.dirname, '../..');

/**
 * Each module keeps the `import.meta.url` (and, where `allowDirname`, `import.meta.dirname` and
 * `import.meta.filename`) of its source file, as a path relative to the bundle, so files found
 * next to a source (the WebAssembly kernel, worker files, migrations) are found from the bundle
 * too, wherever the checkout lives.
 */
function sourceLocationPlugin(outdir: string, allowDirname: boolean): Plugin {
  return {
    name: 'source-import-meta',
    setup(build) {
      build.onLoad({ filter: /\.ts$/ }, async (args) => {
        if (args.path.includes(`${path.sep}node_modules${path.sep}`)) return undefined;
        const source = await fs.promises.readFile(args.path, 'utf8');
        const usesDirname = /import\.meta\.(dirname|filename)/.test(source);
        if (usesDirname && !allowDirname)
          throw new Error(`${args.path}: engine worker code locates files with import.meta.url`);
        const relative = path.relative(outdir, args.path).split(path.sep).join('/');
        const url = `new URL(${JSON.stringify(relative)}, import.meta.url)`;
        const contents = source
          .replaceAll('import.meta.url', `${url}.href`)
          .replaceAll('import.meta.filename', `decodeURIComponent(${url}.pathname)`)
          .replaceAll(
            'import.meta.dirname',
            `decodeURIComponent(new URL('.', ${url}).pathname).replace(/\\/$/, '')`,
          );
        return { contents, loader: 'ts' };
      });
    },
  };
}

function writeAtomically(file: string, contents: string | Uint8Array): void {
  const temporary = `${file}.${process.pid}.tmp`;
  fs.writeFileSync(temporary, contents);
  fs.renameSync(temporary, file);
}

export interface BundleOptions {
  /** Absolute paths of the entry files; each bundle is named after its file. */
  sources: string[];
  outdir: string;
  /** Packages left to node_modules (loaded at run time) rather than bundled. */
  external?: string[];
  /** Leave every package to node_modules (native bindings, one instance with the sources). */
  packagesExternal?: boolean;
  /** Allow import.meta.dirname / filename (rewritten to the source's); engine workers may not. */
  allowDirname?: boolean;
  /** Name each bundle `<source path>.mjs` (server/main.ts.mjs) rather than `<basename>.mjs`. */
  namedBySourcePath?: boolean;
}

/** Bundles every entry file and writes the manifest that prebuilt-workers.ts reads. */
export async function buildBundles(options: BundleOptions): Promise<void> {
  const { build } = await import('esbuild');
  const builtAt = Date.now();
  const { outdir } = options;
  // Bundles in one folder are built together; a module's location is written relative to the
  // folder its bundle lands in (the source-path names put bundles in subfolders).
  const groups = new Map<string, Record<string, string>>();
  for (const f of options.sources) {
    const name = options.namedBySourcePath ? repoRelative(f) : path.basename(f, '.ts');
    const dir = path.join(outdir, path.dirname(name));
    groups.set(dir, { ...groups.get(dir), [path.basename(name)]: f });
  }
  const results = await Promise.all(
    [...groups].map(([dir, entryPoints]) =>
      build({
        entryPoints,
        absWorkingDir: ROOT,
        outdir: dir,
        outExtension: { '.js': '.mjs' },
        bundle: true,
        format: 'esm',
        platform: 'node',
        target: 'node20',
        external: options.external ?? [],
        packages: options.packagesExternal ? 'external' : undefined,
        sourcemap: true,
        metafile: true,
        write: false,
        logLevel: 'warning',
        plugins: [sourceLocationPlugin(dir, options.allowDirname ?? false)],
      }),
    ),
  );
  const outputFiles = results.flatMap((r) => r.outputFiles);
  const outputs = results.flatMap((r) => Object.entries(r.metafile.outputs));
  // Each file replaced whole (written beside, then renamed), so that a thread or process starting
  // meanwhile (another test run building too) reads the old bundle or the new one, never half.
  fs.mkdirSync(outdir, { recursive: true });
  for (const file of outputFiles) {
    fs.mkdirSync(path.dirname(file.path), { recursive: true });
    writeAtomically(file.path, file.contents);
  }
  const workers: PrebuiltWorkersManifest['workers'] = {};
  for (const [output, meta] of outputs) {
    if (!meta.entryPoint) continue;
    workers[repoRelative(path.resolve(ROOT, meta.entryPoint))] = {
      bundle: path.relative(outdir, path.resolve(ROOT, output)).split(path.sep).join('/'),
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
