import { draftListQuerySchema } from '../../shared/api/drafts';
import * as drafts from '../controllers/drafts';
import { idParams } from './params';
import { defineRoute } from './route';

export const draftRoutes = [
  defineRoute({ method: 'get', path: '/api/drafts', minimumRole: 'user', query: draftListQuerySchema, handle: drafts.list }),
  defineRoute({
    method: 'get', path: '/api/drafts/:id', minimumRole: 'viewer', resource: 'draft', params: idParams, handle: drafts.detail,
  }),
];
