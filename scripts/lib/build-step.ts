/**
 * A build output made from sources (the WebAssembly kernel, the engine worker bundles): built
 * when missing or stale, and a command line that builds it, or with `--if-stale` only when
 * stale, and says which it did.
 */
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export type BuildStep = {
  /** What is built, as the command line names it ("WebAssembly kernel"). */
  name: string;
  output: string;
  isStale(): boolean;
  build(): Promise<void>;
};

/** Builds when missing or stale; quick when up to date. */
export async function ensureBuilt(step: BuildStep): Promise<void> {
  if (step.isStale()) await step.build();
}

/** Runs the step as a command when `moduleUrl` is the script node was started with. */
export async function runBuildCommand(step: BuildStep, moduleUrl: string): Promise<void> {
  if (!process.argv[1] || path.resolve(process.argv[1]) !== fileURLToPath(moduleUrl)) return;
  const started = Date.now();
  if (process.argv.includes('--if-stale') && !step.isStale()) {
    console.log(`${step.name}: up to date`);
    return;
  }
  await step.build();
  const seconds = ((Date.now() - started) / 1000).toFixed(1);
  console.log(`${step.name} built in ${seconds} s: ${step.output}`);
}
