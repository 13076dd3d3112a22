/**
 * The engine's worker files prebuilt as plain JavaScript (scripts/build-engine-workers.ts, run by
 * `npm run build`, the test setup and start): a thread that loads a bundle skips the tsx
 * loader, which costs about half a second of CPU per thread. The bundles are the same worker
 * sources, only compiled ahead. A bundle is used only while none of the source files it was
 * built from is newer than the build or of another size than then (a file put back with an old
 * time), so an edited engine never runs as its old bundle: the worker then loads its source
 * through tsx, as without a build.
 */
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

/** Where the bundles and their manifest are written (under the build output, not committed). */
export const PREBUILT_WORKERS_DIR = fileURLToPath(
  new URL('../../../dist/engine-workers/', import.meta.url),
);
const ROOT = fileURLToPath(new URL('../../../', import.meta.url));
/** The manifest's name in the bundles' folder. */
export const PREBUILT_WORKERS_MANIFEST = 'manifest.json';

/**
 * Written by the build: per worker source (relative to the repository), its bundle and the
 * files it was built from, each with its size in bytes then.
 */
export interface PrebuiltWorkersManifest {
  /** Milliseconds since the epoch, taken before the build read its first source file. */
  builtAt: number;
  workers: Record<string, { bundle: string; inputs: Record<string, number> }>;
}

/** A repository-relative path with forward slashes (the manifest's keys). */
export function repoRelative(file: string): string {
  return path.relative(ROOT, file).split(path.sep).join('/');
}

function readManifest(dir: string): PrebuiltWorkersManifest | null {
  try {
    const text = fs.readFileSync(path.join(dir, PREBUILT_WORKERS_MANIFEST), 'utf8');
    return JSON.parse(text) as PrebuiltWorkersManifest;
  } catch {
    return null;
  }
}

function hasChanged(file: string, size: number, builtAt: number): boolean {
  try {
    const stat = fs.statSync(path.join(ROOT, file));
    return stat.mtimeMs > builtAt || stat.size !== size;
  } catch {
    return true; // a source gone since the build: the bundle no longer matches the tree
  }
}

/**
 * The up-to-date bundle of a TypeScript worker file, or null (no build, the file is not bundled,
 * or one of its sources changed since: a later time or another size). Checked on every pool start, not cached: a test run in
 * watch mode or a long-lived process sees an edit as soon as it is saved (a pool start stats the
 * worker's one to two hundred sources, packages included: about a millisecond).
 */
export function prebuiltWorkerFile(
  sourceFile: string,
  dir: string = PREBUILT_WORKERS_DIR,
): string | null {
  const manifest = readManifest(dir);
  const entry = manifest?.workers[repoRelative(sourceFile)];
  if (!manifest || !entry) return null;
  const bundle = path.join(dir, entry.bundle);
  if (!fs.existsSync(bundle)) return null;
  const inputs = Object.entries(entry.inputs);
  if (inputs.some(([file, size]) => hasChanged(file, size, manifest.builtAt))) return null;
  return bundle;
}

/** True when some worker has no up-to-date bundle (the build then runs again). */
export function arePrebuiltWorkersStale(
  sourceFiles: string[],
  dir: string = PREBUILT_WORKERS_DIR,
): boolean {
  return sourceFiles.some((f) => prebuiltWorkerFile(f, dir) === null);
}
