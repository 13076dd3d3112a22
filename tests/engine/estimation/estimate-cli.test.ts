import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { estimationResultSchema } from '../../../shared/schemas/estimation-spec';
import { simulatePanelChoices } from '../../../server/engine/estimation/simulate-panel-choices';
import { runCli, scratchFiles, spawnCli } from './estimate-cli-harness';

const writeFile = scratchFiles('cw-estimate-');

const sim = simulatePanelChoices({
  respondents: 60,
  tasks: 6,
  alternatives: 3,
  seed: 4,
  coefficients: [
    { name: 'river', distribution: 'normal', location: 0.8, spread: 0.6 },
    {
      name: 'bill',
      distribution: 'neg_lognormal',
      location: -1.5,
      spread: 0.4,
      levels: [0, 3, 6, 10, 15],
    },
  ],
});
const csv = [
  'respondent,task,alt,chosen,river,bill,note',
  ...sim.rows.map(
    (r) => `${r.respondent},${r.task},${r.alt},${r.chosen},${r.values[0]},${r.values[1]},x`,
  ),
].join('\n');
const dataFile = writeFile('choices.csv', csv);
const dir = path.dirname(dataFile);
const mixedSpec = {
  model: 'mixed',
  coefficients: [
    { name: 'river', column: 'river', distribution: 'normal' },
    { name: 'bill', column: 'bill', distribution: 'neg_lognormal' },
  ],
  correlated: false,
  draws: { type: 'halton', count: 50, seed: 1 },
  profileDraws: 200,
  cost: 'bill',
  starts: 1,
};

