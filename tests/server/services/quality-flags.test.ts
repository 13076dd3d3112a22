import { describe, expect, it } from 'vitest';
import {
  answersInconsistently,
  choosesFixedAlways,
  choosesSamePosition,
  computeQualityFlags,
  failsDominance,
  isSpeeder,
  medianOf,
  speederThresholdMs,
  type ChoiceAnswer,
  type RespondentForFlags,
} from '../../../server/services/quality-flags';

const design = (taskNumber: number, alt: number, pos = alt): ChoiceAnswer => ({
  taskKind: 'design',
  taskNumber,
  chosenAlternative: alt,
  chosenPosition: pos,
});
const eight = (alt: (t: number) => number, pos?: (t: number) => number) =>
  Array.from({ length: 8 }, (_, i) => design(i + 1, alt(i + 1), pos ? pos(i + 1) : alt(i + 1)));

describe('medianOf', () => {
  it('takes the middle value of an odd count and the mean of the middle two of an even count', () => {
    // Definition of the sample median (common practice, no source): 1 3 3 6 7 8 9 -> 6;
    // 1 2 3 4 5 6 8 9 -> (4 + 5) / 2 = 4.5.
    expect(medianOf([9, 1, 3, 8, 3, 7, 6])).toBe(6);
    expect(medianOf([8, 1, 2, 9, 3, 4, 5, 6])).toBe(4.5);
    expect(medianOf([])).toBeNull();
  });
});

describe('speeders', () => {
  const durations = Array.from({ length: 11 }, (_, i) => (i + 1) * 60_000); // median 6 min
  it('cuts at the fraction of the median once there are enough completes', () => {
    expect(speederThresholdMs(durations, 0.5)).toBe(180_000);
    expect(speederThresholdMs(durations.slice(0, 9), 0.5)).toBeNull();
  });
  it('flags completed respondents strictly under the cut-off only', () => {
    expect(isSpeeder({ status: 'completed', durationMs: 179_999 }, 180_000)).toBe(true);
    expect(isSpeeder({ status: 'completed', durationMs: 180_000 }, 180_000)).toBe(false);
    expect(isSpeeder({ status: 'in_progress', durationMs: 1000 }, 180_000)).toBeNull();
    expect(isSpeeder({ status: 'completed', durationMs: 1000 }, null)).toBeNull();
  });
  it('refuses a fraction outside (0, 1)', () => {
    expect(() => speederThresholdMs(durations, 1)).toThrow(RangeError);
    expect(() => speederThresholdMs(durations, 0)).toThrow(RangeError);
  });
});

describe('choosesSamePosition', () => {
  it('flags the same position across all design tasks', () => {
    expect(
      choosesSamePosition(
        eight(
          (t) => t % 2,
          () => 0,
        ),
      ),
    ).toBe(true);
  });
  it('does not flag varied positions', () => {
    expect(choosesSamePosition(eight((t) => t % 2))).toBe(false);
  });
  it('ignores warm-up and other special tasks', () => {
    const choices = [
      ...eight(() => 1),
      { taskKind: 'warmup', taskNumber: null, chosenAlternative: 0, chosenPosition: 0 },
    ] satisfies ChoiceAnswer[];
    expect(choosesSamePosition(choices)).toBe(true);
  });
  it('leaves always-status-quo to its own flag, and too few tasks unassessed', () => {
    expect(
      choosesSamePosition(
        eight(
          () => -1,
          () => 2,
        ),
      ),
    ).toBe(false);
    expect(choosesSamePosition(eight(() => 0).slice(0, 3))).toBeNull();
  });
});

describe('choosesFixedAlways', () => {
  it('flags only when every design task went to the fixed alternative', () => {
    expect(
      choosesFixedAlways(
        eight(
          () => -1,
          () => 2,
        ),
        true,
      ),
    ).toBe(true);
    expect(
      choosesFixedAlways(
        eight(
          (t) => (t === 5 ? 0 : -1),
          () => 2,
        ),
        true,
      ),
    ).toBe(false);
    expect(
      choosesFixedAlways(
        eight(() => -1),
        false,
      ),
    ).toBeNull();
  });
});

describe('failsDominance', () => {
  const dom = (dominantChosen: boolean): ChoiceAnswer => ({
    taskKind: 'dominance',
    taskNumber: null,
    chosenAlternative: dominantChosen ? 0 : 1,
    chosenPosition: 1,
    dominantChosen,
  });
  it('flags choosing a dominated alternative and passes the dominant one', () => {
    expect(failsDominance([...eight(() => 0), dom(false)])).toBe(true);
    expect(failsDominance([...eight(() => 0), dom(true)])).toBe(false);
    expect(failsDominance(eight(() => 0))).toBeNull();
  });
});

describe('answersInconsistently', () => {
  const repeat = (of: number, alt: number, pos: number): ChoiceAnswer => ({
    taskKind: 'repeat',
    taskNumber: null,
    chosenAlternative: alt,
    chosenPosition: pos,
    repeatOfTask: of,
  });
  it('compares design indices, not positions (the repeat shows another order)', () => {
    const choices = eight((t) => (t === 3 ? 1 : 0));
    expect(answersInconsistently([...choices, repeat(3, 1, 0)])).toBe(false);
    expect(answersInconsistently([...choices, repeat(3, 0, 1)])).toBe(true);
  });
  it('is unassessed without a repeat or when the original was not answered', () => {
    expect(answersInconsistently(eight(() => 0))).toBeNull();
    expect(answersInconsistently([design(1, 0), repeat(4, 0, 0)])).toBeNull();
  });
});

describe('computeQualityFlags', () => {
  it('judges a study with one median and reports it', () => {
    const people: RespondentForFlags[] = Array.from({ length: 12 }, (_, i) => ({
      id: `r${i}`,
      status: 'completed',
      durationMs: (i + 1) * 60_000,
      choices: eight((t) => (t + i) % 3),
    }));
    people.push({ id: 'open', status: 'in_progress', durationMs: null, choices: [] });
    const out = computeQualityFlags(people, { speederFraction: 0.5, hasFixedAlternative: true });
    // durations 1..12 min: median 6.5 min, cut-off 3.25 min -> r0, r1, r2 are speeders.
    expect(out.medianDurationMs).toBe(390_000);
    expect(out.speederThresholdMs).toBe(195_000);
    const speeders = [...out.flags].filter(([, f]) => f.speeder).map(([id]) => id);
    expect(speeders).toEqual(['r0', 'r1', 'r2']);
    expect(out.flags.get('open')).toEqual({
      speeder: null,
      samePosition: null,
      alwaysFixed: null,
      dominanceFailed: null,
      inconsistent: null,
    });
  });
});
