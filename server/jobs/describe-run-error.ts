/** The failed-run message an analyst can act on, for errors the data or the model explain. */
import { AppError } from '../lib/errors';
import { ChoiceDataError } from '../engine/estimation/choice-data';
import {
  EstimationFailedError,
  EstimationOptionsError,
  NonIdentifiedError,
} from '../engine/estimation/estimation-errors';

/** A message an analyst can act on, for errors the data or the model explain. */
export function describeRunError(err: unknown): string | null {
  if (err instanceof AppError) return err.message;
  if (err instanceof ChoiceDataError) return `The choice data cannot be used: ${err.message}.`;
  if (err instanceof EstimationOptionsError)
    return `The model specification cannot be used: ${err.message}.`;
  if (err instanceof NonIdentifiedError)
    return `The model cannot be estimated from these data: ${err.message}.`;
  if (err instanceof EstimationFailedError) return `The estimation failed: ${err.message}`;
  if (err instanceof Error && /not finite at the starting values/.test(err.message))
    return 'The log-likelihood is not finite at the starting values; check the coding and scale of the attributes.';
  return null;
}
