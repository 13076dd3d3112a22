/**
 * Refuses a mixed-logit specification whose estimation would not fit the machine's memory,
 * before it is queued: the engine's estimate (estimate-model-memory.ts) from the study's
 * included respondents and an upper bound of their tasks and alternatives (the largest block
 * of any live version's design, one more alternative for an opt-out or status quo), against
 * the ESTIMATION_MEMORY_LIMIT_MB setting.
 */
import type { AppDeps } from '../../deps';
import { ValidationError } from '../../lib/errors';
import { listIncludedRespondents } from '../../../db/queries/study-respondents';
import { listStudyVersions } from '../../../db/queries/versions';
import { createMixedLogitLayout } from '../../engine/estimation/mixed-logit-layout';
import { ARENA_MAX_BYTES } from '../../engine/simd/arena-plan';
import { estimateModelMemory } from '../../engine/simd/estimate-model-memory';
import { designSchema } from '../../../shared/schemas/design';
import type { EstimationSpec } from '../../../shared/schemas/estimation-spec';

const MB = 2 ** 20;

/** Largest number of tasks one respondent answers and of alternatives in one task. */
function getDesignBounds(designs: unknown[]): { tasks: number; alternatives: number } {
  let tasks = 0;
  let alternatives = 0;
  for (const raw of designs) {
    const parsed = designSchema.safeParse(raw);
    if (!parsed.success) continue;
    const perBlock = new Map<number, number>();
    for (const t of parsed.data.tasks) {
      perBlock.set(t.block, (perBlock.get(t.block) ?? 0) + 1);
      alternatives = Math.max(alternatives, t.alternatives.length + 1);
    }
    tasks = Math.max(tasks, ...perBlock.values());
  }
  return { tasks, alternatives };
}

/** Throws a 400 model_too_large naming the draws field when the run would not fit. */
export async function assertRunFitsMemory(
  deps: AppDeps,
  studyId: string,
  spec: EstimationSpec,
): Promise<void> {
  if (spec.model !== 'mixed') return;
  const [versions, included] = await Promise.all([
    listStudyVersions(deps.db, { studyId }),
    listIncludedRespondents(deps.db, { studyId }),
  ]);
  const { tasks, alternatives } = getDesignBounds(versions.map((v) => v.design));
  const N = included.length;
  if (N === 0 || tasks === 0) return; // nothing to estimate: the run fails with its own reason
  const columns = spec.coefficients.map((c) => c.column ?? c.name);
  const layout = createMixedLogitLayout({ columns }, spec.coefficients, spec.correlated);
  const maxRows = tasks * (alternatives - 1);
  const bytes = estimateModelMemory({
    respondents: N,
    tasks: N * tasks,
    rows: N * maxRows,
    columns: columns.length,
    K: layout.K,
    D: layout.D,
    P: layout.P,
    blockSize: layout.block.length,
    draws: spec.draws.count,
    profileDraws: spec.profileDraws,
    maxRows,
    threads: Math.max(2, deps.env.WORKER_THREADS),
  });
  const limit = Math.min(deps.env.ESTIMATION_MEMORY_LIMIT_MB * MB, ARENA_MAX_BYTES);
  if (bytes <= limit) return;
  const message =
    `This model needs about ${Math.ceil(bytes / MB)} MB of memory to estimate ` +
    `(${N} respondents, ${spec.draws.count} draws, ${layout.D} random coefficients), more than ` +
    `the limit of ${Math.floor(limit / MB)} MB set by ESTIMATION_MEMORY_LIMIT_MB. ` +
    'Use fewer draws or random coefficients, or a filter with fewer respondents.';
  throw new ValidationError(message, [{ path: 'spec.draws.count', message }], 'model_too_large');
}
