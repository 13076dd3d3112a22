/** Errors raised by the estimation engine; each carries a literal code for the job runner. */

/** Options or specification invalid; raised before any numerics run. */
export class EstimationOptionsError extends Error {
  readonly code = 'invalid_options' as const;
  readonly field: string | undefined;
  constructor(message: string, field?: string) {
    super(message);
    this.name = 'EstimationOptionsError';
    this.field = field;
  }
}

/** The model cannot be identified from the data (no variation, collinearity, separation). */
export class NonIdentifiedError extends Error {
  readonly code = 'not_identified' as const;
  readonly parameters: readonly string[];
  constructor(message: string, parameters: readonly string[] = []) {
    super(message);
    this.name = 'NonIdentifiedError';
    this.parameters = parameters;
  }
}

/** Estimation stopped because the caller's AbortSignal fired. */
export class EstimationCancelledError extends Error {
  readonly code = 'cancelled' as const;
  constructor() {
    super('the estimation was cancelled');
    this.name = 'EstimationCancelledError';
  }
}

/** A sampler or EM run reached a state with no valid estimate (a diverging chain, an empty class). */
export class EstimationFailedError extends Error {
  readonly code = 'estimation_failed' as const;
  constructor(message: string) {
    super(message);
    this.name = 'EstimationFailedError';
  }
}
