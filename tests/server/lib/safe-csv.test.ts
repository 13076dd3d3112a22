import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parse } from 'csv-parse/sync';
import { escapeCsvText, toCsvCell, unescapeCsvText, writeCsv } from '../../../server/lib/safe-csv';
import { hostileText, isSafeCell } from '../../support/hostile-text';

describe('CSV cell escaping', () => {
  it.each([
    ['=SUM(A1:A2)', "'=SUM(A1:A2)"],
    ['+call me', "'+call me"],
    ['-2+3', "'-2+3"],
    ['@cmd', "'@cmd"],
    ['\tindent', "'\tindent"],
    ['\rreturn', "'\rreturn"],
    ['plain', 'plain'],
    ['a=b', 'a=b'],
    ['', ''],
  ])('escapes the text %j as %j', (text, expected) => {
    expect(escapeCsvText(text)).toBe(expected);
  });

  it('writes numbers as numbers, negative ones included, and never escapes them', () => {
    expect(toCsvCell(-1.23)).toBe('-1.23');
    expect(toCsvCell(-4e-7)).toBe('-4e-7');
    expect(toCsvCell(Number.NaN)).toBe('');
    expect(toCsvCell(null)).toBe('');
    expect(toCsvCell(true)).toBe('true');
  });

  it('escapes text that looks like a negative number (the value type decides)', () => {
    expect(toCsvCell('-1.23')).toBe("'-1.23");
  });

  it('round-trips through a CSV parser with quotes, commas and new lines intact', () => {
    const text = writeCsv(
      ['id', 'note', 'value'],
      [
        ['r1', 'said "yes", then\nleft', -0.5],
        ['r2', '=HYPERLINK("http://x")', 2],
      ],
    );
    const rows = parse(text) as string[][];
    expect(rows).toEqual([
      ['id', 'note', 'value'],
      ['r1', 'said "yes", then\nleft', '-0.5'],
      ['r2', '\'=HYPERLINK("http://x")', '2'],
    ]);
  });
});

describe('writeCsv with generated hostile text', () => {
  it('never starts a cell with a formula character and reads back every label', () => {
    fc.assert(
      fc.property(fc.array(hostileText(), { minLength: 1, maxLength: 6 }), (labels) => {
        const text = writeCsv(labels, [labels, labels.map((_, i) => -i - 0.5)]);
        const cells = (parse(text) as string[][]).flat();
        expect(cells.filter((c) => !isSafeCell(c))).toEqual([]);
        // …and the comma reading gives back every label once the escape is removed.
        const [header, row, numbers] = parse(text) as string[][];
        expect(header.map(unescapeCsvText)).toEqual(labels);
        expect(row.map(unescapeCsvText)).toEqual(labels);
        expect(numbers.map(Number)).toEqual(labels.map((_, i) => -i - 0.5));
      }),
      { numRuns: 300, seed: 13 },
    );
  });
});
