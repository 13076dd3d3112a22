/**
 * Whether a respondent counts in the analysis, and why not, as every respondent-level file
 * writes it. The stored `included` flag is the researcher's exclusion only; a respondent who
 * was screened out, went over quota or did not finish is never analysed either, so the files
 * say included=false for them too, with the reason.
 */
import { col } from './documented-table';

export type RespondentStatus = 'in_progress' | 'completed' | 'screened_out' | 'over_quota';

export interface Inclusion {
  included: boolean;
  /** Why not, in words; null when included. */
  exclusion: string | null;
}

const NOT_ANALYSED: Record<Exclude<RespondentStatus, 'completed'>, string> = {
  screened_out: 'screened out',
  over_quota: 'over quota',
  in_progress: 'did not finish',
};

export function getInclusion(r: {
  status: RespondentStatus;
  included: boolean;
  exclusionReason?: string | null;
}): Inclusion {
  if (r.status !== 'completed') return { included: false, exclusion: NOT_ANALYSED[r.status] };
  if (!r.included)
    return {
      included: false,
      exclusion: `excluded by the team: ${r.exclusionReason?.trim() || 'no reason given'}`,
    };
  return { included: true, exclusion: null };
}

const EXCLUSION_CODING =
  'empty when included; else "screened out", "over quota", "did not finish" or "excluded by the team: <reason>"';

/** The id and number columns every respondent-level file starts with. */
export const respondentColumns = [
  col('respondent', 'text', 'Respondent id (the same in every file of the study)'),
  col(
    'number',
    'integer',
    'Respondent number: order of starting, kept when other respondents are erased',
    'none',
    'integer from 1',
  ),
];

/** The codebook lines of the included and exclusion columns. */
export const inclusionColumns = [
  col(
    'included',
    'logical',
    'Whether the respondent counts in the analysis',
    'none',
    'true / false',
  ),
  col('exclusion', 'text', 'Why the respondent does not count', 'none', EXCLUSION_CODING),
];
