/**
 * How an uploaded CSV file is written, read the same way by every reader of one (choice data,
 * background answers, designs, invitee lists, translations, the command-line estimator).
 *
 * Spreadsheet programs save "CSV" with the list separator of the user's locale: a comma in
 * English-speaking ones, a semicolon where the comma is the decimal mark (most of continental
 * Europe), and a tab for "tab-separated text"; a UTF-8 "CSV" often starts with a byte-order mark
 * (common practice, no source). The header line tells which separator a file uses: of the three,
 * the one found most often outside quotes on it, a comma when none is. Its cells then follow the
 * same rules (quotes, doubled quotes, line breaks inside quotes) whatever the separator is.
 *
 * A semicolon says the file comes from a locale whose decimal mark is the comma, so there a cell
 * that is a number written with a decimal comma ("2,5", "-0,75") is read as that number; anywhere
 * else, and in any other form ("1.000,5", "2,5 €"), a comma stays text and each reader says so
 * where it needs a number (docs/methods.md, "Imported choice data").
 */
import { Readable } from 'node:stream';
import { parse } from 'csv-parse/sync';

export type CsvDelimiter = ',' | ';' | '\t';

const DELIMITERS: readonly CsvDelimiter[] = [',', ';', '\t'];

/** The separator of a CSV text, from its first line (see the file comment). */
export function csvDelimiterOf(text: string): CsvDelimiter {
  const counts = new Map<string, number>(DELIMITERS.map((d) => [d, 0]));
  let quoted = false;
  // A byte-order mark is not part of the header; the first line ends at the first line break
  // outside quotes.
  for (let i = text.charCodeAt(0) === 0xfeff ? 1 : 0; i < text.length; i++) {
    const c = text[i];
    if (c === '"') quoted = !quoted;
    else if (!quoted && (c === '\n' || c === '\r')) break;
    else if (!quoted && counts.has(c)) counts.set(c, counts.get(c)! + 1);
  }
  let best: CsvDelimiter = ',';
  for (const d of DELIMITERS) if (counts.get(d)! > counts.get(best)!) best = d;
  return best;
}

/** csv-parse's options for reading a text written as `text` is: its separator, no byte-order mark. */
export function csvDialectOf(text: string): { delimiter: CsvDelimiter; bom: true } {
  return { delimiter: csvDelimiterOf(text), bom: true };
}

const DECIMAL_COMMA = /^([+-]?\d+),(\d+)$/;

/**
 * A cell where a number may stand, with a decimal comma turned into a point when the file is
 * semicolon separated (see the file comment); any other cell unchanged.
 */
export function withDecimalPoint(cell: string, delimiter: CsvDelimiter): string {
  if (delimiter !== ';') return cell;
  const trimmed = cell.trim();
  return DECIMAL_COMMA.test(trimmed) ? trimmed.replace(DECIMAL_COMMA, '$1.$2') : cell;
}

/** One record of an uploaded CSV and the line it starts on (the header is line 1). */
export type CsvRecord = { record: string[]; line: number };

/**
 * How many lines a record takes beyond its first: one for each line break inside its quoted
 * cells (a CRLF one counts once). Records are numbered here rather than with csv-parse's `info`,
 * which counts the CR and the LF of a quoted CRLF as two lines.
 */
export function extraLinesOf(record: readonly string[]): number {
  let extra = 0;
  for (const cell of record)
    for (let at = cell.indexOf('\n'); at >= 0; at = cell.indexOf('\n', at + 1)) extra++;
  return extra;
}

/** An empty line (or, trimmed, one of spaces only) as csv-parse returns it. */
export const isEmptyRecord = (record: readonly string[]) => record.length === 1 && record[0] === '';

/**
 * The separator of an uploaded CSV text (for the readers that read decimal commas by it) and its
 * records, read as it is written (see the file comment), each with
 * the line it starts on as an editor numbers lines: empty lines (skipped) and line breaks inside
 * quoted cells count. With `sameFieldCount`, a record with another number of fields than the
 * header is refused. Throws csv-parse's error for text that is not CSV (an unclosed quote, say),
 * and an error of the same shape for a wrong field count: its `lines` is the line concerned.
 */
export function readCsvText(
  text: string,
  options: { trim: boolean; sameFieldCount: boolean },
): { delimiter: CsvDelimiter; records: CsvRecord[] } {
  const dialect = csvDialectOf(text);
  const rows = parse(text, {
    ...dialect,
    trim: options.trim,
    relax_column_count: true,
  }) as string[][];
  const records: CsvRecord[] = [];
  let next = 1;
  for (const record of rows) {
    const line = next;
    next += 1 + extraLinesOf(record);
    if (isEmptyRecord(record)) continue;
    const fields = records[0]?.record.length;
    if (options.sameFieldCount && fields !== undefined && record.length !== fields)
      throw Object.assign(
        new Error(`line ${line} has ${record.length} fields; the header has ${fields}`),
        { lines: line },
      );
    records.push({ record, line });
  }
  return { delimiter: dialect.delimiter, records };
}

/**
 * Where a column the product names (respondent, task, alt …) stands in a header, whatever the
 * case of its heading: spreadsheets often capitalise headings. −1 when it is not there.
 */
export function keyColumnIndex(header: readonly string[], name: string): number {
  return header.findIndex((heading) => heading.toLowerCase() === name);
}

/** Enough of a file's start to hold its header line, for all but absurd headers. */
const HEAD_BYTES = 64 * 1024;

/**
 * The separator of a CSV stream, and the stream to read it from. The start of the stream (up to
 * its first line break, or 64 KiB) is read to tell, then put back in front (`unshift`), so the
 * same stream yields every byte and keeps its own closing and errors; only a stream that ended
 * within its start is replaced, by one of that start.
 */
export async function csvDialectOfStream(
  input: Readable,
): Promise<{ dialect: { delimiter: CsvDelimiter; bom: true }; stream: Readable }> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    const finish = (ended: boolean) => {
      input.off('readable', onReadable).off('end', onEnd).off('error', onError);
      const start = Buffer.concat(chunks);
      if (!ended && start.length > 0) input.unshift(start);
      resolve({
        dialect: csvDialectOf(start.toString('utf8')),
        stream: ended ? Readable.from([start]) : input,
      });
    };
    const onReadable = () => {
      for (let chunk = input.read(); chunk !== null; chunk = input.read()) {
        const bytes: Buffer = typeof chunk === 'string' ? Buffer.from(chunk) : chunk;
        chunks.push(bytes);
        size += bytes.length;
        if (size >= HEAD_BYTES || bytes.includes(0x0a) || bytes.includes(0x0d))
          return finish(false);
      }
    };
    const onEnd = () => finish(true);
    const onError = (error: Error) => {
      input.off('readable', onReadable).off('end', onEnd).off('error', onError);
      reject(error);
    };
    input.on('readable', onReadable).on('end', onEnd).on('error', onError);
  });
}
