import { Router, type RequestHandler } from 'express';
import type { z } from 'zod';
import type { StudioRole } from '../../shared/api/auth';
import type { AppContext } from '../context';
import { resourceRole, siteAccess } from '../middleware/access';
import { brokenTextPath, BROKEN_TEXT_MESSAGE } from '../../shared/weave/text';
import { HttpError, validationError } from '../http/errors';
import { createLimiters } from '../middleware/rate-limit';
import { authRoutes } from './auth';
import { collaborationRoutes } from './collaboration';
import { devRoutes } from './dev';
import { draftRoutes } from './drafts';
import { exportRoutes } from './exports';
import { planRoutes } from './plans';
import type { RouteSpec } from '../http/handler';
import { studioRoutes } from './studios';
import { yarnRoutes } from './yarns';

/**
 * Every API route with the role it needs. The access matrix test walks this list, so a route added
 * here is tested for every role, and a route not added here does not exist.
 */
export const routeTable: readonly RouteSpec[] = [...authRoutes, ...studioRoutes, ...draftRoutes, ...collaborationRoutes, ...yarnRoutes, ...planRoutes, ...exportRoutes, ...devRoutes];

/**
 * The input as the route's schema reads it. Text with half a UTF-16 pair is refused here for every
 * route at once: no column, file or log line can hold it (shared/weave/text.ts).
 */
function parse(schema: z.ZodType | undefined, value: unknown): unknown {
  if (!schema) return undefined;
  const result = schema.safeParse(value);
  if (!result.success) throw validationError(result.error);
  const broken = brokenTextPath(result.data);
  if (broken) throw new HttpError(400, 'validation', 'Some fields are not valid', { [broken.join('.') || '_']: BROKEN_TEXT_MESSAGE });
  return result.data;
}

/** What the access check found, for the handler: the validated path parameters and the caller's role. */
interface Access {
  params: { id?: number; userId?: number } | undefined;
  role: StudioRole | null;
}

/**
 * The API router: for each route, rate limit → signed in (401) → path parameters (400) → role on the
 * studio or draft (404, 403) → the uploaded file, if any (413) → query and body (400) → controller.
 * A file is read only once the caller is known to be allowed to send it.
 */
export function apiRouter(app: AppContext): Router {
  const router = Router();
  const limiters = createLimiters(app.config.rateLimit, app.sequelize);
  for (const spec of routeTable) {
    if (spec.devOnly && !app.config.dev) continue;
    const chain: RequestHandler[] = [];
    if (spec.limiter) chain.push(...limiters[spec.limiter]);
    chain.push(siteAccess(spec));
    chain.push(async (req, res, next) => {
      const params = parse(spec.params, req.params) as Access['params'];
      const role = req.user ? await resourceRole(spec, app, req.user.id, params ?? {}) : null;
      res.locals.access = { params, role } satisfies Access;
      next();
    });
    if (spec.upload) chain.push(spec.upload);
    chain.push(async (req, res) => {
      const { params, role } = res.locals.access as Access;
      const query = parse(spec.query, req.query);
      const body = parse(spec.body, req.body);
      await (spec.handle as (ctx: unknown) => Promise<void>)({ req, res, app, body, query, params, role });
    });
    // The router is mounted at /api; the table keeps full paths so it reads like the contract.
    router[spec.method](spec.path.replace(/^\/api/, ''), ...chain);
  }
  return router;
}
