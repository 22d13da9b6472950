import { yarnBodySchema, yarnPatchSchema } from '../../shared/api';
import * as yarns from '../controllers/yarns';
import { idParams } from './params';
import { defineRoute } from './route';

/** A weaver's own stash: private, so another weaver's yarn is "not found". */
export const yarnRoutes = [
  defineRoute({ method: 'get', path: '/api/yarns', minimumRole: 'user', handle: yarns.list }),
  defineRoute({ method: 'post', path: '/api/yarns', minimumRole: 'user', body: yarnBodySchema, handle: yarns.create }),
  defineRoute({ method: 'patch', path: '/api/yarns/:id', minimumRole: 'user', params: idParams, body: yarnPatchSchema, handle: yarns.update }),
  defineRoute({ method: 'delete', path: '/api/yarns/:id', minimumRole: 'user', params: idParams, handle: yarns.remove }),
];
