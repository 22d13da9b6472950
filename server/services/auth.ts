import { Op, QueryTypes, UniqueConstraintError } from 'sequelize';
import type { ConfirmSignUpBody, ResetBody, SignUpBody } from '../../shared/api/auth';
import type { Mailer } from '../mail/mailer';
import { HttpError } from '../http/errors';
import type { Models, UserRow } from '../models';
import { dummyPasswordHash, hashPassword, verifyPassword } from './passwords';
import { newToken, tokenHash } from './tokens';

export const RESET_TOKEN_TTL_MS = 60 * 60 * 1000;

/**
 * Makes an account at once, for accounts the server makes itself (tools, load tests): people
 * signing up get theirs from the mailed link (requestSignUp, confirmSignUp).
 */
export async function createAccount(models: Models, body: { email: string; name: string; password: string }): Promise<UserRow> {
  return models.User.create({ email: body.email, name: body.name, passwordHash: await hashPassword(body.password) });
}

export const SIGN_UP_TOKEN_TTL_MS = 24 * 60 * 60 * 1000;

/**
 * The work behind a sign-up, done after the caller has had the same answer whatever the address:
 * a new address gets a link that makes the account; the owner of a taken address gets a note
 * saying someone tried, and nothing changes on the account.
 */
export async function requestSignUp(
  models: Models, mailer: Mailer, publicUrl: string, body: SignUpBody, now = new Date(),
): Promise<void> {
  const owner = await models.User.findOne({ where: { email: body.email } });
  if (owner) {
    await mailer.send({
      to: owner.email,
      subject: 'Someone tried to make a Shedwright account with your address',
      text: `Hello ${owner.name},\n\nSomeone (perhaps you) asked to make a new Shedwright account with this e-mail address, which already has one.\n`
        + `Nothing has changed on your account. If it was you, sign in instead:\n\n${publicUrl}/sign-in\n\n`
        + `If you have forgotten your password, choose a new one here:\n\n${publicUrl}/forgot\n\n`
        + 'If it was not you, ignore this mail.\n',
    });
    return;
  }
  const token = newToken();
  await models.PendingSignUp.create({
    email: body.email,
    name: body.name,
    passwordHash: await hashPassword(body.password),
    tokenHash: tokenHash(token),
    expiresAt: new Date(now.getTime() + SIGN_UP_TOKEN_TTL_MS),
  });
  const next = body.next ? `&next=${encodeURIComponent(body.next)}` : '';
  const link = `${publicUrl}/welcome?token=${encodeURIComponent(token)}${next}`;
  await mailer.send({
    to: body.email,
    subject: 'Finish making your Shedwright account',
    text: `Hello ${body.name},\n\nOpen this link within a day to finish making your Shedwright account:\n\n${link}\n\n`
      + 'If you did not ask for an account, ignore this mail; none will be made.\n',
  });
}

/** Makes the account a mailed sign-up link stands for; the link works once, within its day. */
export async function confirmSignUp(models: Models, body: ConfirmSignUpBody, now = new Date()): Promise<UserRow> {
  const invalid = new HttpError(400, 'bad_request', 'This link is invalid, has been used or has expired; sign in, or sign up again');
  const user = await models.User.sequelize!.transaction(async (transaction) => {
    const pending = await models.PendingSignUp.findOne({ where: { tokenHash: tokenHash(body.token) }, transaction });
    if (!pending) return null;
    // A conditional update claims the link, so two clicks at once make one account.
    const [claimed] = await models.PendingSignUp.update(
      { usedAt: now },
      { where: { id: pending.id, usedAt: null, expiresAt: { [Op.gt]: now } }, transaction },
    );
    if (claimed !== 1) return null;
    try {
      return await models.User.create({ email: pending.email, name: pending.name, passwordHash: pending.passwordHash }, { transaction });
    } catch (err) {
      // The address got an account since (another link of the same address was opened first).
      if (err instanceof UniqueConstraintError) return null;
      throw err;
    }
  });
  if (!user) throw invalid;
  return user;
}

/** The user when e-mail and password match, else null (same work either way). */
export async function checkCredentials(models: Models, email: string, password: string): Promise<UserRow | null> {
  const user = await models.User.findOne({ where: { email: email.trim().toLowerCase() } });
  const ok = await verifyPassword(user?.passwordHash ?? (await dummyPasswordHash()), password);
  return user && ok ? user : null;
}

/**
 * Mails a reset link when the e-mail has an account; says nothing either way so the answer does not
 * reveal who has an account. Only the token's hash is stored.
 */
export async function requestPasswordReset(
  models: Models, mailer: Mailer, publicUrl: string, email: string, now = new Date(),
): Promise<void> {
  const user = await models.User.findOne({ where: { email } });
  if (!user) return;
  const token = newToken();
  await models.PasswordReset.create({
    userId: user.id,
    tokenHash: tokenHash(token),
    expiresAt: new Date(now.getTime() + RESET_TOKEN_TTL_MS),
  });
  const link = `${publicUrl}/reset?token=${encodeURIComponent(token)}`;
  await mailer.send({
    to: user.email,
    subject: 'Reset your Shedwright password',
    text: `Hello ${user.name},\n\nSomeone (we hope you) asked to reset the password of your Shedwright account.\n`
      + `Open this link within one hour to choose a new password:\n\n${link}\n\n`
      + 'If you did not ask for this, ignore this mail; your password stays as it is.\n',
  });
}

/** Sets a new password from a mailed token; the token works once, within its hour. */
export async function resetPassword(models: Models, body: ResetBody, now = new Date()): Promise<UserRow> {
  const invalid = new HttpError(400, 'bad_request', 'This reset link is invalid or has expired; ask for a new one');
  const passwordHash = await hashPassword(body.password);
  const user = await models.User.sequelize!.transaction(async (transaction) => {
    // Claiming the token with a conditional update makes single use hold even for two requests at once.
    const reset = await models.PasswordReset.findOne({ where: { tokenHash: tokenHash(body.token) }, transaction });
    if (!reset) return null;
    const [claimed] = await models.PasswordReset.update(
      { usedAt: now },
      { where: { id: reset.id, usedAt: null, expiresAt: { [Op.gt]: now } }, transaction },
    );
    if (claimed !== 1) return null;
    const found = await models.User.findByPk(reset.userId, { transaction });
    if (!found) return null;
    await found.update({ passwordHash }, { transaction });
    // Whoever asked for the other links, this one settled it: they open nothing now.
    await models.PasswordReset.update({ usedAt: now }, { where: { userId: found.id, usedAt: null }, transaction });
    return found;
  });
  if (!user) throw invalid;
  return user;
}

/** The part of the session store that ends a session, in every process that keeps a copy of it. */
export interface SessionEnder {
  destroy(sid: string, callback?: (err?: unknown) => void): void;
}

/**
 * Ends every session signed in as the user: after a password reset, whoever held the old password
 * (or a stolen cookie) is signed out. Sessions keep only the user id, in passport's part of the data.
 */
export async function endSessionsOf(models: Models, sessions: SessionEnder, userId: number): Promise<void> {
  const rows = await models.Session.sequelize!.query<{ sid: string }>(
    "SELECT `sid` FROM `sessions` WHERE JSON_VALUE(`data`, '$.passport.user') = ?",
    { replacements: [String(userId)], type: QueryTypes.SELECT },
  );
  for (const { sid } of rows) {
    await new Promise<void>((resolve, reject) => sessions.destroy(sid, (err) => (err ? reject(err) : resolve())));
  }
}
