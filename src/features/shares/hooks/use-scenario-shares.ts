/**
 * Shares of the scenario on screen, computed in the browser from the run's share model with
 * the same shared code the server's exports use (shared/engine/shares/share-model.ts). The
 * interval draws are made once per model; every edit then re-evaluates only the logit
 * probabilities (about 40 ms for 1,000 respondents, npm run bench:shares).
 */
import { useMemo } from 'react';
import type { ShareGroups, ShareModel, ScenarioAlternative } from '@shared/schemas/shares';
import { ScenarioError } from '@shared/engine/shares/code-scenario';
import {
  computeScenarioShares,
  prepareShareModel,
  type PreparedShareModel,
  type ScenarioShares,
} from '@shared/engine/shares/share-model';

export function usePreparedShareModel(model: ShareModel | undefined): PreparedShareModel | null {
  return useMemo(() => (model ? prepareShareModel(model) : null), [model]);
}

export type ScenarioOutcome =
  { shares: ScenarioShares; error: null } | { shares: null; error: ScenarioError | null };

export function computeOutcome(
  prepared: PreparedShareModel | null,
  alternatives: readonly ScenarioAlternative[],
  includeFixed: boolean,
  groups?: ShareGroups | null,
): ScenarioOutcome {
  if (!prepared) return { shares: null, error: null };
  try {
    const g = groups
      ? { of: Int32Array.from(groups.of), count: Math.max(1, groups.groups.length) }
      : undefined;
    return {
      shares: computeScenarioShares(prepared, { alternatives, includeFixed }, g),
      error: null,
    };
  } catch (e) {
    if (e instanceof ScenarioError) return { shares: null, error: e };
    throw e;
  }
}

export function useScenarioShares(
  prepared: PreparedShareModel | null,
  alternatives: readonly ScenarioAlternative[],
  includeFixed: boolean,
  groups?: ShareGroups | null,
): ScenarioOutcome {
  return useMemo(
    () => computeOutcome(prepared, alternatives, includeFixed, groups),
    [prepared, alternatives, includeFixed, groups],
  );
}
