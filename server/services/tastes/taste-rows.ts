/** Turns stored profile rows into the rows the API shows, leaving personal columns out. */
import type { ProfileRow } from '../../../db/queries/taste-profiles';
import type { TasteHeader, TasteRow } from '../../../shared/schemas/tastes';
import { formatAnswer } from './background-answers';

/** Names of the quality flags that are set (flags are stored as flag → value, or a list). */
export function getFlagNames(flags: unknown): string[] {
  if (Array.isArray(flags)) return flags.map(String);
  if (!flags || typeof flags !== 'object') return [];
  return Object.entries(flags as Record<string, unknown>)
    .filter(([, v]) => v !== false && v !== null && v !== 0 && v !== undefined)
    .map(([k]) => k);
}

const asNumbers = (x: unknown): Record<string, number> =>
  x && typeof x === 'object' ? (x as Record<string, number>) : {};

/** HB intervals and the likeliest latent class, when the run stored them. */
function familyColumns(extra: unknown): Partial<TasteRow> {
  if (!extra || typeof extra !== 'object') return {};
  const e = extra as {
    lower?: unknown;
    upper?: unknown;
    likeliestClass?: number;
    classProbabilities?: number[];
  };
  return {
    ...(e.lower ? { lower: asNumbers(e.lower), upper: asNumbers(e.upper) } : {}),
    ...(e.likeliestClass !== undefined
      ? {
          likeliestClass: e.likeliestClass,
          classProbability: e.classProbabilities?.[e.likeliestClass - 1],
        }
      : {}),
  };
}

export function toTasteRow(
  row: ProfileRow,
  header: TasteHeader,
  answersOf: Map<string, unknown> | undefined,
): TasteRow {
  const answers: Record<string, string | null> = {};
  for (const q of header.questions) answers[q.key] = formatAnswer(q, answersOf?.get(q.key));
  return {
    respondentId: row.respondentId,
    number: row.number,
    ...(header.personalColumns ? { externalId: row.externalId } : {}),
    block: row.block,
    flags: getFlagNames(row.flags),
    mean: asNumbers(row.mean),
    sd: asNumbers(row.sd),
    wtp: row.wtp ? asNumbers(row.wtp) : null,
    effectiveDraws: row.effectiveDraws,
    lowDraws: row.effectiveDraws < header.lowDrawsThreshold,
    ...familyColumns(row.extra),
    answers,
  };
}
