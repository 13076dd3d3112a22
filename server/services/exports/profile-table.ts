/**
 * The per-respondent table shared by the CSV and XLSX downloads: one row per respondent with a
 * profile, each individual mean followed by its SD, then WTP values, the effective number of
 * draws and the background answers. External ids and free-text answers only when the caller may
 * read personal data (the header decides). What the means are depends on the model family:
 * conditional means (MNL, mixed logit), posterior means with their 95 % intervals (HB), or
 * class-probability-weighted means with the posterior class probabilities (latent class); the
 * file's methods sheet says which.
 */
import type { ProfileRow } from '../../../db/queries/taste-profiles';
import type { TasteHeader } from '../../../shared/schemas/tastes';
import { toTasteRow } from '../tastes/taste-rows';
import type { CellValue } from '../../lib/safe-csv';

export interface Table {
  header: string[];
  rows: CellValue[][];
}

type Numbers = Record<string, number> | undefined;
type FamilyExtra = {
  lower?: Numbers;
  upper?: Numbers;
  wtpSd?: Numbers;
  wtpLower?: Numbers;
  wtpUpper?: Numbers;
  classProbabilities?: number[];
  likeliestClass?: number;
};

const extraOf = (p: ProfileRow): FamilyExtra =>
  p.extra && typeof p.extra === 'object' ? (p.extra as FamilyExtra) : {};

/**
 * @param classes latent class runs: the number of classes of the chosen model (one probability
 *   column per class); 0 for the other families.
 */
export function buildProfileTable(
  header: TasteHeader,
  profiles: readonly ProfileRow[],
  answers: Map<string, Map<string, unknown>>,
  classes = 0,
): Table {
  const names = header.coefficients.map((c) => c.name);
  const hb = header.run.model === 'hb';
  const lc = header.run.model === 'latent_class';
  const classNumbers = Array.from({ length: lc ? classes : 0 }, (_, i) => i + 1);
  const columns = [
    'respondent',
    'number',
    ...(header.personalColumns ? ['external_id'] : []),
    'block',
    'included',
    'quality_flags',
    // A latent class profile's "draws" are its effective number of classes (no low flag).
    ...(lc ? ['effective_classes'] : ['effective_draws', 'low_effective_draws']),
    ...(lc ? ['likeliest_class', ...classNumbers.map((c) => `p_class_${c}`)] : []),
    ...names.flatMap((n) =>
      hb ? [`mean_${n}`, `sd_${n}`, `lower95_${n}`, `upper95_${n}`] : [`mean_${n}`, `sd_${n}`],
    ),
    ...header.wtp.flatMap((n) =>
      hb ? [`wtp_${n}`, `wtp_sd_${n}`, `wtp_lower95_${n}`, `wtp_upper95_${n}`] : [`wtp_${n}`],
    ),
    ...header.questions.map((q) => q.key),
  ];
  const rows = profiles.map((p) => {
    const row = toTasteRow(p, header, answers.get(p.respondentId));
    const e = extraOf(p);
    return [
      row.respondentId,
      row.number,
      ...(header.personalColumns ? [row.externalId ?? null] : []),
      row.block,
      p.included,
      row.flags.join('; '),
      ...(lc ? [row.effectiveDraws] : [row.effectiveDraws, row.lowDraws]),
      ...(lc
        ? [e.likeliestClass ?? null, ...classNumbers.map((c) => e.classProbabilities?.[c - 1])]
        : []),
      ...names.flatMap((n) => {
        const both = [row.mean[n] ?? null, row.sd[n] ?? null];
        return hb ? [...both, e.lower?.[n], e.upper?.[n]] : both;
      }),
      ...header.wtp.flatMap((n) => {
        const w = row.wtp?.[n] ?? null;
        return hb ? [w, e.wtpSd?.[n], e.wtpLower?.[n], e.wtpUpper?.[n]] : [w];
      }),
      ...header.questions.map((q) => row.answers[q.key]),
    ];
  });
  return { header: columns, rows };
}
