/**
 * A multi-start mixed logit interrupted and started again from one of its checkpoints
 * (fitMixedLogit's onCheckpoint/resume, mixed-logit-checkpoint.ts) ends with the estimates of
 * the uninterrupted fit. The draws are seeded and the evaluations deterministic, so with the
 * same data, draws and thread count the resumed path is the uninterrupted one, bit for bit
 * (bfgs-resume.test.ts shows it for the optimiser alone); the comparison needs no tolerance.
 */
import { describe, expect, it } from 'vitest';
import { fitMixedLogit } from '../../../server/engine/estimation/fit-mixed-logit';
import type { MixedLogitCheckpoint } from '../../../server/engine/estimation/mixed-logit-checkpoint';
import {
  fixedComfort,
  fixedPrice,
  normalQuality,
  simulateChoiceData,
} from '../../../server/engine/estimation/simulate-choice-data';
import type { TrueCoefficient } from '../../../server/engine/estimation/simulate-panel-choices';
import { decodeCheckpoint, encodeCheckpoint } from '../../../server/jobs/run-checkpoint-codec';

const truth: TrueCoefficient[] = [normalQuality, fixedComfort, fixedPrice(-0.6)];
const { data, coefficients } = simulateChoiceData({
  respondents: 120,
  tasks: 8,
  alternatives: 3,
  coefficients: truth,
  seed: 31,
});
const options = { coefficients, draws: { count: 100, seed: 9 }, starts: 2 };

describe('fitMixedLogit resumed from a checkpoint', () => {
  it('ends with the uninterrupted estimates, from inside a start and between starts', async () => {
    const checkpoints: MixedLogitCheckpoint[] = [];
    const whole = await fitMixedLogit(data, options, {
      onCheckpoint: (c) => checkpoints.push(c),
    });
    expect(checkpoints.length).toBe(whole.iterations);
    const inFirst = checkpoints.filter((c) => c.start === 0);
    const inSecond = checkpoints.filter((c) => c.start === 1);
    expect(inFirst.length).toBeGreaterThan(2);
    expect(inSecond.length).toBeGreaterThan(2);
    const picks = [
      inFirst[1], // early in the first start
      inFirst[inFirst.length - 1], // the first start's last iterate (stopped)
      inSecond[Math.floor(inSecond.length / 2)], // the middle of the second start
    ];
    expect(picks[1].current?.stopped).not.toBeNull();
    for (const pick of picks) {
      // Through the stored form, as the job keeps it: what is read back must be exact too.
      const { checkpoint } = decodeCheckpoint(
        JSON.parse(JSON.stringify(encodeCheckpoint(pick, options.draws))),
      );
      const later: MixedLogitCheckpoint[] = [];
      const resumed = await fitMixedLogit(data, options, {
        resume: checkpoint,
        onCheckpoint: (c) => later.push(c),
      });
      expect(Array.from(resumed.estimates)).toEqual(Array.from(whole.estimates));
      expect(Array.from(resumed.se)).toEqual(Array.from(whole.se));
      expect(resumed.loglik).toBe(whole.loglik);
      expect(resumed.starts).toEqual(whole.starts);
      expect(resumed.iterations).toBe(whole.iterations);
      // It reported only the iterations after the checkpoint.
      const done = pick.finished.reduce((s, r) => s + r.iterations, 0) + pick.current!.iterations;
      expect(later.length).toBe(whole.iterations - done);
    }
  }, 120_000);

  it('refuses a checkpoint of another model', async () => {
    const checkpoints: MixedLogitCheckpoint[] = [];
    await fitMixedLogit(data, options, { onCheckpoint: (c) => checkpoints.push(c) });
    // comfort random too: one parameter more than the checkpoint has.
    const other = coefficients.map((c) =>
      c.name === 'comfort' ? { ...c, distribution: 'normal' as const } : c,
    );
    await expect(
      fitMixedLogit(data, { ...options, coefficients: other }, { resume: checkpoints[0] }),
    ).rejects.toThrow(/does not fit this model/);
    // A checkpoint of the second start cannot resume a one-start fit.
    const second = checkpoints.find((c) => c.start === 1)!;
    await expect(
      fitMixedLogit(data, { ...options, starts: 1 }, { resume: second }),
    ).rejects.toThrow(/does not fit this model/);
  }, 60_000);
});
