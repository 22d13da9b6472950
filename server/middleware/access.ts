import type { NextFunction, Request, Response } from 'express';
import { roleRank, type StudioRole } from '../../shared/api/auth';
import type { AppContext } from '../context';
import type { RouteSpec } from '../http/handler';
import { draftRole } from '../services/drafts';
import { studioRole } from '../services/studios';
import { forbidden, HttpError, notFound } from '../http/errors';

const signedOut = () => new HttpError(401, 'unauthenticated', 'Sign in first');

/** 401 for a route that needs a signed-in caller. */
export function siteAccess(spec: RouteSpec) {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (spec.minimumRole !== 'public' && !req.user) return next(signedOut());
    next();
  };
}

/**
 * The caller's role on the route's resource (`:id`), checked against the route's minimum studio role.
 * Site admins get no studio powers from being admins: a studio's content is its members' business.
 */
export async function resourceRole(
  spec: RouteSpec, app: AppContext, userId: number, params: { id?: number; userId?: number },
): Promise<StudioRole | null> {
  const minimum = spec.minimumRole;
  if (minimum === 'public' || minimum === 'user') return null;
  if (params.id === undefined) throw new Error(`${spec.method} ${spec.path}: a studio role needs an :id`);
  const role = spec.resource === 'draft'
    ? await draftRole(app.models, userId, params.id, { inBin: spec.inBin === true })
    : await studioRole(app.models, userId, params.id);
  if (!role) throw notFound(spec.resource === 'draft' ? 'No such draft' : 'No such studio');
  const self = spec.allowSelf && params.userId === userId;
  if (roleRank(role) < roleRank(minimum) && !self) throw forbidden(`Needs the ${minimum} role in this studio`);
  return role;
}
