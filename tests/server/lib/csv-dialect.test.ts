/**
 * The separator and byte-order mark of uploaded CSV files (server/lib/csv-dialect.ts). The
 * expected separators follow from the files' own header lines (comma, semicolon and tab are the
 * list separators spreadsheet programs write: common practice, no source).
 */
import { Readable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import {
  csvDelimiterOf,
  csvDialectOfStream,
  readCsvText,
  withDecimalPoint,
} from '../../../server/lib/csv-dialect';

describe('csvDelimiterOf', () => {
  it.each<[string, string, string]>([
    ['a comma header', 'respondent,task,alt\n1,1,1', ','],
    ['a semicolon header', 'respondent;task;alt\r\n1;1;1', ';'],
    ['a tab header', 'respondent\ttask\talt\n1\t1\t1', '\t'],
    ['a byte-order mark before a semicolon header', '\uFEFFa;b;c\n', ';'],
    ['semicolons inside quotes of a comma header', '"a;b;c",d,e\n', ','],
    ['commas inside quotes of a semicolon header', '"a,b,c";d\n', ';'],
    ['a quoted line break in the header', '"a\nb";c;d\n1,2,3,4,5', ';'],
    ['only the first line counts', 'a;b\n1,2,3,4,5,6', ';'],
    ['a single column (no separator at all)', 'email\nx@example.org', ','],
    ['an empty text', '', ','],
  ])('%s', (_label, text, delimiter) => {
    expect(csvDelimiterOf(text)).toBe(delimiter);
  });
});

describe('withDecimalPoint', () => {
  it.each<[string, string, string]>([
    ['2,5', ';', '2.5'],
    ['-0,75', ';', '-0.75'],
    [' 10,0 ', ';', '10.0'],
    ['+3,25', ';', '+3.25'],
    ['2.5', ';', '2.5'],
    ['1.000,5', ';', '1.000,5'],
    ['2,5 €', ';', '2,5 €'],
    ['2,5,1', ';', '2,5,1'],
    [',5', ';', ',5'],
    ['good', ';', 'good'],
    ['2,5', ',', '2,5'],
    ['2,5', '\t', '2,5'],
  ])('%j in a file separated by %j reads %j', (cell, delimiter, read) => {
    expect(withDecimalPoint(cell, delimiter as ',' | ';' | '\t')).toBe(read);
  });
});

describe('readCsvText', () => {
  const lines = (text: string, sameFieldCount = false) =>
    readCsvText(text, { trim: true, sameFieldCount }).records.map((r) => [r.line, r.record]);

  it('numbers records by the line they start on, as an editor numbers lines', () => {
    // Line 3 is empty; the quoted cell of line 4 runs into line 5.
    const expected = [
      [1, ['a', 'b']],
      [2, ['1', '2']],
      [4, ['3', 'x\ny']],
      [6, ['4', '5']],
    ];
    expect(lines('a,b\n1,2\n\n3,"x\ny"\n4,5')).toEqual(expected);
    // The same with CRLF line ends: the quoted CRLF counts once.
    expect(lines('a,b\r\n1,2\r\n\r\n3,"x\r\ny"\r\n4,5\r\n')).toEqual(
      expected.map(([line, record]) => [
        line,
        (record as string[]).map((c) => c.replace('\n', '\r\n')),
      ]),
    );
    expect(lines('a;b\n\n  \n1;2\n')).toEqual([
      [1, ['a', 'b']],
      [4, ['1', '2']],
    ]);
  });

  it('names the line of a record with another field count, and of an unclosed quote', () => {
    expect(() => lines('a,b\n1,2\n\n3\n', true)).toThrow(
      expect.objectContaining({ lines: 4, message: 'line 4 has 1 fields; the header has 2' }),
    );
    expect(lines('a,b\n1,2\n\n3\n')).toEqual([
      [1, ['a', 'b']],
      [2, ['1', '2']],
      [4, ['3']],
    ]);
    expect(() => lines('a,b\n1,"2\n')).toThrow(expect.objectContaining({ lines: 2 }));
  });
});

async function bytesOf(stream: Readable): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(Buffer.from(chunk));
  return Buffer.concat(chunks).toString('utf8');
}

describe('csvDialectOfStream', () => {
  const text =
    'respondent;task;alt\n' + Array.from({ length: 500 }, (_, i) => `${i};1;1`).join('\n');

  it('tells the separator from a stream of one-byte chunks and gives back every byte', async () => {
    const bytes = Buffer.from(text);
    const input = Readable.from(
      Array.from({ length: bytes.length }, (_, i) => bytes.subarray(i, i + 1)),
    );
    const { dialect, stream } = await csvDialectOfStream(input);
    expect(dialect).toEqual({ delimiter: ';', bom: true });
    expect(stream).toBe(input);
    expect(await bytesOf(stream)).toBe(text);
  });

  it('reads a stream that ends before any line break', async () => {
    const { dialect, stream } = await csvDialectOfStream(Readable.from([Buffer.from('a\tb')]));
    expect(dialect.delimiter).toBe('\t');
    expect(await bytesOf(stream)).toBe('a\tb');
  });

  it('reads an empty stream as comma separated and empty', async () => {
    const { dialect, stream } = await csvDialectOfStream(Readable.from([]));
    expect(dialect.delimiter).toBe(',');
    expect(await bytesOf(stream)).toBe('');
  });

  it('rejects with the error of a stream that fails before its first line', async () => {
    const input = new Readable({
      read() {
        this.destroy(new Error('disk gone'));
      },
    });
    await expect(csvDialectOfStream(input)).rejects.toThrow('disk gone');
  });
});
