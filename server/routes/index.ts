import { Router, type RequestHandler } from 'express';
import type { z } from 'zod';
import type { AppContext } from '../context';
import { resourceRole, siteAccess } from '../middleware/access';
import { validationError } from '../http/errors';
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

function parse(schema: z.ZodType | undefined, value: unknown): unknown {
  if (!schema) return undefined;
  const result = schema.safeParse(value);
  if (!result.success) throw validationError(result.error);
  return result.data;
}

/**
 * The API router: for each route, rate limit → signed in / admin (401, 403) → input validation (400)
 * → role on the studio or draft (404, 403) → controller.
 */
export function apiRouter(app: AppContext): Router {
  const router = Router();
  const limiters = createLimiters(app.config.rateLimit, app.rateLimitStore);
  for (const spec of routeTable) {
    const chain: RequestHandler[] = [];
    if (spec.limiter) chain.push(limiters[spec.limiter]);
    chain.push(siteAccess(spec, app));
    if (spec.upload) chain.push(spec.upload);
    chain.push(async (req, res) => {
      const params = parse(spec.params, req.params) as { id?: number; userId?: number } | undefined;
      const query = parse(spec.query, req.query);
      const body = parse(spec.body, req.body);
      const role = req.user ? await resourceRole(spec, app, req.user.id, params ?? {}) : null;
      await (spec.handle as (ctx: unknown) => Promise<void>)({ req, res, app, body, query, params, role });
    });
    // The router is mounted at /api; the table keeps full paths so it reads like the contract.
    router[spec.method](spec.path.replace(/^\/api/, ''), ...chain);
  }
  return router;
}
