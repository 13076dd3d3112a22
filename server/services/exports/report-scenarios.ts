/**
 * The saved what-if scenarios of a study, computed for the run a report is printed for: each
 * scenario's shares with their 95 % intervals and its welfare against the status quo, by the
 * same shared engine as the Shares screen and the share downloads (shared/engine/shares,
 * share-welfare.ts). A scenario that no longer fits the study (an edited level) is listed with
 * the reason instead of numbers.
 */
import type { AppDeps } from '../../deps';
import { listShareScenarios } from '../../../db/queries/share-scenarios';
import {
  computeScenarioShares,
  type ScenarioShares,
} from '../../../shared/engine/shares/share-model';
import { ScenarioError } from '../../../shared/engine/shares/code-scenario';
import type { ScenarioAlternative, ShareMethod } from '../../../shared/schemas/shares';
import { loadPreparedShareModel } from '../shares';
import { computeScenarioWelfare, type WelfareOutcome } from '../share-welfare';
import { describeLevels } from '../shares/share-export';
import type { Actor } from '../actor';

export type ReportScenario = {
  name: string;
  /** Each alternative with its levels in words. */
  alternatives: { name: string; levels: string }[];
} & (
  | { shares: ScenarioShares; welfare: WelfareOutcome; error: null }
  | { shares: null; welfare: null; error: string }
);

export type ReportScenarios = {
  scenarios: ReportScenario[];
  method: ShareMethod | null;
  intervalNote: string | null;
};

export async function loadReportScenarios(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  runId: string,
): Promise<ReportScenarios> {
  const saved = await listShareScenarios(deps.db, { teamId: actor.teamId, studyId });
  if (saved.length === 0) return { scenarios: [], method: null, intervalNote: null };
  const { ctx, prepared } = await loadPreparedShareModel(deps, actor, studyId, runId);
  const model = prepared.model;
  const scenarios = saved.map((row): ReportScenario => {
    const alternatives = (row.alternatives as ScenarioAlternative[]).map((a) => ({
      name: a.name,
      levels: describeLevels(ctx.definition, a.levels),
    }));
    try {
      const shares = computeScenarioShares(prepared, {
        alternatives: row.alternatives as ScenarioAlternative[],
        includeFixed: row.includeFixed,
      });
      const welfare = computeScenarioWelfare(ctx, prepared, shares);
      return { name: row.name, alternatives, shares, welfare, error: null };
    } catch (e) {
      // The saved scenario names a level the study no longer has: say so, print the rest.
      if (!(e instanceof ScenarioError)) throw e;
      return { name: row.name, alternatives, shares: null, welfare: null, error: e.message };
    }
  });
  return { scenarios, method: model.method, intervalNote: model.intervalNote };
}
