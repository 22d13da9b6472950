import type { AuthResponse, ConfirmSignUpBody, ForgotBody, ResetBody, SignInBody, SignUpBody, SignUpResponse } from '../../shared/api/auth';
import { afterAnswer } from '../http/after-answer';
import { HttpError } from '../http/errors';
import { authenticateLocal, logIn, logOut } from '../middleware/passport';
import type { Ctx } from '../http/handler';
import { confirmSignUp as makeAccount, endSessionsOf, requestPasswordReset, requestSignUp, resetPassword } from '../services/auth';
import { loadSessionUser } from '../services/users';

type In<B> = Ctx<B, unknown, unknown>;

/** A new session means a new CSRF token; send it along to save the client a round trip. */
async function signedIn({ req, app }: In<unknown>, userId: number): Promise<AuthResponse> {
  const user = await loadSessionUser(app.models, userId);
  if (!user) throw new Error('The account vanished while signing in');
  return { user, csrfToken: req.csrfToken!(true) };
}

export async function csrfToken({ req, res }: In<unknown>) {
  res.json({ token: req.csrfToken!() });
}

/**
 * Who is signed in, and for a signed-in caller the session's CSRF token: the app asks this first on
 * every page load, so a save sent as the weaver leaves a page never has to ask for a token first (a
 * request the next page load would cut off). Nobody signed in gets no token, and no session is made.
 */
export async function session(ctx: In<unknown>) {
  const user = ctx.req.user ? await loadSessionUser(ctx.app.models, ctx.req.user.id) : null;
  ctx.res.json(user ? { user, csrfToken: ctx.req.csrfToken!() } : { user });
}

/**
 * The same answer, at once, for every address: the account is made from the mailed link, and the
 * owner of a taken address is mailed instead of the caller being told.
 */
export async function signUp({ app, body, res }: In<SignUpBody>) {
  res.status(202).json({ ok: true } satisfies SignUpResponse);
  afterAnswer(res, 'handle a sign-up', () => requestSignUp(app.models, app.mailer, app.config.publicUrl, body));
}

/** The link from a sign-up mail: makes the account and signs it in. */
export async function confirmSignUp(ctx: In<ConfirmSignUpBody>) {
  const user = await makeAccount(ctx.app.models, ctx.body);
  await logIn(ctx.req, user);
  ctx.res.status(201).json(await signedIn(ctx, user.id));
}

export async function signIn(ctx: In<SignInBody>) {
  // passport-local reads the normalised e-mail from the body.
  ctx.req.body = ctx.body;
  const user = await authenticateLocal(ctx.app.passport, ctx.req, ctx.res);
  if (!user) throw new HttpError(401, 'unauthenticated', 'E-mail or password is wrong');
  await logIn(ctx.req, user);
  ctx.res.json(await signedIn(ctx, user.id));
}

export async function signOut({ req, res }: In<unknown>) {
  await logOut(req);
  res.json({ csrfToken: req.csrfToken!(true) });
}

/** The same answer, at once, for every address: whether it has an account is found out after answering. */
export async function forgot({ app, body, res }: In<ForgotBody>) {
  res.status(202).json({ ok: true });
  afterAnswer(res, 'send a password reset mail', () => requestPasswordReset(app.models, app.mailer, app.config.publicUrl, body.email));
}

/** A new password ends every session the account had, and signs in this one afresh. */
export async function reset(ctx: In<ResetBody>) {
  const user = await resetPassword(ctx.app.models, ctx.body);
  await endSessionsOf(ctx.app.models, ctx.app.sessionStore, user.id);
  await logIn(ctx.req, user);
  ctx.res.json(await signedIn(ctx, user.id));
}
