/** Runs scripts/respondent-load.ts in a process of its own and reads its result. */
import { spawn } from 'node:child_process';
import path from 'node:path';
import type { LoadOptions, LoadResult } from './respondent-load';

const root = path.resolve(import.meta.dirname, '../..');

export function runLoadClient(options: LoadOptions): Promise<LoadResult> {
  return new Promise((resolve, reject) => {
    const child = spawn(
      process.execPath,
      ['--import', 'tsx', 'scripts/respondent-load.ts', JSON.stringify(options)],
      { cwd: root, stdio: ['ignore', 'pipe', 'inherit'] },
    );
    let out = '';
    child.stdout.on('data', (d: Buffer) => (out += d.toString()));
    child.once('error', reject);
    child.once('exit', (code) => {
      if (code !== 0) return reject(new Error(`load client exited with code ${code}`));
      try {
        resolve(JSON.parse(out.trim().split('\n').pop()!) as LoadResult);
      } catch (err) {
        reject(err instanceof Error ? err : new Error(String(err)));
      }
    });
  });
}
