/**
 * The runs started on the demo study (by `npm start`, and by bench:fieldwork to load the
 * machine with a real estimation): the specs the Models form builds, through its own builder
 * (src/features/runs/utils/run-form-values.ts).
 */
import type { CreateRunInput, RunOptions } from '../../shared/schemas/run';
import {
  getColumnDefault,
  getDefaultRunFormValues,
  toCreateRunInput,
} from '../../src/features/runs/utils/run-form-values';

export const DEMO_STUDY_NAME = 'Water service packages 2027–2031';
// Modest but sound: enough Halton draws for stable estimates of five random tastes on ~400
// respondents, and quick enough on a two-core machine to finish a few minutes after the start.
const DRAWS = 200;
const PROFILE_DRAWS = 1000;
const SEED = 1;

/** The form's create-run input for `model`, with its default column choices and our draws. */
export function buildDemoRunInput(options: RunOptions, model: 'mnl' | 'mixed'): CreateRunInput {
  const values = {
    ...getDefaultRunFormValues(options),
    model,
    columns: options.columns.map((c) => ({ distribution: getColumnDefault(c, model) })),
    drawsType: 'halton' as const,
    drawsCount: DRAWS,
    profileDraws: PROFILE_DRAWS,
    seed: SEED,
  };
  return toCreateRunInput(values, options.columns);
}
