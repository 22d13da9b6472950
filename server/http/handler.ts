// What a route handler is given and how a route is declared, shared by the routes, the access
// middleware and the controllers without any of them importing another.
import type { Request, RequestHandler, Response } from 'express';
import type { z } from 'zod';
import type { StudioRole } from '../../shared/api/auth';
import type { AppContext } from '../context';

/**
 * Who may call a route. Studio roles apply to the route's resource (the studio or the draft named by
 * `:id`); a signed-in non-member gets 404 for those, as if the resource did not exist.
 */
export type MinimumRole = 'public' | 'user' | StudioRole;

/** The routes that count their callers, by what they count (server/middleware/rate-limit.ts). */
export type LimiterName = 'signIn' | 'signUp' | 'passwordReset';

export interface Ctx<B, Q, P> {
  req: Request;
  res: Response;
  app: AppContext;
  body: B;
  query: Q;
  params: P;
  /** The caller's role on the route's resource, for routes guarded by a studio role. */
  role: StudioRole | null;
}

export type Handler<B = unknown, Q = unknown, P = unknown> = (ctx: Ctx<B, Q, P>) => Promise<void>;

export interface RouteSpec {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
  minimumRole: MinimumRole;
  /** What `:id` names, for studio roles. */
  resource?: 'studio' | 'draft';
  /** A tool for developers: the route exists only in development mode (config.dev). */
  devOnly?: boolean;
  /** The route acts on a draft in the Bin (restoring it); every other draft route finds no such draft. */
  inBin?: boolean;
  /** A member acting on their own `:userId` (leaving a studio) needs only 'viewer'. */
  allowSelf?: boolean;
  /** Reads a multipart file (after the access check, before validation); see middleware/upload. */
  upload?: RequestHandler;
  /** Rate-limited routes share counters (in MariaDB) per limiter and client address, or account. */
  limiter?: LimiterName;
  body?: z.ZodType;
  query?: z.ZodType;
  params?: z.ZodType;
  handle: Handler<never, never, never>;
}
