/**
 * One error model for the API. Services throw AppError subclasses; the error middleware turns
 * them (and zod errors) into `{ error: { code, message, fields? } }` with the right status.
 */
export type FieldIssue = { path: string; message: string };

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: FieldIssue[],
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export class ValidationError extends AppError {
  constructor(message: string, fields?: FieldIssue[], code = 'invalid_input') {
    super(400, code, message, fields);
  }
}
export class UnauthenticatedError extends AppError {
  constructor(message = 'Please sign in.') {
    super(401, 'unauthenticated', message);
  }
}
export class ForbiddenError extends AppError {
  constructor(message = 'Your role does not allow this.', code = 'forbidden') {
    super(403, code, message);
  }
}
export class NotFoundError extends AppError {
  constructor(what = 'Resource') {
    super(404, 'not_found', `${what} not found.`);
  }
}
export class ConflictError extends AppError {
  constructor(code: string, message: string, fields?: FieldIssue[]) {
    super(409, code, message, fields);
  }
}
