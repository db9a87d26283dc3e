/**
 * Typed errors thrown by services. Only the HTTP layer turns them into status codes
 * (see error-handler.ts), so services stay free of HTTP.
 */
export class AppError extends Error {
  constructor(
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = new.target.name;
  }
}

/** One problem with one field of the input. `path` names the field, e.g. `outline.3`. */
export interface FieldProblem {
  path: string;
  message: string;
}

export class ValidationError extends AppError {
  constructor(message: string, problems: FieldProblem[]) {
    super('validation_failed', message, { problems });
  }
}

export class UnauthenticatedError extends AppError {
  constructor(message = 'Sign in to continue.') {
    super('unauthenticated', message);
  }
}

export class ForbiddenError extends AppError {
  constructor(message = 'Your role does not allow this.') {
    super('forbidden', message);
  }
}

export class NotFoundError extends AppError {
  constructor(what: string) {
    super('not_found', `${what} was not found.`);
  }
}

export class ConflictError extends AppError {
  constructor(message: string, details?: unknown) {
    super('conflict', message, details);
  }
}

export class TooManyRequestsError extends AppError {
  constructor(
    message: string,
    readonly retryAfterSeconds: number,
  ) {
    super('too_many_requests', message, { retryAfterSeconds });
  }
}
