import type { ErrorRequestHandler, RequestHandler } from 'express';
import { AppError, TooManyRequestsError } from './errors';

/** The one error shape of the API. */
export interface ErrorBody {
  error: { code: string; message: string; details?: unknown };
}

const STATUS_BY_CODE: Record<string, number> = {
  validation_failed: 400,
  malformed_json: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  too_many_requests: 429,
};

export function statusFor(error: AppError): number {
  return STATUS_BY_CODE[error.code] ?? 500;
}

export const notFoundHandler: RequestHandler = (req, _res, next) => {
  next(new AppError('not_found', `No route for ${req.method} ${req.path}.`));
};

/**
 * Maps every error to `{ error: { code, message, details? } }`. Unknown errors become a
 * 500 with a generic message; their stack goes to the log, never to the client.
 */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let error: AppError;
  if (err instanceof AppError) {
    error = err;
  } else if (err?.type === 'entity.parse.failed') {
    error = new AppError('malformed_json', 'The request body is not valid JSON.');
  } else if (err?.type === 'entity.too.large') {
    error = new AppError(
      'payload_too_large',
      `The request body is larger than ${err.limit} bytes.`,
    );
  } else {
    req.log?.error({ err }, 'unhandled error');
    error = new AppError(
      'internal',
      'Something went wrong on our side. The error has been logged.',
    );
  }
  const status = statusFor(error);
  if (error instanceof TooManyRequestsError)
    res.setHeader('Retry-After', String(error.retryAfterSeconds));
  const body: ErrorBody = { error: { code: error.code, message: error.message } };
  if (error.details !== undefined) body.error.details = error.details;
  res.status(status).json(body);
};
