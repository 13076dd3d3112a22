/**
 * The Models form's values and their translation into the shared create-run input, with
 * sensible defaults: a first run is an MNL with every coded column; later ones propose a mixed
 * logit with normal attribute tastes and a negative lognormal cost (constants stay fixed). HB
 * uses the same defaults; a latent class model has fixed coefficients within each class.
 */
import type { FieldErrors } from 'react-hook-form';
import {
  createRunSchema,
  type CreateRunInput,
  type ModelColumn,
  type RunOptions,
} from '@shared/schemas/run';
import type { CoefficientDistributionInput } from '@shared/schemas/estimation-spec';
import { HB_DEFAULTS, LATENT_CLASS_DEFAULT_STARTS } from '@shared/schemas/estimation-families';

export type ColumnChoice = 'omit' | CoefficientDistributionInput;
export type RunFormModel = 'mnl' | 'mixed' | 'hb' | 'latent_class';

/** Starting points the form proposes per model (the engines' defaults). */
const DEFAULT_STARTS: Record<RunFormModel, number> = {
  mnl: 3,
  mixed: 3,
  hb: 3,
  latent_class: LATENT_CLASS_DEFAULT_STARTS,
};

export interface RunFormValues {
  name: string;
  model: RunFormModel;
  columns: { distribution: ColumnChoice }[];
  correlated: boolean;
  drawsType: 'halton' | 'sobol' | 'mlhs' | 'random';
  drawsCount: number;
  seed: number;
  profileDraws: number;
  starts: number;
  /** '' = every included respondent. */
  filterId: string;
  space: 'preference' | 'wtp';
  covariance: 'robust' | 'classical' | 'bhhh';
  tolerance: number;
  gradientTolerance: number;
  /** '' = the model's default. */
  maxIterations: string;
  simulationCheck: boolean;
  /** HB sampler: iterations per chain, burn-in ('' = half), thinning, chains. */
  mcmcIterations: number;
  mcmcBurnin: string;
  mcmcThin: number;
  /** Random-walk MH steps per respondent per iteration. */
  mcmcSteps: number;
  mcmcChains: number;
  priorPreset: 'rossi' | 'train';
  priorMuVariance: number;
  /** Latent class: fewest and most classes (equal = one class count). */
  classesMin: number;
  classesMax: number;
  /** Latent class: keys of the background questions class membership depends on. */
  membership: string[];
}

export function getColumnDefault(column: ModelColumn, model: RunFormModel): ColumnChoice {
  if (model === 'mnl' || model === 'latent_class' || column.kind === 'constant') return 'fixed';
  return column.isCost ? 'neg_lognormal' : 'normal';
}

/** The HB sampler defaults in words, for the form's help. */
export const HB_DEFAULTS_TEXT = `${HB_DEFAULTS.iterations.toLocaleString('en-GB')} iterations per chain with the first half as burn-in, every ${HB_DEFAULTS.thin}th draw kept, ${HB_DEFAULTS.steps} MH steps per respondent per iteration, ${HB_DEFAULTS.chains} chains`;

export function getDefaultRunFormValues(options: RunOptions): RunFormValues {
  const model: RunFormModel = options.hasRuns ? 'mixed' : 'mnl';
  return {
    name: '',
    model,
    columns: options.columns.map((c) => ({ distribution: getColumnDefault(c, model) })),
    correlated: false,
    drawsType: 'halton',
    drawsCount: 500,
    seed: 1,
    profileDraws: 2000,
    starts: 3,
    filterId: '',
    space: 'preference',
    covariance: 'robust',
    tolerance: 1e-7,
    gradientTolerance: 6.055454452393343e-6,
    maxIterations: '',
    simulationCheck: false,
    mcmcIterations: HB_DEFAULTS.iterations,
    mcmcBurnin: '',
    mcmcThin: HB_DEFAULTS.thin,
    mcmcSteps: HB_DEFAULTS.steps,
    mcmcChains: HB_DEFAULTS.chains,
    priorPreset: 'rossi',
    priorMuVariance: 100,
    classesMin: 2,
    classesMax: 4,
    membership: [],
  };
}

export function getDefaultStarts(model: RunFormModel): number {
  return DEFAULT_STARTS[model];
}

