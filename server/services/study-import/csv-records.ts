/**
 * The records of an uploaded CSV as a stream (csv-parse), each with the line it ends on (the
 * header is line 1): cells trimmed, empty lines skipped, a byte-order mark dropped, and lines
 * of any length let through so the reader can report a wrong field count itself.
 */
import type { Readable } from 'node:stream';
import { parse } from 'csv-parse';

export type CsvRecord = { record: string[]; info: { lines: number } };

export function csvRecords(input: Readable): AsyncIterable<CsvRecord> {
  return input.pipe(
    parse({ trim: true, skip_empty_lines: true, relax_column_count: true, info: true, bom: true }),
  );
}
