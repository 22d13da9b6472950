import { createStudioBodySchema, memberRoleBodySchema } from '../../shared/api/studios';
import * as studios from '../controllers/studios';
import { idParams, memberParams } from './params';
import { defineRoute } from './route';

export const studioRoutes = [
  defineRoute({ method: 'get', path: '/api/studios', minimumRole: 'user', handle: studios.list }),
  defineRoute({ method: 'post', path: '/api/studios', minimumRole: 'user', body: createStudioBodySchema, handle: studios.create }),
  defineRoute({
    method: 'get', path: '/api/studios/:id', minimumRole: 'viewer', resource: 'studio', params: idParams, handle: studios.detail,
  }),
  defineRoute({
    method: 'patch', path: '/api/studios/:id/members/:userId', minimumRole: 'owner', resource: 'studio',
    params: memberParams, body: memberRoleBodySchema, handle: studios.changeRole,
  }),
  defineRoute({
    method: 'delete', path: '/api/studios/:id/members/:userId', minimumRole: 'owner', resource: 'studio', allowSelf: true,
    params: memberParams, handle: studios.remove,
  }),
];
