/**
 * The records of an uploaded CSV as a stream (csv-parse), each with the line it starts on (the
 * header is line 1): comma, semicolon or tab separated as the header line shows, a byte-order
 * mark dropped, decimal commas of a semicolon file read as points (server/lib/csv-dialect.ts),
 * cells trimmed, empty lines skipped, and lines of any length let through so the reader can
 * report a wrong field count itself.
 *
 * Lines are counted as readCsvText counts them (server/lib/csv-dialect.ts); csv-parse's `info`
 * option also builds an object per record, which halved the reading speed of a million-row file.
 */
import type { Readable } from 'node:stream';
import { parse } from 'csv-parse';
import {
  csvDialectOfStream,
  extraLinesOf,
  isEmptyRecord,
  withDecimalPoint,
} from '../../lib/csv-dialect';

/**
 * Calls `onRecord` for every non-empty record, in order; stops early when it returns false.
 * Throws csv-parse's error when the text is not CSV (an unclosed quote, say).
 */
export async function readCsvRecords(
  input: Readable,
  onRecord: (record: string[], line: number) => boolean | void,
): Promise<void> {
  const { dialect, stream } = await csvDialectOfStream(input);
  const parser = stream.pipe(parse({ ...dialect, trim: true, relax_column_count: true }));
  let next = 1;
  for await (const record of parser as AsyncIterable<string[]>) {
    const line = next;
    next += 1 + extraLinesOf(record);
    if (isEmptyRecord(record)) continue;
    // Numbers as written in a comma-decimal locale's file: 2,5 is read as 2.5 from here on.
    if (dialect.delimiter === ';')
      for (let i = 0; i < record.length; i++) record[i] = withDecimalPoint(record[i], ';');
    if (onRecord(record, line) === false) break;
  }
}
