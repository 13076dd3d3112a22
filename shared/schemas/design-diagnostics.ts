/**
 * The diagnostics of a design as the API sends them (the design engine computes them, the
 * design screens show them): plain JSON-safe objects, written once here so the client needs
 * nothing from the server's engine. The methods behind each figure are in docs/methods.md.
 */
import type { CodedColumn } from '../engine/coding/coded-columns';
import type { DesignCriterion, DesignPriors, DesignSpec } from './design-spec';

export interface StreetBurgessEfficiency {
  detC: number;
  detOptimal: number;
  efficiency: number;
}

export interface AttributeLevelBalance {
  attributeId: string;
  name: string;
  /** Counts over the designed alternatives; `inStatusQuo`: the status quo shows the level. */
  levels: { levelId: string; label: string; count: number; share: number; inStatusQuo: boolean }[];
  /** byBlock[b][l]: count of level l in block b+1. */
  byBlock: number[][];
  /** Max minus min count over levels (0 or 1 = balanced as far as the task count allows). */
  spread: number;
}

export interface AttributeOverlap {
  attributeId: string;
  name: string;
  /** Share of tasks with full overlap on this attribute, or null when never comparable. */
  share: number | null;
}

export interface CriterionValue {
  criterion: DesignCriterion;
  /** null when the criterion is infinite (singular design) or not available. */
  value: number | null;
  /** Why the criterion is not available (priors or attributes), or null. */
  unavailable: string | null;
}

export interface CriteriaReport {
  /** The criterion the coordinate exchange minimised (D-error for other methods). */
  searched: DesignCriterion;
  /** Target t-ratio of the S-estimate. */
  tValue: number;
  values: CriterionValue[];
}

export interface CoefficientSampleSize {
  key: string;
  name: string;
  prior: number;
  /** Standard error for one replication of the design, sqrt(Σ₁,kk); null when singular. */
  standardErrorOne: number | null;
  /** Design replications for |t| = 1.96; null when the prior is 0. */
  replicationsForT: number | null;
  /** Design replications for 80 % power at α = 0.05; null when the prior is 0. */
  replicationsForPower: number | null;
}

export interface SampleSizeGuide {
  coefficients: CoefficientSampleSize[];
  /** Largest N_k (t = 1.96) over coefficients with non-zero priors, rounded up; null if none. */
  sEstimateReplications: number | null;
  /** sEstimateReplications × blocks: respondents when each answers one block. */
  sEstimateRespondents: number | null;
  /** Same for 80 % power. */
  powerRespondents: number | null;
  ruleOfThumb: { respondents: number; c: number; t: number; a: number; note: string };
}

export type DominanceRuleName = 'betweenDesigned' | 'overFixed' | 'byFixed';

export interface DominanceRuleReport {
  rule: DominanceRuleName;
  /** Switched on for this design; null when the spec is unknown (imported designs). */
  active: boolean | null;
  /** False when the rule cannot apply (no opt-out / status quo, or no known ordering). */
  applies: boolean;
  /** Tasks with at least one case, and the designed alternatives concerned. */
  tasks: number;
  alternatives: number;
}

export interface RuleReport {
  /** True when the priors give some attribute a known ordering (else no dominance shows). */
  dominanceKnown: boolean;
  dominance: DominanceRuleReport[];
  excludedCombinations: { id: string; text: string; breaches: number }[];
  balance: {
    rules: DesignSpec['balance'] | null;
    /** Levels a designed alternative may show that appear fewer times than required. */
    levelsBelowMinimum: number;
    /** Tasks where more attributes than allowed show one level in every alternative. */
    tasksOverOverlap: number;
  };
  blocks: {
    balanced: boolean;
    /** Largest |count − fair share| over levels and blocks, and where it is. */
    worstDeviation: number;
    worst: { attribute: string; level: string; block: number; count: number; fair: number } | null;
  };
}

export interface DesignDiagnostics {
  columns: Pick<CodedColumn, 'key' | 'name' | 'kind'>[];
  parameters: number;
  tasks: number;
  blocks: number;
  tasksPerBlock: number[];
  priorsKind: DesignPriors['kind'];
  /**
   * The criterion of the priors kind: D₀, D_p at the means, or Bayesian D_B. All D-errors
   * are null when the information matrix is singular (D-error +∞), so the object stays
   * JSON-safe; `identified` says which case applies.
   */
  dError: number | null;
  identified: boolean;
  dErrorZero: number | null;
  /** D_p at the prior means (null for zero priors or when singular). */
  dErrorAtMeans: number | null;
  /** D_B over the prior draws (null unless Bayesian, or when singular). */
  dErrorBayesian: number | null;
  /**
   * All four criteria under the priors (Bayesian averages for Bayesian priors) and the one the
   * search minimised. Absent from designs stored before the criteria existed.
   */
  criteria?: CriteriaReport;
  /** Street–Burgess efficiency at β = 0; null when the reference does not apply. */
  dEfficiency: StreetBurgessEfficiency | null;
  levelBalance: AttributeLevelBalance[];
  overlap: AttributeOverlap[];
  /** K × K correlations over designed rows, in `columns` order (null = no variation). */
  correlations: (number | null)[][];
  /** Per task (design order): probabilities of the designed alternatives, then the fixed one. */
  choiceProbabilities: { task: number; block: number; probabilities: number[] }[];
  sampleSize: SampleSizeGuide;
  /** Dominance, excluded combinations, balance rules and block balance. */
  rules: RuleReport;
  /** What makes the design unusable (a level respondents never see). */
  errors: string[];
  warnings: string[];
}
