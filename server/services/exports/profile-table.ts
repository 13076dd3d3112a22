/**
 * The per-respondent table shared by the CSV and XLSX downloads: one row per respondent with a
 * profile, each conditional mean followed by its conditional SD, then WTP values, the
 * effective number of draws and the background answers. External ids and free-text answers
 * only when the caller may read personal data (the header decides).
 */
import type { ProfileRow } from '../../../db/queries/tastes';
import type { TasteHeader } from '../../../shared/schemas/tastes';
import { toTasteRow } from '../tastes/taste-rows';
import type { CellValue } from '../../lib/safe-csv';

export interface Table {
  header: string[];
  rows: CellValue[][];
}

export function buildProfileTable(
  header: TasteHeader,
  profiles: readonly ProfileRow[],
  answers: Map<string, Map<string, unknown>>,
): Table {
  const names = header.coefficients.map((c) => c.name);
  const columns = [
    'respondent',
    'number',
    ...(header.personalColumns ? ['external_id'] : []),
    'block',
    'included',
    'quality_flags',
    'effective_draws',
    'low_effective_draws',
    ...names.flatMap((n) => [`mean_${n}`, `sd_${n}`]),
    ...header.wtp.map((n) => `wtp_${n}`),
    ...header.questions.map((q) => q.key),
  ];
  const rows = profiles.map((p) => {
    const row = toTasteRow(p, header, answers.get(p.respondentId));
    return [
      row.respondentId,
      row.number,
      ...(header.personalColumns ? [row.externalId ?? null] : []),
      row.block,
      p.included,
      row.flags.join('; '),
      row.effectiveDraws,
      row.lowDraws,
      ...names.flatMap((n) => [row.mean[n] ?? null, row.sd[n] ?? null]),
      ...header.wtp.map((n) => row.wtp?.[n] ?? null),
      ...header.questions.map((q) => row.answers[q.key]),
    ];
  });
  return { header: columns, rows };
}
