// The errors every server layer may throw; the error middleware turns them into the API's error body.
import type { ZodError } from 'zod';
import type { ErrorCode } from '../../shared/api/errors';

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
