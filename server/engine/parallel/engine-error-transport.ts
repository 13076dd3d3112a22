/**
 * Engine errors across worker threads: structured cloning keeps an Error's message but not its
 * class, and the job runner chooses its message by class. A worker returns a known engine error
 * as a plain `{ engineError }` value; the caller throws the same class again.
 */
import { ChoiceDataError } from '../estimation/choice-data';
import {
  EstimationCancelledError,
  EstimationFailedError,
  EstimationOptionsError,
  NonIdentifiedError,
} from '../estimation/estimation-errors';

export interface TransportedError {
  engineError: {
    name: string;
    message: string;
    field?: string;
    line?: number;
    parameters?: string[];
  };
}

/** The transport form of a known engine error; rethrows anything else. */
export function toTransportedError(err: unknown): TransportedError {
  if (err instanceof ChoiceDataError)
    return {
      engineError: { name: err.name, message: err.message, field: err.field, line: err.line },
    };
  if (err instanceof EstimationOptionsError)
    return { engineError: { name: err.name, message: err.message, field: err.field } };
  if (err instanceof NonIdentifiedError)
    return {
      engineError: { name: err.name, message: err.message, parameters: [...err.parameters] },
    };
  if (err instanceof EstimationFailedError || err instanceof EstimationCancelledError)
    return { engineError: { name: err.name, message: err.message } };
  throw err;
}

/** Throws the engine error a worker returned; returns any other value unchanged. */
export function unwrapWorkerResult<T>(value: T | TransportedError): T {
  if (!value || typeof value !== 'object' || !('engineError' in value)) return value as T;
  const e = value.engineError;
  if (e.name === 'ChoiceDataError') throw new ChoiceDataError(e.message, e.line, e.field);
  if (e.name === 'EstimationOptionsError') throw new EstimationOptionsError(e.message, e.field);
  if (e.name === 'NonIdentifiedError') throw new NonIdentifiedError(e.message, e.parameters);
  if (e.name === 'EstimationCancelledError') throw new EstimationCancelledError();
  throw new EstimationFailedError(e.message);
}
