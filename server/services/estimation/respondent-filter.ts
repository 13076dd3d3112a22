/**
 * Applies a saved respondent filter (respondent_filters.definition, see
 * respondentFilterDefinitionSchema in shared/schemas/run.ts) to the respondents a run would use.
 */
import { respondentFilterDefinitionSchema } from '../../../shared/schemas/run';
import { StudyDataError } from './study-data-error';

/** Scalar answers a stored value stands for: itself, its option id(s), or list entries. */
function answerTokens(value: unknown): unknown[] {
  if (Array.isArray(value)) return value.flatMap(answerTokens);
  if (value && typeof value === 'object') {
    const v = value as Record<string, unknown>;
    return ['optionId', 'optionIds', 'number', 'value', 'values'].flatMap((k) =>
      k in v ? answerTokens(v[k]) : [],
    );
  }
  return [value];
}

/** The ids of `respondentIds` that pass the filter. */
export function applyRespondentFilter(
  definition: unknown,
  respondentIds: readonly string[],
  questionAnswers: readonly { respondentId: string; screenKey: string; value: unknown }[],
): Set<string> {
  const parsed = respondentFilterDefinitionSchema.safeParse(definition);
  if (!parsed.success)
    throw new StudyDataError('no_data', 'The saved filter cannot be read; save it again.');
  const { respondentIds: listed, conditions = [] } = parsed.data;
  const allowed = listed ? new Set(listed) : null;
  const byRespondent = new Map<string, Map<string, unknown>>();
  for (const a of questionAnswers) {
    if (!a.screenKey.startsWith('q:')) continue;
    let m = byRespondent.get(a.respondentId);
    if (!m) byRespondent.set(a.respondentId, (m = new Map()));
    m.set(a.screenKey.slice(2), a.value);
  }
  return new Set(
    respondentIds.filter((id) => {
      if (allowed && !allowed.has(id)) return false;
      return conditions.every((c) => {
        const tokens = answerTokens(byRespondent.get(id)?.get(c.question));
        return c.values.some((v) => tokens.includes(v));
      });
    }),
  );
}
