import { describe, expect, it } from 'vitest';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import { ChoiceDataError, type LongChoiceRow } from '../../../server/engine/estimation/choice-data';
import {
  EstimationOptionsError,
  NonIdentifiedError,
} from '../../../server/engine/estimation/estimation-errors';
import { checkMnlOptions, fitMnl } from '../../../server/engine/estimation/fit-mnl';
import { parseChoiceCsv } from '../../../server/engine/estimation/parse-choice-csv';
import { good, pair, row } from './invalid-arguments-data';

describe('buildChoiceData rejects invalid data', () => {
  it.each<[string, LongChoiceRow[], RegExp]>([
    ['no rows', [], /no rows/],
    [
      'a task with no chosen alternative',
      [row(1, 1, 1, 0, [1]), row(1, 1, 2, 0, [0])],
      /task 1 of respondent 1 \(line 1\) has no chosen alternative/,
    ],
    [
      'a task with two chosen alternatives',
      [row(1, 1, 1, 1, [1]), row(1, 1, 2, 1, [0])],
      /has 2 chosen alternatives/,
    ],
    ['a task with one alternative', [row(1, 1, 1, 1, [1])], /only one alternative/],
    [
      'an alternative listed twice',
      [row(1, 1, 1, 1, [1]), row(1, 1, 1, 0, [0])],
      /line 2: alternative 1 appears twice/,
    ],
    [
      'a non-finite value',
      [row(1, 1, 1, 1, [Number.NaN]), row(1, 1, 2, 0, [0])],
      /line 1: column x is not a finite number/,
    ],
    ['chosen not 0/1', [row(1, 1, 1, 2, [1]), row(1, 1, 2, 0, [0])], /chosen must be 0 or 1/],
    [
      'a task mixing holdout and estimation rows',
      [row(1, 1, 1, 1, [1], true), row(1, 1, 2, 0, [0])],
      /mixes holdout/,
    ],
    [
      'only holdout tasks',
      [row(1, 1, 1, 1, [1], true), row(1, 1, 2, 0, [0], true)],
      /every task is flagged holdout/,
    ],
    [
      'the wrong number of values',
      [row(1, 1, 1, 1, [1, 2]), row(1, 1, 2, 0, [0])],
      /expected 1 attribute values, got 2/,
    ],
  ])('%s', (_label, rows, message) => {
    expect(() => buildChoiceData(['x'], rows)).toThrow(ChoiceDataError);
    expect(() => buildChoiceData(['x'], rows)).toThrow(message);
  });

  it('no attribute columns', async () => {
    expect(() => buildChoiceData([], [row(1, 1, 1, 1, []), row(1, 1, 2, 0, [])])).toThrow(
      /at least one attribute column/,
    );
  });
});

describe('parseChoiceCsv rejects invalid files', () => {
  it.each<[string, string, RegExp]>([
    ['a missing required column', 'respondent,task,alt,x\n1,1,1,0', /no column "chosen"/],
    [
      'a missing attribute column',
      'respondent,task,alt,chosen\n1,1,1,0',
      /no column "x" named in the specification/,
    ],
    [
      'an empty respondent',
      'respondent,task,alt,chosen,x\n,1,1,0,1',
      /line 2: column respondent is empty/,
    ],
    [
      'a holdout flag other than 0/1',
      'respondent,task,alt,chosen,x,holdout\n1,1,1,0,1,2',
      /line 2: holdout must be 0 or 1/,
    ],
    ['a header only', 'respondent,task,alt,chosen,x', /at least one data line/],
    ['ragged lines', 'respondent,task,alt,chosen,x\n1,1,1', /cannot be read/],
    [
      'an unreadable included',
      'respondent,task,alt,chosen,included,x\n1,1,1,0,yes,1',
      /line 2: included must be true or false/,
    ],
    [
      'nobody included',
      'respondent,task,alt,chosen,included,x\n1,1,1,0,false,1',
      /every data line has included=false/,
    ],
  ])('%s', (_label, text, message) => {
    expect(() => parseChoiceCsv(text, ['x'])).toThrow(message);
  });
});

