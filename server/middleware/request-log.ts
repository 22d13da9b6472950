import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import type { RequestHandler } from 'express';
import pino, { type Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import { BaseError } from 'sequelize';

/** Where log lines go: standard output, or a file (appended). Level `silent` writes nothing. */
export interface LogConfig {
  level: string;
  file: string | null;
  /**
   * Write each line before the request's answer is done (tests read the log right after a request);
   * otherwise lines are written in the background, off the request's path, and flushed at the stop.
   */
  sync?: boolean;
}

/** One JSON object per line (pino), to standard output or the configured file. */
export function createLogger(config: LogConfig): Logger {
  const destination = pino.destination({ dest: config.file ?? 1, append: true, mkdir: true, sync: config.sync ?? false });
  return pino({ level: config.level, base: { pid: process.pid }, timestamp: pino.stdTimeFunctions.isoTime }, destination);
}

/** A client's own request id is kept when it is a plain short token (letters, digits, dot, dash, underscore). */
const CLIENT_ID = /^[\w.-]{8,64}$/;

/** Path segments as long as a share link's or a reset's token: replaced in logged paths. */
const TOKEN_SEGMENT = /\/[\w-]{20,}(?=\/|$)/g;

/**
 * The path a log line names: long token-like segments (share links) become `:token`, and query
 * values are dropped (their names stay), so no token or typed text reaches the log.
 */
export function loggedPath(url: string): string {
  const [path, query] = url.split('?', 2);
  const names = query ? [...new URLSearchParams(query).keys()] : [];
  return path.replace(TOKEN_SEGMENT, '/:token') + (names.length ? `?${names.map((n) => `${n}=…`).join('&')}` : '');
}

/**
 * What the log keeps of an unexpected error: its kind, message and stack. A database error's
 * message holds its SQL and with it the query's values (a draft, a name, an e-mail): its message
 * is reduced to its kind and the server's error code, and the stack keeps only the frames.
 */
export function loggableError(given: unknown): { type: string; message: string; stack: string } {
  // pino-http hands its error serialiser pino's own serialisation, with the error itself as `raw`.
  const err = (given as { raw?: unknown } | null)?.raw ?? given;
  if (!(err instanceof Error)) return { type: typeof err, message: String(err), stack: '' };
  const frames = (err.stack ?? '').split('\n').filter((line) => /^\s+at /.test(line)).join('\n');
  if (err instanceof BaseError || 'sql' in err) {
    const driver = ((err as { parent?: unknown }).parent ?? err) as { code?: unknown; errno?: unknown };
    const message = [err.name, driver.code, driver.errno !== undefined ? `errno ${String(driver.errno)}` : undefined].filter(Boolean).join(' ');
    return { type: err.name, message, stack: `${message}\n${frames}` };
  }
  return { type: err.name, message: err.message, stack: err.stack ?? err.message };
}

/**
 * pino-http with one line per request: its id (the caller's X-Request-Id when plain, else a new
 * UUID, sent back as X-Request-Id), method, path without values, status, time taken and the client
 * address; the error with its stack for every 500. Headers (cookies, CSRF tokens) and bodies
 * (passwords, drafts) are never logged: the request and response serialisers name what to keep.
 */
export function requestLog(logger: Logger): RequestHandler {
  return pinoHttp({
    logger,
    genReqId: (req: IncomingMessage, res: ServerResponse) => {
      const given = req.headers['x-request-id'];
      const id = typeof given === 'string' && CLIENT_ID.test(given) ? given : randomUUID();
      res.setHeader('X-Request-Id', id);
      return id;
    },
    customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? 'error' : 'info'),
    customSuccessMessage: () => 'request',
    customErrorMessage: () => 'request failed',
    customAttributeKeys: { reqId: 'id' },
    quietReqLogger: true,
    serializers: {
      req: (req: { method: string; url: string; raw?: { ip?: string } }) => ({ method: req.method, path: loggedPath(req.url), ip: req.raw?.ip }),
      res: (res: { statusCode: number }) => ({ status: res.statusCode }),
      err: loggableError,
    },
  }) as unknown as RequestHandler;
}
