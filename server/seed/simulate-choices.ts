/**
 * The data-generating process of the demo respondents: a panel mixed logit with known
 * population parameters (DEMO_TRUTH). Each respondent draws their own coefficients once; each
 * choice adds independent standard Gumbel errors (Train 2009, ch. 3 and 6). Everything is a
 * pure function of seeds, so tests can replay every stored choice.
 */
import { createPrng, type Prng } from '../engine/draws/prng';
import { randomIndex } from '../engine/draws/random-index';
import type { StudyDefinition } from '../../shared/schemas/study-definition';
import type { DisplayAlternative } from '../../shared/schemas/respondent';

export type DemoCoefficient =
  | 'cost'
  | 'interruptions'
  | 'warnings'
  | 'river_fair'
  | 'river_good'
  | 'renewables'
  | 'asc_status_quo';

/**
 * True population parameters (invented for the demo). Units: cost per € of monthly bill
 * increase, interruptions per interruption a year, warnings per warning day a year, renewables
 * per percentage point, river dummies against "poor", the constant on the status quo.
 * Cost is negative lognormal: β = −exp(mu + sigma·z), z ~ N(0, 1).
 */
export const DEMO_TRUTH = {
  seed: 20_260_417,
  completes: 400,
  /** Respondents who start and leave part-way. */
  dropouts: 14,
  coefficients: {
    cost: { distribution: 'neg_lognormal', mu: Math.log(0.15), sigma: 0.5 },
    interruptions: { distribution: 'normal', mean: -0.25, sd: 0.15 },
    warnings: { distribution: 'normal', mean: -0.12, sd: 0.08 },
    river_fair: { distribution: 'normal', mean: 0.6, sd: 0.4 },
    river_good: { distribution: 'normal', mean: 1.1, sd: 0.6 },
    renewables: { distribution: 'normal', mean: 0.012, sd: 0.01 },
    asc_status_quo: { distribution: 'fixed', value: 0.4 },
  },
  /** How many completes behave badly, by kind. */
  behaviours: { speeder_random: 6, speeder_same_position: 5, dominance_failure: 14 },
} as const;

export type Behaviour =
  'attentive' | 'speeder_random' | 'speeder_same_position' | 'dominance_failure';

/** What is stored in respondents.simulated_truth. */
export type SimulatedTruth = {
  behaviour: Behaviour;
  /** Seed of this respondent's choice errors, timings and background answers. */
  seed: number;
  coefficients: Record<DemoCoefficient, number>;
};

/** Standard normal by Box–Muller (two uniforms per draw; the second is discarded for clarity). */
export function drawNormal(random: Prng): number {
  const u1 = random.nextDouble(); // (0, 1): log stays finite
  const u2 = random.nextDouble();
  return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
}

/** Standard Gumbel (type I extreme value), the logit error: −ln(−ln U). */
export function drawGumbel(random: Prng): number {
  const u = Math.min(1 - 1e-12, Math.max(1e-12, random.nextDouble()));
  return -Math.log(-Math.log(u));
}

export function drawCoefficients(random: Prng): Record<DemoCoefficient, number> {
  const c = DEMO_TRUTH.coefficients;
  const normal = (p: { mean: number; sd: number }) => p.mean + p.sd * drawNormal(random);
  return {
    cost: -Math.exp(c.cost.mu + c.cost.sigma * drawNormal(random)),
    interruptions: normal(c.interruptions),
    warnings: normal(c.warnings),
    river_fair: normal(c.river_fair),
    river_good: normal(c.river_good),
    renewables: normal(c.renewables),
    asc_status_quo: c.asc_status_quo.value,
  };
}

/** How each demo attribute enters utility, found from the definition by role and name. */
export type DemoCoding = {
  cost: string;
  interruptions: string;
  warnings: string;
  renewables: string;
  river: string;
  riverFair: string;
  riverGood: string;
  valueOf: Map<string, number>;
};

