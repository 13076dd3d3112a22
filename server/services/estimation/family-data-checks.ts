/**
 * Refuses a hierarchical Bayes or latent class specification the study's data cannot carry,
 * before it is queued, with the engine's own rules (one implementation): HB needs enough choice
 * tasks per respondent for individual estimates (assertEnoughTasksForHb); a latent class model
 * needs repeated choices and enough respondents for the most classes asked
 * (assertClassesIdentifiable). The data are the ones the worker will use: the included
 * respondents (or the saved filter's), estimation tasks only. When the study has no usable
 * data yet the run is queued and fails with the data's own reason, as for the other models.
 */
import type { AppDeps } from '../../deps';
import { ValidationError } from '../../lib/errors';
import { loadStudyChoiceData, toBuiltChoiceData } from '../choice-data-from-study';
import { StudyDataError } from './study-data-error';
import { getSpecColumns } from '../../engine/estimation/run-estimation';
import { ChoiceDataError } from '../../engine/estimation/choice-data';
import { EstimationOptionsError } from '../../engine/estimation/estimation-errors';
import { assertEnoughTasksForHb } from '../../engine/hb/check-hb-options';
import { assertClassesIdentifiable } from '../../engine/latent-class/check-latent-class-options';
import type { EstimationSpec } from '../../../shared/schemas/estimation-spec';

const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** Throws a 400 too_little_data naming spec.model (HB) or spec.classes (latent class). */
export async function assertFamilyFitsData(
  deps: AppDeps,
  studyId: string,
  spec: EstimationSpec,
  filterId: string | null,
): Promise<void> {
  if (spec.model !== 'hb' && spec.model !== 'latent_class') return;
  let built;
  try {
    const prepared = await loadStudyChoiceData(deps.db, { studyId, filterId });
    built = toBuiltChoiceData(prepared, getSpecColumns(spec));
  } catch (err) {
    if (err instanceof StudyDataError || err instanceof ChoiceDataError) return;
    throw err;
  }
  try {
    if (spec.model === 'hb') assertEnoughTasksForHb(built.data);
    else {
      const classes = spec.classes ?? 2;
      const most = Array.isArray(classes) ? classes[1] : classes;
      // At least one column per membership question (single-choice questions give more).
      const covariates = (spec.membership ?? []).length;
      assertClassesIdentifiable(built.data, most, spec.coefficients.length, covariates);
    }
  } catch (err) {
    if (!(err instanceof EstimationOptionsError)) throw err;
    const message = `${capitalise(err.message)}.`;
    const path = spec.model === 'hb' ? 'spec.model' : 'spec.classes';
    throw new ValidationError(message, [{ path, message }], 'too_little_data');
  }
}
