/** A scenario the shared coder refuses (shared/engine/shares/code-scenario.ts) becomes a 400 naming the field. */
import { ValidationError } from '../../lib/errors';
import { ScenarioError } from '../../../shared/engine/shares/code-scenario';

export function rethrowScenarioError(e: unknown): never {
  if (e instanceof ScenarioError)
    throw new ValidationError(e.message, [{ path: e.path, message: e.field }]);
  throw e;
}