export function toCreateRunInput(values: RunFormValues, columns: ModelColumn[]): CreateRunInput {
  const used = columns
    .map((column, i) => ({ column, choice: values.columns[i]?.distribution ?? 'omit' }))
    .filter((x) => x.choice !== 'omit');
  const cost = used.find((x) => x.column.isCost);
  const mixed = values.model === 'mixed';
  const hb = values.model === 'hb';
  const lc = values.model === 'latent_class';
  return {
    name: values.name,
    spec: {
      model: values.model,
      coefficients: used.map(({ column, choice }) => ({
        name: column.code,
        column: column.key,
        distribution: choice as CoefficientDistributionInput,
      })),
      correlated: (mixed || hb) && values.correlated,
      draws: { type: values.drawsType, count: values.drawsCount, seed: values.seed },
      profileDraws: values.profileDraws,
      starts: values.starts,
      ...(cost ? { cost: cost.column.code } : {}),
      space: values.space,
      settings: {
        covariance: values.covariance,
        tolerance: values.tolerance,
        gradientTolerance: values.gradientTolerance,
        ...(values.maxIterations.trim() !== ''
          ? { maxIterations: Number(values.maxIterations) }
          : {}),
        simulationCheck: mixed && values.simulationCheck,
      },
      ...(hb
        ? {
            mcmc: {
              iterations: values.mcmcIterations,
              ...(values.mcmcBurnin.trim() !== '' ? { burnin: Number(values.mcmcBurnin) } : {}),
              thin: values.mcmcThin,
              steps: values.mcmcSteps,
              chains: values.mcmcChains,
              seed: values.seed,
            },
            priors: { preset: values.priorPreset, muVariance: values.priorMuVariance },
          }
        : {}),
      ...(lc
        ? {
            classes:
              values.classesMin === values.classesMax
                ? values.classesMin
                : ([values.classesMin, values.classesMax] as [number, number]),
            ...(values.membership.length > 0 ? { membership: values.membership } : {}),
          }
        : {}),
    },
    respondents: { filterId: values.filterId || null },
  };
}

const fieldOfSpec: Record<string, keyof RunFormValues> = {
  'spec.draws.type': 'drawsType',
  'spec.draws.count': 'drawsCount',
  'spec.draws.seed': 'seed',
  'spec.profileDraws': 'profileDraws',
  'spec.starts': 'starts',
  'spec.correlated': 'correlated',
  'spec.space': 'space',
  'spec.settings.covariance': 'covariance',
  'spec.settings.tolerance': 'tolerance',
  'spec.settings.gradientTolerance': 'gradientTolerance',
  'spec.settings.maxIterations': 'maxIterations',
  'spec.model': 'model',
  'spec.mcmc.iterations': 'mcmcIterations',
  'spec.mcmc.burnin': 'mcmcBurnin',
  'spec.mcmc.thin': 'mcmcThin',
  'spec.mcmc.steps': 'mcmcSteps',
  'spec.mcmc.chains': 'mcmcChains',
  'spec.mcmc.seed': 'seed',
  'spec.priors.preset': 'priorPreset',
  'spec.priors.muVariance': 'priorMuVariance',
  'spec.priors.nu': 'priorPreset',
  'spec.classes': 'classesMax',
  'spec.classes.0': 'classesMin',
  'spec.classes.1': 'classesMax',
  'spec.membership': 'membership',
  name: 'name',
  'respondents.filterId': 'filterId',
};

/** Maps an issue path of the create-run input onto a form field ('root' when none fits). */
export function toFormField(path: string, values: RunFormValues): string {
  const m = /^spec\.coefficients\.(\d+)\./.exec(path);
  if (m) {
    const used = values.columns
      .map((c, i) => ({ c, i }))
      .filter((x) => x.c.distribution !== 'omit');
    const hit = used[Number(m[1])];
    return hit ? `columns.${hit.i}.distribution` : 'root';
  }
  if (path === 'spec.coefficients' || path === 'spec.cost') return 'root';
  if (/^spec\.membership\.\d+$/.test(path)) return 'membership';
  return fieldOfSpec[path] ?? 'root';
}

/** react-hook-form resolver that validates with the shared create-run schema. */
export function createRunFormResolver(columns: ModelColumn[]) {
  return async (values: RunFormValues) => {
    const parsed = createRunSchema.safeParse(toCreateRunInput(values, columns));
    if (parsed.success) return { values, errors: {} };
    const errors: Record<string, { type: string; message: string }> = {};
    for (const issue of parsed.error.issues) {
      const field = toFormField(issue.path.join('.'), values);
      errors[field] ??= { type: 'validation', message: issue.message };
    }
    return { values: {}, errors: nestErrors(errors) as FieldErrors<RunFormValues> };
  };
}

/** Turns { 'columns.2.distribution': e } into { columns: { 2: { distribution: e } } }. */
function nestErrors(flat: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [path, error] of Object.entries(flat)) {
    const parts = path.split('.');
    let node = out;
    parts.slice(0, -1).forEach((p) => {
      node[p] ??= {};
      node = node[p] as Record<string, unknown>;
    });
    node[parts[parts.length - 1]] = error;
  }
  return out;
}
