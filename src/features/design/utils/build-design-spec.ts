/**
 * The Tasks form's text inputs turned into a design spec, checked with the shared schema so
 * the form shows the same messages the server would.
 */
import { designSpecSchema, type DesignSpec } from '@shared/schemas/design-spec';
import type { CodedColumn } from '@shared/engine/coding/coded-columns';
import { readTypedNumber } from '@/lib/typed-number';

export type PriorInputs = Record<string, { mean: string; sd: string }>;

export type DesignFormValues = {
  method: DesignSpec['method'];
  tasks: string;
  blocks: string;
  starts: string;
  seed: string;
  priorsKind: 'zero' | 'fixed' | 'bayesian';
  draws: string;
  priors: PriorInputs;
  /** What the search minimises (D-efficient only). */
  criterion: DesignSpec['criterion'];
  tValue: string;
  /** The run the priors came from, kept with the spec for the record. */
  priorsSource?: DesignSpec['priorsSource'];
  /** Dominance screening switches (see shared/schemas/design-spec.ts). */
  dominance: DesignSpec['dominance'];
  minAppearances: string;
  levelBalance: boolean;
  /** Empty: no limit. */
  maxOverlap: string;
};

export const defaultDesignForm: DesignFormValues = {
  method: 'd_efficient',
  tasks: '12',
  blocks: '2',
  starts: '5',
  seed: '1',
  priorsKind: 'zero',
  draws: '200',
  priors: {},
  criterion: 'd_error',
  tValue: '1.96',
  dominance: { betweenDesigned: true, overFixed: true, byFixed: true },
  minAppearances: '1',
  levelBalance: false,
  maxOverlap: '',
};

/** A setting typed as text (a decimal comma read as a point); empty or not a number is NaN. */
const num = (s: string) => readTypedNumber(s) ?? Number.NaN;

export function buildDesignSpec(
  v: DesignFormValues,
  columns: CodedColumn[],
): { ok: true; spec: DesignSpec } | { ok: false; errors: Map<string, string> } {
  const priorColumns = columns.map((c) => ({
    key: c.key,
    mean: num(v.priors[c.key]?.mean ?? '0'),
    sd: num(v.priors[c.key]?.sd ?? '0'),
  }));
  const raw = {
    method: v.method,
    tasks: v.method === 'full_factorial' && v.tasks.trim() === '' ? undefined : num(v.tasks),
    blocks: num(v.blocks),
    starts: num(v.starts),
    seed: num(v.seed),
    criterion: v.method === 'd_efficient' ? v.criterion : 'd_error',
    priorsSource:
      v.method === 'd_efficient' && v.priorsKind !== 'zero' ? v.priorsSource : undefined,
    tValue: num(v.tValue),
    priors:
      v.method !== 'd_efficient' || v.priorsKind === 'zero'
        ? { kind: 'zero' }
        : v.priorsKind === 'fixed'
          ? { kind: 'fixed', columns: priorColumns.map(({ key, mean }) => ({ key, mean })) }
          : { kind: 'bayesian', columns: priorColumns, draws: num(v.draws) },
    dominance: v.dominance,
    balance: {
      minAppearances: num(v.minAppearances),
      levelBalance: v.levelBalance,
      maxOverlap: v.maxOverlap.trim() === '' ? null : num(v.maxOverlap),
    },
  };
  const parsed = designSpecSchema.safeParse(raw);
  if (parsed.success) return { ok: true, spec: parsed.data };
  const errors = new Map<string, string>();
  for (const issue of parsed.error.issues) {
    const path = issue.path.join('.');
    if (!errors.has(path)) errors.set(path, issue.message);
  }
  return { ok: false, errors };
}

/** The form filled from the spec of the current design, so a re-run starts from it. */
export function formValuesFromSpec(spec: Partial<DesignSpec> | undefined): DesignFormValues {
  if (!spec || !spec.method || !['d_efficient', 'random', 'full_factorial'].includes(spec.method))
    return defaultDesignForm;
  const priors: PriorInputs = {};
  const p = spec.priors;
  if (p && p.kind !== 'zero')
    for (const c of p.columns)
      priors[c.key] = { mean: String(c.mean), sd: 'sd' in c ? String(c.sd) : '0' };
  return {
    method: spec.method,
    tasks: spec.tasks !== undefined ? String(spec.tasks) : '',
    blocks: String(spec.blocks ?? 1),
    starts: String(spec.starts ?? 5),
    seed: String(spec.seed ?? 1),
    priorsKind: p?.kind ?? 'zero',
    draws: p?.kind === 'bayesian' ? String(p.draws) : '200',
    priors,
    criterion: spec.criterion ?? 'd_error',
    priorsSource: spec.priorsSource,
    tValue: String(spec.tValue ?? 1.96),
    dominance: { ...defaultDesignForm.dominance, ...spec.dominance },
    minAppearances: String(spec.balance?.minAppearances ?? 1),
    levelBalance: spec.balance?.levelBalance ?? false,
    maxOverlap:
      spec.balance?.maxOverlap === null || spec.balance?.maxOverlap === undefined
        ? ''
        : String(spec.balance.maxOverlap),
  };
}