describe('parseChoiceCsv reads the long choice file', () => {
  it('leaves the rows of respondents with included=false (or 0) out', () => {
    const text = [
      'respondent,task,alt,chosen,included,exclusion,x',
      '1,1,1,1,true,,2',
      '1,1,2,0,true,,3',
      '2,1,1,1,false,screened out,4',
      '2,1,2,0,false,screened out,5',
      '3,1,1,0,1,,6',
      '3,1,2,1,0,,7',
    ].join('\n');
    const rows = parseChoiceCsv(text, ['x']);
    expect(rows.map((r) => [r.respondent, r.line, r.values[0]])).toEqual([
      ['1', 2, 2],
      ['1', 3, 3],
      ['3', 6, 6],
    ]);
  });

  it('reads a semicolon file with a byte-order mark and CRLF line ends as its comma twin', () => {
    // A spreadsheet's "CSV UTF-8" in a comma-decimal locale (server/lib/csv-dialect.ts).
    const comma = 'respondent,task,alt,chosen,note,x\n1,1,1,1,"a;b",2.5\n1,1,2,0,,3\n';
    const semicolons =
      '\uFEFFrespondent;task;alt;chosen;note;x\r\n1;1;1;1;"a;b";2.5\r\n1;1;2;0;;3\r\n';
    expect(parseChoiceCsv(semicolons, ['x'])).toEqual(parseChoiceCsv(comma, ['x']));
    expect(parseChoiceCsv(semicolons, ['x']).map((r) => r.values[0])).toEqual([2.5, 3]);
  });

  it('names the line a bad value stands on, counting empty lines and line breaks in quotes', () => {
    const text = 'respondent,task,alt,chosen,x\n1,1,1,1,2\n\n1,1,2,0,"a\nb"\n';
    expect(() => parseChoiceCsv(text, ['x'])).toThrow('line 4: column x is not a number');
    expect(() => parseChoiceCsv('respondent,task,alt,chosen,x\n\n1,1,1,1\n', ['x'])).toThrow(
      expect.objectContaining({ line: 3 }),
    );
  });

  it('finds its own columns whatever the case of their headings, the spec columns by name', () => {
    const text = 'Respondent,TASK,Alt,Chosen,Included,x\n1,1,1,1,true,2\n1,1,2,0,true,3\n';
    expect(parseChoiceCsv(text, ['x']).map((r) => [r.respondent, r.values[0]])).toEqual([
      ['1', 2],
      ['1', 3],
    ]);
    expect(() => parseChoiceCsv(text.replace(',x', ',X'), ['x'])).toThrow(
      'no column "x" named in the specification',
    );
  });

  it('reads decimal commas in a semicolon file only, and names the line and column of any other', () => {
    const semicolons = 'respondent;task;alt;chosen;x\n1;1;1;1;2,5\n1;1;2;0;-0,25\n';
    expect(parseChoiceCsv(semicolons, ['x']).map((r) => r.values[0])).toEqual([2.5, -0.25]);
    expect(() => parseChoiceCsv('respondent,task,alt,chosen,x\n1,1,1,1,"2,5"', ['x'])).toThrow(
      'line 2: column x is not a number ("2,5")',
    );
    expect(() => parseChoiceCsv('respondent;task;alt;chosen;x\n1;1;1;1;2,5 €', ['x'])).toThrow(
      'line 2: column x is not a number ("2,5 €")',
    );
  });
});

describe('fitMnl guards', () => {
  it.each<[string, object, string]>([
    ['maxIterations 0', { maxIterations: 0 }, 'maxIterations'],
    ['a negative tolerance', { tolerance: -1 }, 'tolerance'],
    ['a start of the wrong length', { start: [1] }, 'start'],
    ['a non-finite start', { start: [1, Number.NaN] }, 'start'],
  ])('checkMnlOptions rejects %s naming the field', (_label, options, field) => {
    expect(() => checkMnlOptions(good, options)).toThrow(EstimationOptionsError);
    try {
      checkMnlOptions(good, options);
    } catch (error) {
      expect((error as EstimationOptionsError).field).toBe(field);
    }
  });

  it('rejects holdout data with other columns', async () => {
    const other = buildChoiceData(['y', 'z'], pair(1, 1, [1, 0], [0, 1])).data;
    expect(() => checkMnlOptions(good, { holdout: other })).toThrow(/same columns/);
  });

  it('names a column that never varies within any task', async () => {
    const data = buildChoiceData(
      ['x', 'flat'],
      [...pair(1, 1, [1, 3], [0, 3]), ...pair(2, 1, [0, 3], [1, 3])],
    ).data;
    await expect(fitMnl(data)).rejects.toThrow(NonIdentifiedError);
    await expect(fitMnl(data)).rejects.toThrow(/flat never varies/);
  });

  it('detects collinear columns', async () => {
    const data = buildChoiceData(
      ['x', 'twice_x'],
      [...pair(1, 1, [1, 2], [0, 0]), ...pair(2, 1, [0, 0], [1, 2]), ...pair(3, 1, [2, 4], [0, 0])],
    ).data;
    // Named through the correlation-form information (analyse-information.ts).
    await expect(fitMnl(data)).rejects.toThrow(/x, twice_x are collinear/);
  });

  it('detects perfect prediction (separation): the chosen alternative always has the larger x', async () => {
    const rows = [1, 2, 3, 4].flatMap((n) => pair(n, 1, [n], [0]));
    await expect(fitMnl(buildChoiceData(['x'], rows).data)).rejects.toThrow(
      /perfect prediction \(separation\) — x predicts the choice in 4 tasks \(respondent 1, task 1/,
    );
  });
});
