/** Turns a stored run row into the API's Run, and splits the stored spec. */
import type { RunRow } from '../../../db/queries/runs';
import { estimationSpecSchema, type EstimationSpec } from '../../../shared/schemas/estimation-spec';
import {
  respondentSelectionSchema,
  runDataOrderSchema,
  runProgressSchema,
  type Run,
  type RunDataOrder,
  type RunResult,
} from '../../../shared/schemas/run';

/**
 * The runs.spec column holds the estimation spec plus `respondents` (the selection) and
 * `dataOrder` (how the respondents were read; absent in runs made before it was stored, which
 * read them by id).
 */
export function splitStoredSpec(stored: unknown): {
  spec: EstimationSpec;
  respondents: { filterId: string | null };
  dataOrder: RunDataOrder;
} {
  const raw = (stored ?? {}) as { respondents?: unknown; dataOrder?: unknown };
  return {
    spec: estimationSpecSchema.parse(stored),
    respondents: respondentSelectionSchema.parse(raw.respondents ?? {}),
    dataOrder: runDataOrderSchema.parse(raw.dataOrder ?? 'respondent-id'),
  };
}

/** The seed that makes a run reproducible: the draws' (mixed logit, latent class starts) or the sampler's. */
export function getRunSeed(spec: EstimationSpec): number | null {
  if (spec.model === 'mixed' || spec.model === 'latent_class') return spec.draws.seed;
  if (spec.model === 'hb') return spec.mcmc?.seed ?? 1;
  return null;
}

const iso = (d: Date | null) => (d ? d.toISOString() : null);

export function toRunView(row: RunRow): Run {
  const { spec, respondents, dataOrder } = splitStoredSpec(row.spec);
  const progress = runProgressSchema.safeParse(row.progress);
  return {
    id: row.id,
    studyId: row.studyId,
    name: row.name,
    model: spec.model,
    status: row.status,
    spec,
    respondents,
    dataOrder,
    dataHash: row.dataHash,
    seed: row.seed,
    progress: progress.success ? progress.data : {},
    results: (row.results as RunResult | null) ?? null,
    error: row.error,
    attempts: row.attempts,
    cancelRequested: row.cancelRequested !== null,
    erasedRespondents: row.erasedRespondents,
    createdAt: row.createdAt.toISOString(),
    startedAt: iso(row.startedAt),
    finishedAt: iso(row.finishedAt),
  };
}