export function mapDemoDefinition(definition: StudyDefinition): DemoCoding {
  const find = (test: (name: string) => boolean, what: string) => {
    const a = definition.attributes.find((x) => test(x.name.toLowerCase()));
    if (!a) throw new Error(`The demo definition has no ${what} attribute`);
    return a;
  };
  const cost = definition.attributes.find((a) => a.isCost);
  if (!cost) throw new Error('The demo definition has no cost attribute');
  const river = find((n) => n.includes('river'), 'river health');
  const level = (label: string) => {
    const l = river.levels.find((x) => x.label.toLowerCase() === label);
    if (!l) throw new Error(`River health has no "${label}" level`);
    return l.id;
  };
  const valueOf = new Map<string, number>();
  for (const a of definition.attributes)
    for (const l of a.levels) if (l.value !== undefined) valueOf.set(`${a.id}:${l.id}`, l.value);
  return {
    cost: cost.id,
    interruptions: find((n) => n.includes('interruption'), 'interruptions').id,
    warnings: find((n) => n.includes('warning'), 'warnings').id,
    renewables: find((n) => n.includes('renewable'), 'renewable share').id,
    river: river.id,
    riverFair: level('fair'),
    riverGood: level('good'),
    valueOf,
  };
}

/** Systematic utility of one displayed alternative (the status quo carries the constant). */
export function utilityOf(
  coefs: Record<DemoCoefficient, number>,
  alt: Pick<DisplayAlternative, 'levels' | 'fixed'>,
  coding: DemoCoding,
): number {
  const value = (attrId: string) => {
    const lv = alt.levels[attrId];
    const v = lv === undefined ? undefined : coding.valueOf.get(`${attrId}:${lv}`);
    if (v === undefined) throw new Error(`No numeric level for attribute ${attrId}`);
    return v;
  };
  const river = alt.levels[coding.river];
  return (
    coefs.cost * value(coding.cost) +
    coefs.interruptions * value(coding.interruptions) +
    coefs.warnings * value(coding.warnings) +
    coefs.renewables * value(coding.renewables) +
    (river === coding.riverFair ? coefs.river_fair : 0) +
    (river === coding.riverGood ? coefs.river_good : 0) +
    (alt.fixed ? coefs.asc_status_quo : 0)
  );
}

/** A generator private to one respondent and one screen: replays do not depend on order. */
export function screenRandom(seed: number, screenKey: string): Prng {
  let h = seed >>> 0;
  for (let i = 0; i < screenKey.length; i++) h = Math.imul(h ^ screenKey.charCodeAt(i), 0x01000193);
  return createPrng(h >>> 0);
}

/**
 * The on-screen position this respondent picks. Attentive respondents maximise utility plus
 * Gumbel errors; random speeders pick uniformly; same-position speeders always take the first
 * card. The dominance test is passed (index 0 is dominant) except by dominance failures.
 */
export function simulateChoice(
  truth: SimulatedTruth,
  screen: { key: string; taskKind: string; alternatives: DisplayAlternative[] },
  coding: DemoCoding,
): number {
  const random = screenRandom(truth.seed, screen.key);
  const n = screen.alternatives.length;
  if (screen.taskKind === 'dominance') {
    const dominant = screen.alternatives.findIndex((a) => a.index === 0);
    if (truth.behaviour !== 'dominance_failure') return dominant;
    const others = screen.alternatives.map((_, p) => p).filter((p) => p !== dominant);
    return others[randomIndex(random, others.length)];
  }
  if (truth.behaviour === 'speeder_same_position') return 0;
  if (truth.behaviour === 'speeder_random') return randomIndex(random, n);
  let best = 0;
  let bestU = -Infinity;
  screen.alternatives.forEach((alt, p) => {
    const u = utilityOf(truth.coefficients, alt, coding) + drawGumbel(random);
    if (u > bestU) {
      bestU = u;
      best = p;
    }
  });
  return best;
}
