/**
 * Who the demo respondents are and how they behave apart from their choices: when they start,
 * their device, how fast they answer, where drop-outs stop, and their background answers.
 * Pure functions of seeds (invented figures; plausible, not calibrated to any survey).
 */
import { createPrng, type Prng } from '../engine/draws/prng';
import { randomIndex, shuffleInPlace } from '../engine/draws/random-index';
import type { AnswerValue, RespondentScreen } from '../../shared/schemas/respondent';
import {
  DEMO_TRUTH,
  drawCoefficients,
  drawNormal,
  type Behaviour,
  type SimulatedTruth,
} from './simulate-choices';

export type DemoPerson = {
  n: number;
  truth: SimulatedTruth;
  startedAt: Date;
  device: 'phone' | 'desktop' | 'tablet';
  externalId: string;
  /** Drop-outs answer this many screens and leave; null for completes. */
  stopAfter: number | null;
  /** Multiplies every screen time: < 1 is faster. */
  speed: number;
};

const DAY = 86_400_000;

function pickWeighted<T>(random: Prng, items: readonly T[], weights: readonly number[]): T {
  const total = weights.reduce((a, b) => a + b, 0);
  let u = random.nextDouble() * total;
  for (let i = 0; i < items.length; i++) {
    u -= weights[i];
    if (u < 0) return items[i];
  }
  return items[items.length - 1];
}

/** Most people answer in the days after the invitation, a second wave after the reminder. */
function startTime(random: Prng, fieldStart: Date): Date {
  const wave = random.nextDouble() < 0.65 ? 0 : 7;
  const mean = wave === 0 ? 2.5 : 2;
  const day = Math.min(20, wave + Math.floor(-mean * Math.log(1 - random.nextDouble())));
  const minuteOfDay = 7 * 60 + randomIndex(random, 15 * 60);
  return new Date(
    fieldStart.getTime() + day * DAY + minuteOfDay * 60_000 + randomIndex(random, 60_000),
  );
}

/** The demo panel, sorted by start time (blocks are then assigned in arrival order). */
export function planDemoPeople(fieldStart: Date, screensPerRespondent: number): DemoPerson[] {
  const random = createPrng(DEMO_TRUTH.seed);
  const { completes, dropouts, behaviours } = DEMO_TRUTH;
  const kinds: Behaviour[] = [
    ...Array<Behaviour>(behaviours.speeder_random).fill('speeder_random'),
    ...Array<Behaviour>(behaviours.speeder_same_position).fill('speeder_same_position'),
    ...Array<Behaviour>(behaviours.dominance_failure).fill('dominance_failure'),
  ];
  const order = Array.from({ length: completes }, (_, i) => i);
  shuffleInPlace(random, order);
  const behaviourOf = new Map(order.slice(0, kinds.length).map((n, i) => [n, kinds[i]]));
  const people: DemoPerson[] = [];
  for (let n = 0; n < completes + dropouts; n++) {
    const behaviour = behaviourOf.get(n) ?? 'attentive';
    const speeder = behaviour.startsWith('speeder');
    people.push({
      n,
      truth: {
        behaviour,
        seed: (DEMO_TRUTH.seed ^ Math.imul(n + 1, 0x9e3779b1)) >>> 0,
        coefficients: drawCoefficients(random),
      },
      startedAt: startTime(random, fieldStart),
      device: pickWeighted(random, ['phone', 'desktop', 'tablet'] as const, [58, 30, 12]),
      externalId: `LV-${String(1001 + n)}`,
      stopAfter:
        n >= completes ? 1 + randomIndex(random, Math.max(1, screensPerRespondent - 2)) : null,
      speed: speeder ? 0.15 + 0.1 * random.nextDouble() : Math.exp(0.3 * drawNormal(random)),
    });
  }
  return people.sort((a, b) => a.startedAt.getTime() - b.startedAt.getTime() || a.n - b.n);
}

/**
 * Time on one screen in ms. Choice tasks get quicker as respondents learn the format (common
 * practice, no source; docs/methods.md, "Fieldwork, quality flags"); phones take about 20 % longer
 * (Andreadis 2015, Survey Research Methods 9(2); docs/methods.md).
 */
export function screenTimeMs(
  person: DemoPerson,
  screen: RespondentScreen,
  taskIndex: number,
  random: Prng,
): number {
  const base =
    screen.kind === 'consent'
      ? 25_000
      : screen.kind === 'instructions'
        ? 18_000
        : screen.kind === 'question'
          ? 7_000
          : screen.kind === 'task' && screen.taskKind === 'design'
            ? 10_000 + 20_000 * Math.exp(-0.25 * taskIndex)
            : 14_000;
  const device = person.device === 'phone' ? 1.2 : 1;
  return Math.max(
    600,
    Math.round(base * device * person.speed * Math.exp(0.25 * drawNormal(random))),
  );
}

/** Background answers in plausible shares: household size, age band, filtered tap water. */
export function backgroundAnswer(
  screen: Extract<RespondentScreen, { kind: 'question' }>,
  random: Prng,
): AnswerValue {
  const q = screen.question;
  switch (q.type) {
    case 'number': {
      if (q.key === 'household_size')
        return {
          kind: 'number',
          number: pickWeighted(random, [1, 2, 3, 4, 5, 6], [28, 34, 15, 14, 6, 3]),
        };
      return { kind: 'number', number: q.min + randomIndex(random, Math.floor(q.max - q.min) + 1) };
    }
    case 'single': {
      const weights =
        q.key === 'age_band' && q.options.length === 4
          ? [22, 36, 30, 12]
          : q.key === 'filters_water' && q.options.length === 2
            ? [30, 70]
            : q.options.map(() => 1);
      return { kind: 'single', optionId: pickWeighted(random, q.options, weights).id };
    }
    case 'multiple':
      return { kind: 'multiple', optionIds: [q.options[randomIndex(random, q.options.length)].id] };
    case 'text':
      return { kind: 'text', text: '' };
  }
}
