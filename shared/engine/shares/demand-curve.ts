/**
 * A demand curve: the share of one alternative of a scenario as one of its attributes (usually
 * the cost) moves across its range, everything else held fixed. A linearly coded numeric
 * attribute is swept at evenly spaced values between its lowest and highest level (its coded
 * column is the value itself, so values between the levels are the model's own linear
 * interpolation); any other attribute is swept over its levels, since the model says nothing
 * between them. Every point carries the scenario's interval (share-model.ts).
 */
import { codeAlternative } from '../coding/code-alternative';
import { codeScenario, ScenarioError, toRunOrder } from './code-scenario';
import { computeRowShares, type PreparedShareModel, type ScenarioRequest } from './share-model';

export interface SweepRequest {
  /** Which of the scenario's alternatives moves (0-based, designed alternatives only). */
  alternative: number;
  attributeId: string;
  /** Points of a linear sweep (ignored for levels); default 11. */
  points?: number;
}

export interface DemandPoint {
  /** The attribute's value (linear) or the level's index. */
  value: number;
  /** Level id when the point is a level, else null. */
  levelId: string | null;
  share: number;
  lower: number | null;
  upper: number | null;
}

export interface DemandCurve {
  attributeId: string;
  alternative: number;
  /** 'linear': values between the lowest and highest level; 'levels': one point per level. */
  scale: 'linear' | 'levels';
  points: DemandPoint[];
}

export const MAX_SWEEP_POINTS = 41;

export function sweepDemandCurve(
  p: PreparedShareModel,
  scenario: ScenarioRequest,
  sweep: SweepRequest,
): DemandCurve {
  const { plan, definition } = p.coder;
  const K = p.model.coefficients.length;
  const alt = scenario.alternatives[sweep.alternative];
  if (!alt)
    throw new ScenarioError(
      'Choose one of the scenario’s alternatives.',
      'sweep.alternative',
      'Unknown alternative',
    );
  const a = plan.attributes.findIndex((x) => x.id === sweep.attributeId);
  const attribute = definition.attributes[a];
  if (a < 0 || !attribute)
    throw new ScenarioError(
      'The study has no such attribute.',
      'sweep.attributeId',
      'Unknown attribute',
    );
  if (plan.omitted[alt.alternative * plan.attributes.length + a] === 1)
    throw new ScenarioError(
      `${attribute.name} is not shown for this alternative.`,
      'sweep.attributeId',
      'Not an attribute of this alternative',
    );
  const coded = codeScenario(p.coder, scenario.alternatives, scenario.includeFixed);
  const J = coded.names.length;
  const rows = coded.rows;
  const planRow = new Float64Array(plan.columnCount);
  const at = (levels: Record<string, string>, value: number | null) => {
    codeAlternative(plan, alt.alternative, levels, planRow);
    if (value !== null) planRow[plan.attributes[a].offset] = value;
    toRunOrder(p.coder, planRow, rows, sweep.alternative * K);
    const r = computeRowShares(p, rows, J);
    const j = sweep.alternative;
    return {
      share: r.shares[j],
      lower: r.lower ? r.lower[j] : null,
      upper: r.upper ? r.upper[j] : null,
    };
  };
  if (attribute.coding === 'linear') {
    const values = attribute.levels.map((l) => l.value ?? 0);
    const lo = Math.min(...values);
    const hi = Math.max(...values);
    const n = Math.min(MAX_SWEEP_POINTS, Math.max(2, Math.round(sweep.points ?? 11)));
    const points = Array.from({ length: n }, (_, i) => {
      const value = lo + ((hi - lo) * i) / (n - 1);
      return { value, levelId: null, ...at(alt.levels, value) };
    });
    return { attributeId: attribute.id, alternative: sweep.alternative, scale: 'linear', points };
  }
  const points = attribute.levels.map((level, i) => ({
    value: i,
    levelId: level.id,
    ...at({ ...alt.levels, [attribute.id]: level.id }, null),
  }));
  return { attributeId: attribute.id, alternative: sweep.alternative, scale: 'levels', points };
}
