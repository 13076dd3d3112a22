/** Runs a load client (scripts/respondent-load.ts, scripts/import-client.ts) in a process of its own and reads its result. */
import { spawn } from 'node:child_process';
import path from 'node:path';
import type { LoadOptions, LoadResult } from './respondent-load';

const root = path.resolve(import.meta.dirname, '../..');

/** Starts `script` with its options as one JSON argument; resolves with its last stdout line, parsed. */
export function runClientProcess<T>(script: string, options: unknown): Promise<T> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', script, JSON.stringify(options)], {
      cwd: root,
      stdio: ['ignore', 'pipe', 'inherit'],
    });
    let out = '';
    child.stdout.on('data', (d: Buffer) => (out += d.toString()));
    child.once('error', reject);
    child.once('exit', (code) => {
      if (code !== 0) return reject(new Error(`load client exited with code ${code}`));
      try {
        resolve(JSON.parse(out.trim().split('\n').pop()!) as T);
      } catch (err) {
        reject(err instanceof Error ? err : new Error(String(err)));
      }
    });
  });
}

export function runLoadClient(options: LoadOptions): Promise<LoadResult> {
  return runClientProcess<LoadResult>('scripts/respondent-load.ts', options);
}
