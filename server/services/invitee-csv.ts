/**
 * Reads an uploaded invitee list. Pure: bytes in, valid rows and row-level issues out. The first
 * row names the columns (e-mail required; name and external id optional, in any order); the
 * separator is detected (comma, semicolon or tab, as spreadsheet programs write them).
 */
import { readCsvText, type CsvRecord } from '../lib/csv-dialect';
import { decodeText } from '../../shared/text/decode-text';
import {
  INVITEE_CSV_MAX_ROWS,
  inviteeRowSchema,
  type CsvIssue,
  type InviteeRow,
} from '../../shared/schemas/invitees';

type Field = 'email' | 'name' | 'externalId';

const headerAliases: Record<string, Field> = {
  email: 'email',
  emailaddress: 'email',
  mail: 'email',
  name: 'name',
  fullname: 'name',
  externalid: 'externalId',
  extid: 'externalId',
  panelid: 'externalId',
};

const normaliseHeader = (h: string) => h.toLowerCase().replace(/[\s_\-.]/g, '');

export type InviteeCsvResult = {
  totalRows: number;
  columns: Array<{ header: string; field: Field | null }>;
  valid: Array<InviteeRow & { row: number }>;
  errors: CsvIssue[];
};

const fileIssue = (message: string, row = 1): InviteeCsvResult => ({
  totalRows: 0,
  columns: [],
  valid: [],
  errors: [{ row, column: null, message }],
});

/**
 * @param existingEmails e-mails already on the study's list (lower-case); such rows are errors
 *   so a re-upload of the same file cannot invite anybody twice.
 */
export function readInviteeCsv(bytes: Buffer, existingEmails: Set<string>): InviteeCsvResult {
  if (bytes.length === 0) return fileIssue('The file is empty.');
  const text = decodeText(bytes);
  // A NUL is in no text file (a UTF-16 one is decoded by now).
  if (text.includes('\u0000'))
    return fileIssue('This is not a CSV text file (it contains binary data).');
  let records: CsvRecord[];
  try {
    ({ records } = readCsvText(text, { trim: true, sameFieldCount: false }));
  } catch (err) {
    const line = Number((err as { lines?: number }).lines) || 1;
    return fileIssue(`The file could not be read as CSV: ${(err as Error).message}`, line);
  }
  if (records.length === 0) return fileIssue('The file is empty.');

  const headers = records[0].record;
  const columns = headers.map((header) => ({
    header,
    field: headerAliases[normaliseHeader(header)] ?? null,
  }));
  const index: Partial<Record<Field, number>> = {};
  const headerErrors: CsvIssue[] = [];
  columns.forEach((c, i) => {
    if (!c.field) return;
    if (index[c.field] !== undefined)
      headerErrors.push({ row: 1, column: c.header, message: 'This column appears twice.' });
    else index[c.field] = i;
  });
  if (index.email === undefined)
    headerErrors.push({
      row: 1,
      column: null,
      message:
        'No e-mail column. The first row must name the columns, e.g. "email,name,external_id".',
    });
  if (headerErrors.length > 0) return { totalRows: 0, columns, valid: [], errors: headerErrors };

  const body = records.slice(1);
  if (body.length === 0)
    return { ...fileIssue('The file has a header row but no invitees.'), columns };
  if (body.length > INVITEE_CSV_MAX_ROWS)
    return {
      ...fileIssue(
        `The file has ${body.length} rows; upload at most ${INVITEE_CSV_MAX_ROWS} at once.`,
      ),
      columns,
    };

  const valid: InviteeCsvResult['valid'] = [];
  const errors: CsvIssue[] = [];
  const seenEmail = new Map<string, number>();
  const seenExternal = new Map<string, number>();
  const headerOf = (f: Field) => headers[index[f]!];
  for (const { record, line: row } of body) {
    const cell = (f: Field) => (index[f] === undefined ? undefined : (record[index[f]!] ?? ''));
    const parsed = inviteeRowSchema.safeParse({
      email: cell('email'),
      name: cell('name'),
      externalId: cell('externalId'),
    });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const field = issue.path[0] as Field;
        const empty = field === 'email' && (cell('email') ?? '') === '';
        errors.push({
          row,
          column: headerOf(field),
          message: empty ? 'The e-mail address is missing.' : issue.message,
        });
      }
      continue;
    }
    const r = parsed.data;
    const rowErrors: CsvIssue[] = [];
    const firstEmailRow = seenEmail.get(r.email);
    if (firstEmailRow !== undefined)
      rowErrors.push({
        row,
        column: headerOf('email'),
        message: `Same e-mail address as row ${firstEmailRow}.`,
      });
    else if (existingEmails.has(r.email))
      rowErrors.push({
        row,
        column: headerOf('email'),
        message: "Already on this study's invitation list.",
      });
    const firstExternalRow = r.externalId ? seenExternal.get(r.externalId) : undefined;
    if (firstExternalRow !== undefined)
      rowErrors.push({
        row,
        column: headerOf('externalId'),
        message: `Same external id as row ${firstExternalRow}.`,
      });
    if (!seenEmail.has(r.email)) seenEmail.set(r.email, row);
    if (r.externalId && !seenExternal.has(r.externalId)) seenExternal.set(r.externalId, row);
    if (rowErrors.length > 0) errors.push(...rowErrors);
    else valid.push({ ...r, row });
  }
  return { totalRows: body.length, columns, valid, errors };
}
