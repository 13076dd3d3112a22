/**
 * Engine threads start from the prebuilt worker bundles only while those are up to date, and
 * from the TypeScript sources through tsx otherwise (server/engine/parallel/prebuilt-workers.ts).
 * The bundles' behaviour is checked by the worker tests themselves (design-worker.test.ts,
 * estimation-worker-stages.test.ts, fit-hb-workers.test.ts …), which now run on them.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import {
  PREBUILT_WORKERS_DIR,
  PREBUILT_WORKERS_MANIFEST,
  prebuiltWorkerFile,
  repoRelative,
  type PrebuiltWorkersManifest,
} from '../../../server/engine/parallel/prebuilt-workers';
import { createTsPiscina } from '../../../server/engine/parallel/ts-worker-pool';
import { ENGINE_WORKER_SOURCES } from '../../../scripts/build-engine-workers';

const ROOT = fileURLToPath(new URL('../../../', import.meta.url));
const DESIGN_WORKER = fileURLToPath(
  new URL('../../../server/engine/design/design-worker.ts', import.meta.url),
);

const folders: string[] = [];
afterAll(() => folders.forEach((f) => fs.rmSync(f, { recursive: true, force: true })));

/** The given repository files with their sizes now, as the build records its inputs. */
const asBuilt = (...files: string[]) =>
  Object.fromEntries(files.map((f) => [f, fs.statSync(path.join(ROOT, f)).size]));

const lastChanged = (file: string) => fs.statSync(path.join(ROOT, file)).mtimeMs;

/** A bundles folder holding one stand-in bundle of the design worker and the given manifest. */

function fakeBuild(builtAt: number, inputs: Record<string, number>): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-prebuilt-'));
  folders.push(dir);
  fs.writeFileSync(path.join(dir, 'design-worker.mjs'), 'export default () => 1;\n');
  const manifest: PrebuiltWorkersManifest = {
    builtAt,
    workers: { [repoRelative(DESIGN_WORKER)]: { bundle: 'design-worker.mjs', inputs } },
  };
  fs.writeFileSync(path.join(dir, PREBUILT_WORKERS_MANIFEST), JSON.stringify(manifest));
  return dir;
}

describe('prebuilt engine workers', () => {
  it('has an up-to-date bundle of every worker file after the test setup built them', () => {
    for (const source of ENGINE_WORKER_SOURCES) {
      const bundle = prebuiltWorkerFile(source);
      expect(bundle, repoRelative(source)).toBe(
        path.join(PREBUILT_WORKERS_DIR, `${path.basename(source, '.ts')}.mjs`),
      );
    }
  });

  it('uses a bundle built after every one of its sources changed', () => {
    const inputs = asBuilt('shared/format.ts', repoRelative(DESIGN_WORKER));
    const latest = Math.max(...Object.keys(inputs).map((f) => lastChanged(f)));
    const dir = fakeBuild(latest + 1, inputs);
    expect(prebuiltWorkerFile(DESIGN_WORKER, dir)).toBe(path.join(dir, 'design-worker.mjs'));
  });

  it('ignores a bundle one of whose sources is newer than the build', () => {
    const inputs = asBuilt('shared/format.ts', repoRelative(DESIGN_WORKER));
    const dir = fakeBuild(lastChanged(repoRelative(DESIGN_WORKER)) - 1, inputs);
    expect(prebuiltWorkerFile(DESIGN_WORKER, dir)).toBeNull();
  });

  it('ignores a bundle one of whose sources has another size than at the build', () => {
    // As after a file is put back with an older time than the build's (copies, archives).
    const inputs = asBuilt('shared/format.ts', repoRelative(DESIGN_WORKER));
    inputs['shared/format.ts'] += 1;
    const dir = fakeBuild(Date.now() + 60_000, inputs);
    expect(prebuiltWorkerFile(DESIGN_WORKER, dir)).toBeNull();
  });

  it('ignores a bundle one of whose sources is gone, or that is missing', () => {
    const gone = fakeBuild(Date.now() + 60_000, { 'server/engine/no-such-file.ts': 10 });
    expect(prebuiltWorkerFile(DESIGN_WORKER, gone)).toBeNull();
    const missing = fakeBuild(Date.now() + 60_000, asBuilt(repoRelative(DESIGN_WORKER)));
    fs.rmSync(path.join(missing, 'design-worker.mjs'));
    expect(prebuiltWorkerFile(DESIGN_WORKER, missing)).toBeNull();
  });

  it('has no bundle for a file the build does not cover, or without a build', () => {
    const other = fileURLToPath(
      new URL('../../fixtures/typescript-echo-worker.ts', import.meta.url),
    );
    expect(prebuiltWorkerFile(other)).toBeNull();
    const empty = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-prebuilt-'));
    folders.push(empty);
    expect(prebuiltWorkerFile(DESIGN_WORKER, empty)).toBeNull();
  });

  it('starts a worker without a bundle from its TypeScript source through tsx', async () => {
    const pool = createTsPiscina({
      filename: fileURLToPath(new URL('../../fixtures/typescript-echo-worker.ts', import.meta.url)),
      maxThreads: 1,
    });
    try {
      expect(await pool.run({ value: 7 })).toEqual({ value: 7 });
    } finally {
      await pool.destroy();
    }
  });
});