describe('npm run estimate (scripts/estimate.ts)', () => {
  it('fits a mixed logit and writes the documented result JSON (as its own process)', () => {
    const specFile = writeFile('spec.json', JSON.stringify(mixedSpec));
    const outFile = path.join(dir, 'result.json');
    const run = spawnCli(['--data', dataFile, '--spec', specFile, '--out', outFile]);
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    const result = estimationResultSchema.parse(JSON.parse(readFileSync(outFile, 'utf8')));
    expect(result.estimates.map((e) => e.name)).toEqual([
      'river.mean',
      'bill.mean',
      'river.sd',
      'bill.sd',
    ]);
    expect(result.respondents).toBe(60);
    expect(result.observations).toBe(360);
    expect(result.individuals).toHaveLength(60);
    expect(Object.keys(result.individuals![0].mean)).toEqual(['river', 'bill']);
    expect(Object.keys(result.individuals![0].wtp!)).toEqual(['river']);
    expect(result.wtp!.map((w) => w.name)).toEqual(['river']);
    expect(result.loglik).toBeGreaterThan(result.loglikNull);
  });

  it('keeps tasks flagged in a holdout column apart and reports the holdout hit rate', async () => {
    const withHoldout = [
      'respondent,task,alt,chosen,river,bill,holdout',
      ...sim.rows.map(
        (r) =>
          `${r.respondent},${r.task},${r.alt},${r.chosen},${r.values[0]},${r.values[1]},${Number(r.task) === 6 ? 1 : 0}`,
      ),
    ].join('\n');
    const specFile = writeFile(
      'mnl-holdout.json',
      JSON.stringify({ model: 'mnl', coefficients: [{ name: 'river' }, { name: 'bill' }] }),
    );
    const run = await runCli(['--data', writeFile('holdout.csv', withHoldout), '--spec', specFile]);
    expect(run.status).toBe(0);
    const result = estimationResultSchema.parse(JSON.parse(run.stdout));
    expect(result.observations).toBe(300);
    expect(result.holdoutHitRate).not.toBeNull();
    expect(result.holdoutHitRate! * 60).toBeCloseTo(Math.round(result.holdoutHitRate! * 60), 9);
  });

  it('fits an MNL and prints to stdout without --out', async () => {
    const specFile = writeFile(
      'mnl.json',
      JSON.stringify({
        model: 'mnl',
        coefficients: [{ name: 'river' }, { name: 'bill' }],
        cost: 'bill',
      }),
    );
    const run = await runCli(['--data', dataFile, '--spec', specFile]);
    expect(run.status).toBe(0);
    const result = estimationResultSchema.parse(JSON.parse(run.stdout));
    expect(result.model).toBe('mnl');
    expect(result.individuals).toBeNull();
  });

  const badCases: [string, () => string[], RegExp][] = [
    ['a missing --spec argument', () => ['--data', dataFile], /usage/],
    [
      'a data file that does not exist',
      () => [
        '--data',
        path.join(dir, 'nope.csv'),
        '--spec',
        writeFile('ok.json', JSON.stringify(mixedSpec)),
      ],
      /cannot read the data file/,
    ],
    [
      'a specification that is not JSON',
      () => ['--data', dataFile, '--spec', writeFile('bad.json', '{model:')],
      /not valid JSON/,
    ],
    [
      'an unknown distribution',
      () => [
        '--data',
        dataFile,
        '--spec',
        writeFile(
          'dist.json',
          JSON.stringify({
            ...mixedSpec,
            coefficients: [{ name: 'river', distribution: 'gamma' }],
          }),
        ),
      ],
      /coefficients\.0\.distribution/,
    ],
    [
      'a cost that is not a coefficient',
      () => [
        '--data',
        dataFile,
        '--spec',
        writeFile('cost.json', JSON.stringify({ ...mixedSpec, cost: 'price' })),
      ],
      /field cost/,
    ],
    [
      'a column missing from the CSV',
      () => [
        '--data',
        dataFile,
        '--spec',
        writeFile(
          'col.json',
          JSON.stringify({
            ...mixedSpec,
            coefficients: [{ name: 'time', distribution: 'normal' }],
            cost: undefined,
          }),
        ),
      ],
      /no column "time"/,
    ],
    [
      'a non-numeric attribute value',
      () => [
        '--data',
        writeFile('text.csv', csv.replace(/\n1,1,1,(\d),[^,]+,/, '\n1,1,1,$1,abc,')),
        '--spec',
        writeFile('ok2.json', JSON.stringify(mixedSpec)),
      ],
      /line 2: column river is not a number/,
    ],
    [
      'a task with two chosen alternatives',
      () => [
        '--data',
        writeFile(
          'two.csv',
          csv
            .split('\n')
            .map((l, i) =>
              i >= 1 && i <= 3 ? l.replace(/^(1,1,\d),\d,/, `$1,${i === 3 ? 0 : 1},`) : l,
            )
            .join('\n'),
        ),
        '--spec',
        writeFile('ok3.json', JSON.stringify(mixedSpec)),
      ],
      /task 1 of respondent 1 \(line 2\) has 2 chosen alternatives/,
    ],
  ];

  it.each(badCases)(
    'exits with code 2 and names the problem for %s',
    async (_label, args, message) => {
      const run = await runCli(args());
      expect(run.status).toBe(2);
      expect(run.stderr).toMatch(message);
    },
  );

  it('sets the process exit code 2 and writes the message to stderr (as its own process)', () => {
    const run = spawnCli(['--data', dataFile]);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/usage/);
    expect(run.stdout).toBe('');
  });

  it('exits with code 3 when a column never varies within a task (not identified)', async () => {
    const flat = [
      'respondent,task,alt,chosen,river,bill,flat',
      ...sim.rows.map(
        (r) => `${r.respondent},${r.task},${r.alt},${r.chosen},${r.values[0]},${r.values[1]},1`,
      ),
    ].join('\n');
    const spec = writeFile(
      'flat.json',
      JSON.stringify({ model: 'mnl', coefficients: [{ name: 'river' }, { name: 'flat' }] }),
    );
    const run = await runCli(['--data', writeFile('flat.csv', flat), '--spec', spec]);
    expect(run.status).toBe(3);
    expect(run.stderr).toMatch(/flat never varies/);
  });
});
