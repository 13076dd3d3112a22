/**
 * Errors the design engine throws. `code` values are stable so the API can map them to
 * HTTP statuses (invalid spec → 400, infeasible constraints / too large → 422).
 */
export type DesignErrorCode = 'invalid_spec' | 'infeasible' | 'too_large';

export class DesignError extends Error {
  readonly code: DesignErrorCode;
  /** Field paths (e.g. "priors.columns") with messages, for invalid specs. */
  readonly fields?: Record<string, string>;

  constructor(code: DesignErrorCode, message: string, fields?: Record<string, string>) {
    super(message);
    this.name = 'DesignError';
    this.code = code;
    this.fields = fields;
  }
}
