import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ConnectionError } from 'sequelize';
import { ZodError } from 'zod';
import type { ApiError, ErrorCode } from '../../shared/api/errors';

/** An error whose status, code and message are safe to show to the client. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
  }
}

export const notFound = (what = 'Not found') => new HttpError(404, 'not_found', what);
export const forbidden = (what = 'Your role does not allow this') => new HttpError(403, 'forbidden', what);
export const conflict = (what: string) => new HttpError(409, 'conflict', what);

/** Turns a zod failure into a 400 with one message per field. */
export function validationError(error: ZodError): HttpError {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.join('.') || '_';
    fields[key] ??= issue.message;
  }
  return new HttpError(400, 'validation', 'Some fields are not valid', fields);
}

/** Known failures from libraries (body parser, CSRF, database) mapped to the contract's statuses. */
function toHttpError(err: unknown): HttpError | null {
  if (err instanceof HttpError) return err;
  if (err instanceof ZodError) return validationError(err);
  if (err instanceof ConnectionError) return new HttpError(503, 'unavailable', 'The database is not reachable');
  const e = err as { type?: string; code?: string; status?: number };
  if (e?.code === 'EBADCSRFTOKEN') return new HttpError(403, 'csrf', 'Missing or invalid CSRF token; fetch /api/csrf');
  if (e?.type === 'entity.parse.failed') return new HttpError(400, 'bad_request', 'The body is not valid JSON');
  if (e?.type === 'entity.too.large') return new HttpError(413, 'too_large', 'The body is too large');
  if (typeof e?.status === 'number' && e.status >= 400 && e.status < 500) {
    return new HttpError(e.status, 'bad_request', 'The request could not be read');
  }
  return null;
}

/** Answers every error with the contract's JSON shape; only unexpected errors are logged, never bodies. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const known = toHttpError(err);
  if (res.headersSent) return;
  if (!known) {
    console.error(`Unexpected error on ${req.method} ${req.path}:`, err instanceof Error ? err.message : err);
  }
  const http = known ?? new HttpError(500, 'internal', 'Something went wrong on the server');
  const body: ApiError = { error: { code: http.code, message: http.message, ...(http.fields ? { fields: http.fields } : {}) } };
  res.status(http.status).json(body);
};

/** Unknown paths answer 404 JSON (under /api this comes before the client's index.html fallback). */
export const routeNotFound: RequestHandler = (_req, _res, next) => next(notFound('No such route'));
