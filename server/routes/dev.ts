import * as dev from '../controllers/dev';
import { defineRoute } from './route';

export const devRoutes = [
  // Mails caught on a developer's machine, readable there without signing in (a reset link is read
  // before anyone can sign in). Outside development mode the route does not exist: nobody, admins
  // included, reads other people's mail through the app.
  defineRoute({ method: 'get', path: '/api/dev/mails', minimumRole: 'public', devOnly: true, handle: dev.mails }),
];
