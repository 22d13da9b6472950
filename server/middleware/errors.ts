import type { ErrorRequestHandler, RequestHandler } from 'express';
import { BaseError, ConnectionError } from 'sequelize';
import { ZodError } from 'zod';
import type { ApiError } from '../../shared/api/errors';
import { HttpError, notFound, validationError } from '../http/errors';

/**
 * Driver codes that mean the connection to MariaDB broke or the server is going away, as opposed to a
 * bad query. Names from the mariadb connector's error list (node_modules/mariadb/lib/misc/errors.js)
 * and MariaDB's server error codes 1053 and 1927.
 */
const CONNECTION_LOST = new Set([
  'ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ETIMEDOUT', 'PROTOCOL_CONNECTION_LOST', 'ER_SOCKET_UNEXPECTED_CLOSE',
  'ER_CONNECTION_ALREADY_CLOSED', 'ER_CONNECTION_TIMEOUT', 'ER_GET_CONNECTION_TIMEOUT', 'ER_SERVER_SHUTDOWN', 'ER_CONNECTION_KILLED',
  'ER_SOCKET_TIMEOUT',
]);

/** True for failures that come from the database being unreachable (stopped, restarting, network). */
function databaseUnavailable(err: unknown): boolean {
  if (err instanceof ConnectionError) return true;
  // Sequelize wraps the driver's error as `parent`; the driver marks connection-ending errors `fatal`.
  const driver = (err as { parent?: { code?: string; fatal?: boolean } } | null)?.parent;
  return err instanceof BaseError && !!driver && (driver.fatal === true || CONNECTION_LOST.has(driver.code ?? ''));
}

/** Known failures from libraries (body parser, CSRF, database) mapped to the contract's statuses. */
function toHttpError(err: unknown): HttpError | null {
  if (err instanceof HttpError) return err;
  if (err instanceof ZodError) return validationError(err);
  if (databaseUnavailable(err)) {
    return new HttpError(503, 'database_unavailable', 'The database is not reachable right now; try again in a moment.');
  }
  const e = err as { type?: string; code?: string; status?: number };
  if (e?.code === 'EBADCSRFTOKEN') return new HttpError(403, 'csrf', 'This page was open too long to save from. Reload the page and try again; nothing was changed.');
  if (e?.type === 'entity.parse.failed') return new HttpError(400, 'bad_request', 'The body is not valid JSON');
  if (e?.type === 'entity.too.large') return new HttpError(413, 'too_large', 'The body is too large');
  if (typeof e?.status === 'number' && e.status >= 400 && e.status < 500) {
    return new HttpError(e.status, 'bad_request', 'The request could not be read');
  }
  return null;
}

/**
 * Answers every error with the contract's JSON shape. An unexpected error goes on the request's log
 * line with its stack (request-log.ts keeps SQL and values out of it); bodies are never logged.
 */
export const errorHandler: ErrorRequestHandler = (err, _req, res, _next) => {
  const known = toHttpError(err);
  if (!known) res.err = err instanceof Error ? err : new Error(String(err));
  if (res.headersSent) return;
  const http = known ?? new HttpError(500, 'internal', 'Something went wrong on the server');
  const body: ApiError = { error: { code: http.code, message: http.message, ...(http.fields ? { fields: http.fields } : {}) } };
  if (http.status === 503) res.set('Retry-After', '5');
  res.status(http.status).json(body);
};

/** Unknown paths answer 404 JSON (under /api this comes before the client's index.html fallback). */
export const routeNotFound: RequestHandler = (_req, _res, next) => next(notFound('No such route'));
