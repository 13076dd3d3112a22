/** What every download use case returns, and the file names and content types they share. */
import type { AppDeps } from '../../deps';
import type { Actor } from '../actor';

export type Download = {
  filename: string;
  contentType: string;
  body: string | Buffer;
  /** Holds personal columns (external ids, personal answers): the download is audited. */
  personal?: boolean;
};

/** A download of a study's data: what every study file of the exports route calls. */
export type StudyExporter = (
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  at?: Date,
) => Promise<Download>;

/** A download of one finished run of the study. */
export type RunExporter = (
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  runId: string,
  at?: Date,
) => Promise<Download>;

export const CSV = 'text/csv; charset=utf-8';
export const XLSX = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';
export const HTML = 'text/html; charset=utf-8';
/** R scripts are plain text; the .R extension makes R and RStudio open them. */
export const R_SCRIPT = 'text/plain; charset=utf-8';

/** "<study slug>-<kind>-<yyyy-mm-dd>.<ext>", the study name cut to 60 safe characters. */
export function fileName(studyName: string, kind: string, ext: string, at: Date): string {
  const slug = studyName
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '')
    .slice(0, 60);
  return `${slug || 'study'}-${kind}-${at.toISOString().slice(0, 10)}.${ext}`;
}

const CONTENT_TYPES = { csv: CSV, xlsx: XLSX, html: HTML, R: R_SCRIPT } as const;
export type FileFormat = keyof typeof CONTENT_TYPES;

/** A file of the study named by fileName(), with its format's content type. */
export function makeDownload(
  studyName: string,
  kind: string,
  format: FileFormat,
  at: Date,
  body: string | Buffer,
  personal?: boolean,
): Download {
  return {
    filename: fileName(studyName, kind, format, at),
    contentType: CONTENT_TYPES[format],
    body,
    ...(personal === undefined ? {} : { personal }),
  };
}
