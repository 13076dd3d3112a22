/**
 * Downloads of the Exports section ('exports:read'; personal columns only with
 * 'personal:read') and the cautions every results file and screen repeats.
 */
import { z } from 'zod';

export const exportRunQuerySchema = z.object({ runId: z.uuid('Choose a finished run') });
export const covarianceQuerySchema = exportRunQuerySchema.extend({
  kind: z.enum(['classical', 'robust']).default('robust'),
});
export const optionalRunQuerySchema = z.object({
  runId: z.uuid('Choose a finished run').optional(),
});

/** Shown (behind "Details") where estimates are read; docs/methods.md, "Reading results: cautions". */
export const runCautions = [
  'These estimates summarise stated, hypothetical choices, not observed behaviour; real ' +
    'behaviour can differ.',
  'They carry sampling error (the standard errors and intervals) and, for simulated models, ' +
    'simulation error from the finite number of draws.',
  'Policy or health decisions should not rest on one study alone; follow your ethics board and ' +
    'licensed practice where decisions affect people.',
] as const;

/** Shown where taste profiles appear and written into every results file. */
export const tasteCautions = [
  'These estimates summarise stated, hypothetical choices; real behaviour can differ.',
  "A respondent's taste profile is conditional on that respondent's choices: the mean is " +
    'shrunk toward the population and uncertain when the respondent answered few tasks. Read ' +
    'each mean with its conditional SD.',
  'Profiles with a low effective number of draws rest on few simulation draws; treat them with ' +
    'extra care or re-run with more profile draws.',
  'Policy or health decisions should not rest on one study alone. Follow your ethics board ' +
    'and data-protection law when sharing respondent-level results.',
] as const;

/** What a run's results say once respondents it may have used were erased on request. */
export function erasureNotice(erased: number): string {
  const who = erased === 1 ? '1 respondent was' : `${erased} respondents were`;
  return (
    `${who} erased on request after this run. Its estimates still reflect their answers ` +
    '(no respondent-level rows remain); estimate the model again to remove them.'
  );
}

export type ExportKind = 'profiles' | 'choices' | 'design' | 'answers' | 'report';

export type ExportManifest = {
  /** True when the caller's downloads include personal columns (external ids, free text). */
  personalColumns: boolean;
  designAvailable: boolean;
  choicesAvailable: boolean;
};
