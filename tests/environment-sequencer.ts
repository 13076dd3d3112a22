/**
 * Vitest's file order, with the files of one project that share a test environment kept
 * together. With `isolate: false` a worker process is reused for the next file only when that
 * file has the same project and environment (a `// @vitest-environment` docblock); otherwise it
 * is stopped and a new one started, which imports every module again. Vitest's own order (by
 * duration or size) interleaves the unit project's jsdom and node files, so many files paid a
 * new process; grouped, a project starts about one worker per core and per environment.
 */
import { readFileSync } from 'node:fs';
import type { TestSequencer, TestSpecification, Vitest } from 'vitest/node';

const docblockEnvironment = /@vitest-environment\s+([\w-]+)/;

function environmentOf(spec: TestSpecification): string {
  const head = readFileSync(spec.moduleId, 'utf8').slice(0, 2000);
  return docblockEnvironment.exec(head)?.[1] ?? spec.project.config.environment;
}

/** Vitest's own sequencer, loaded only when tests run (vite.config.ts is also `vite build`'s). */
async function baseSequencer(ctx: Vitest): Promise<TestSequencer> {
  const { BaseSequencer } = await import('vitest/node');
  return new BaseSequencer(ctx);
}

export class EnvironmentSequencer implements TestSequencer {
  constructor(private readonly ctx: Vitest) {}

  async shard(files: TestSpecification[]): Promise<TestSpecification[]> {
    return (await baseSequencer(this.ctx)).shard(files);
  }

  async sort(files: TestSpecification[]): Promise<TestSpecification[]> {
    const sorted = await (await baseSequencer(this.ctx)).sort(files);
    // A stable partition: projects stay in vitest's order, and within a project and an
    // environment the files keep vitest's longest-first order.
    const groups = new Map<string, TestSpecification[]>();
    for (const spec of sorted) {
      const key = `${spec.project.name}\0${environmentOf(spec)}`;
      const group = groups.get(key);
      if (group) group.push(spec);
      else groups.set(key, [spec]);
    }
    return [...groups.values()].flat();
  }
}
