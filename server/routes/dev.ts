import * as dev from '../controllers/dev';
import { defineRoute } from './route';

export const devRoutes = [
  defineRoute({ method: 'get', path: '/api/dev/mails', minimumRole: 'admin', handle: dev.mails }),
];
