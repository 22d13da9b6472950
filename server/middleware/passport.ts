import type { Request, Response } from 'express';
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { Models, UserRow } from '../models';
import { accountOf } from '../models/access';
import { checkCredentials } from '../services/auth';

/**
 * A passport instance per app (not the global one), so apps on different databases can coexist in tests.
 * Only the user id goes into the session; each request reads the account from MariaDB, so a deleted
 * account or a changed role takes effect at once on every server.
 */
export function createPassport(models: Models): passport.PassportStatic {
  const instance = new passport.Passport() as passport.PassportStatic;
  instance.use(new LocalStrategy({ usernameField: 'email', passwordField: 'password', session: true },
    (email, password, done) => {
      checkCredentials(models, email, password)
        .then((row) => done(null, row ? accountOf(row) : false))
        .catch(done);
    }));
  instance.serializeUser((user, done) => done(null, user.id));
  instance.deserializeUser((id: number, done) => {
    models.access.account(id)
      .then((account) => done(null, account ?? false))
      .catch(done);
  });
  return instance;
}

/** Runs the local strategy on the (already validated) body; resolves to the user or null. */
export function authenticateLocal(pp: passport.PassportStatic, req: Request, res: Response): Promise<Express.User | null> {
  return new Promise((resolve, reject) => {
    pp.authenticate('local', { session: false }, (err: unknown, user: Express.User | false) => {
      if (err) reject(err);
      else resolve(user || null);
    })(req, res, reject);
  });
}

/** Signs the user in; passport regenerates the session id, which defeats session fixation. */
export function logIn(req: Request, user: Express.User | UserRow): Promise<void> {
  const plain = 'passwordHash' in user ? accountOf(user) : user;
  return new Promise((resolve, reject) => req.login(plain, (err) => (err ? reject(err) : resolve())));
}

/** Signs out; passport also regenerates the session. */
export function logOut(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
}
