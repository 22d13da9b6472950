import { confirmSignUpBodySchema, forgotBodySchema, resetBodySchema, signInBodySchema, signUpBodySchema } from '../../shared/api/auth';
import * as auth from '../controllers/auth';
import { defineRoute } from './route';

export const authRoutes = [
  defineRoute({ method: 'get', path: '/api/csrf', minimumRole: 'public', handle: auth.csrfToken }),
  defineRoute({ method: 'get', path: '/api/session', minimumRole: 'public', handle: auth.session }),
  defineRoute({ method: 'post', path: '/api/auth/sign-up', minimumRole: 'public', limiter: 'signUp', body: signUpBodySchema, handle: auth.signUp }),
  defineRoute({
    method: 'post', path: '/api/auth/sign-up/confirm', minimumRole: 'public', limiter: 'signUp', body: confirmSignUpBodySchema, handle: auth.confirmSignUp,
  }),
  defineRoute({
    method: 'post', path: '/api/auth/sign-in', minimumRole: 'public', limiter: 'signIn', body: signInBodySchema, handle: auth.signIn,
  }),
  defineRoute({ method: 'post', path: '/api/auth/sign-out', minimumRole: 'public', handle: auth.signOut }),
  defineRoute({
    method: 'post', path: '/api/auth/forgot', minimumRole: 'public', limiter: 'passwordReset', body: forgotBodySchema, handle: auth.forgot,
  }),
  defineRoute({
    method: 'post', path: '/api/auth/reset', minimumRole: 'public', limiter: 'passwordReset', body: resetBodySchema, handle: auth.reset,
  }),
];
