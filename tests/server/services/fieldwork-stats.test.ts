import { describe, expect, it } from 'vitest';
import { buildDropOff, listScreenSlots } from '../../../server/services/fieldwork-stats';
import {
  fixtureDesign,
  fixtureQuestionnaire,
  fixtureScreenKeys,
} from '../routes/fieldwork-fixtures';

describe('listScreenSlots', () => {
  it('lists answerable screens in order, tasks as "k-th shown", without the end page', () => {
    const slots = listScreenSlots(fixtureQuestionnaire, fixtureDesign);
    expect(slots.map((s) => s.key)).toEqual(fixtureScreenKeys);
    expect(slots[1].label).toBe('How many people live in your household?');
    expect(slots[11].label).toBe('Dominance test');
  });

  it('uses the largest block when blocks differ in size', () => {
    const design = { ...fixtureDesign, tasks: fixtureDesign.tasks.slice(0, 11) }; // 8 + 3
    expect(
      listScreenSlots(fixtureQuestionnaire, design).filter((s) => s.key.startsWith('tasks#')),
    ).toHaveLength(8);
  });

  it('returns nothing for a document that is not a questionnaire', () => {
    expect(listScreenSlots({}, fixtureDesign)).toEqual([]);
  });
});

describe('buildDropOff', () => {
  const slots = listScreenSlots(fixtureQuestionnaire, fixtureDesign);

  it('counts task k as reached by everyone who answered at least k tasks', () => {
    const steps = buildDropOff(
      slots,
      new Map(),
      new Map([
        [8, 10],
        [3, 2],
        [1, 1],
      ]),
      [],
    );
    const reached = (k: number) => steps.find((s) => s.key === `tasks#${k}`)!.reached;
    expect([1, 2, 3, 4, 8].map(reached)).toEqual([13, 12, 12, 10, 10]);
  });

  it('puts each unfinished respondent at the screen after their latest answer', () => {
    const steps = buildDropOff(slots, new Map([['consent', 4]]), new Map(), [
      { lastKey: null, tasksDone: 0 },
      { lastKey: 'consent', tasksDone: 0 },
      { lastKey: 'task:12', tasksDone: 5 },
      { lastKey: 'task:3', tasksDone: 8 },
      { lastKey: 'repeat:rep1', tasksDone: 8 },
      { lastKey: 'q:gone_in_v2', tasksDone: 0 },
    ]);
    const stopped = Object.fromEntries(steps.map((s) => [s.key, s.stoppedHere]));
    expect(stopped).toMatchObject({
      consent: 1,
      'q:household_size': 1,
      'tasks#6': 1,
      'dominance:dom1': 1,
    });
    // After the last screen there is nowhere to stop; unknown screens are not guessed.
    expect(steps.reduce((n, s) => n + s.stoppedHere, 0)).toBe(4);
  });

  it('keeps screens only older versions had, after the current ones', () => {
    const steps = buildDropOff(slots, new Map([['q:old_question', 3]]), new Map(), []);
    expect(steps.at(-1)).toEqual({
      key: 'q:old_question',
      label: 'q:old_question',
      reached: 3,
      stoppedHere: 0,
    });
  });
});
