/**
 * Share simulation use cases ('runs:read'):
 * - the share model of a run (shares/share-model.ts), which the browser recomputes from;
 * - respondents' segments in the model's order, for shares by segment in the browser;
 * - one scenario simulated on the server (shared/engine/shares, the same code the browser
 *   runs), with its compensating variation against the status quo (share-welfare.ts).
 */
import type { AppDeps } from '../deps';
import { ValidationError } from '../lib/errors';
import { listRunProfiles } from '../../db/queries/taste-profiles';
import {
  computeScenarioShares,
  prepareShareModel,
  type PreparedShareModel,
  type ScenarioRequest,
  type ScenarioShares,
} from '../../shared/engine/shares/share-model';
import type {
  ShareGroups,
  ShareGroupsQuery,
  ShareMethod,
  ShareModel,
  ShareResult,
  SimulateShares,
} from '../../shared/schemas/shares';
import { loadRunContext, type RunContext } from './tastes/run-context';
import { resolveGrouping } from './tastes/get-segments';
import { computeScenarioWelfare } from './share-welfare';
import { buildShareModel } from './shares/share-model';
import { rethrowScenarioError } from './shares/scenario-error';
import type { Actor } from './actor';

async function loadShareModel(deps: AppDeps, actor: Actor, studyId: string, runId: string) {
  const ctx = await loadRunContext(deps, actor, studyId, runId);
  const profiles = await listRunProfiles(deps.db, { runId: ctx.run.id, studyId });
  return { ctx, profiles, model: buildShareModel(ctx, profiles) };
}

export async function getShareModel(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  runId: string,
): Promise<ShareModel> {
  return (await loadShareModel(deps, actor, studyId, runId)).model;
}

/** Segments in the model's respondent order (profiles by start time, as listRunProfiles). */
export async function loadShareGroups(
  deps: AppDeps,
  ctx: RunContext,
  profiles: readonly { respondentId: string }[],
  by: Omit<ShareGroupsQuery, 'runId'>,
): Promise<ShareGroups> {
  const grouping = await resolveGrouping(deps, ctx, by);
  return {
    label: grouping.label,
    groups: grouping.order.map((key) => ({ key, label: grouping.labelOf(key) })),
    of: profiles.map((p) => {
      const key = grouping.groupOf.get(p.respondentId);
      return key === undefined ? -1 : grouping.order.indexOf(key);
    }),
  };
}

/**
 * The groups a scenario is split by: those of `segmentBy` when it is given and the model has
 * per-respondent coefficients to split (point estimates have one set for everybody), else null.
 */
export async function loadScenarioGroups(
  deps: AppDeps,
  ctx: RunContext,
  profiles: readonly { respondentId: string }[],
  method: ShareMethod,
  segmentBy: Omit<ShareGroupsQuery, 'runId'> | null | undefined,
): Promise<ShareGroups | null> {
  return segmentBy && method !== 'point_estimates'
    ? loadShareGroups(deps, ctx, profiles, segmentBy)
    : null;
}

/**
 * A scenario's shares, per group of `groups` too when given; a scenario the coder refuses is a
 * 400 naming the field.
 */
export function simulateScenario(
  prepared: PreparedShareModel,
  input: ScenarioRequest,
  groups: ShareGroups | null,
): ScenarioShares {
  try {
    return computeScenarioShares(
      prepared,
      input,
      groups
        ? { of: Int32Array.from(groups.of), count: Math.max(1, groups.groups.length) }
        : undefined,
    );
  } catch (e) {
    rethrowScenarioError(e);
  }
}

export async function getShareGroups(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  query: ShareGroupsQuery,
): Promise<ShareGroups> {
  const { ctx, profiles, model } = await loadShareModel(deps, actor, studyId, query.runId);
  if (model.method === 'point_estimates')
    throw new ValidationError('A run with one set of coefficients for everybody has no segments.', [
      { path: 'runId', message: 'Choose a run with individual estimates' },
    ]);
  return loadShareGroups(deps, ctx, profiles, query);
}

/** The prepared model of a run (with interval draws), for exports and server simulations. */
export async function loadPreparedShareModel(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  runId: string,
): Promise<{
  ctx: RunContext;
  prepared: PreparedShareModel;
  profiles: { respondentId: string }[];
}> {
  const { ctx, profiles, model } = await loadShareModel(deps, actor, studyId, runId);
  return { ctx, profiles, prepared: prepareShareModel(model) };
}

export async function simulateStudyShares(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  input: SimulateShares,
): Promise<ShareResult> {
  const { ctx, profiles, model } = await loadShareModel(deps, actor, studyId, input.runId);
  // Point shares only (no interval draws): this is the server's answer of record.
  const prepared = prepareShareModel({ ...model, interval: null });
  const groups = await loadScenarioGroups(deps, ctx, profiles, model.method, input.segmentBy);
  const result = simulateScenario(prepared, input, groups);
  const welfare = computeScenarioWelfare(ctx, prepared, result);
  return {
    ...welfare,
    runId: ctx.run.id,
    method: model.method,
    respondents: model.sampleRespondents,
    alternatives: result.names.map((name, j) => ({ name, share: result.shares[j] })),
    segments:
      groups && result.groups
        ? {
            label: groups.label,
            groups: groups.groups
              .map((g, i) => ({
                ...g,
                count: result.groups!.counts[i],
                shares: result.groups!.shares[i],
              }))
              .filter((g) => g.count > 0),
          }
        : null,
  };
}
