import { z } from 'zod';

export const studioRoles = ['viewer', 'editor', 'owner'] as const;
export const studioRoleSchema = z.enum(studioRoles);
export type StudioRole = z.infer<typeof studioRoleSchema>;

/** Lowest first, so a role's rank can be compared with another's. */
export function roleRank(role: StudioRole): number {
  return studioRoles.indexOf(role);
}

export const PASSWORD_MIN_LENGTH = 10;
/** argon2 accepts long inputs, but an upper bound keeps hashing cost predictable. */
export const PASSWORD_MAX_LENGTH = 200;

// The messages are the weaver's: the sign-in and account forms show them beside the field, and the
// server sends the same words when it refuses a body.
const email = z.string().trim().toLowerCase().pipe(z.email({
  error: (issue) => (issue.input === '' ? 'Enter your e-mail address.' : 'Write the whole e-mail address, such as ana@example.com.'),
}).max(254, 'That e-mail address is too long.'));
const password = z.string().min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`)
  .max(PASSWORD_MAX_LENGTH, `Use at most ${PASSWORD_MAX_LENGTH} characters.`);

/** A page of this site to go to once signed in: a path, never another site (`//host` or `/\\host`). */
export const nextPathSchema = z.string().max(500).regex(/^\/(?![/\\])/, 'must be a path on this site');

export const signUpBodySchema = z.object({
  email,
  password,
  name: z.string().trim().min(1, 'Enter your name.').max(100, 'Use at most 100 characters.'),
  /** Where the link in the mail leads once the account is made (an invitation's join page, say). */
  next: nextPathSchema.optional(),
});
export type SignUpBody = z.infer<typeof signUpBodySchema>;

/**
 * The answer to every well-formed sign-up, whether or not the address has an account: the account is
 * made from the link mailed to the address, and an owner of a taken address is mailed instead.
 */
export const signUpResponseSchema = z.object({ ok: z.literal(true) });
export type SignUpResponse = z.infer<typeof signUpResponseSchema>;

/** The token from the link a sign-up mails. */
export const confirmSignUpBodySchema = z.object({ token: z.string().min(1).max(200) });
export type ConfirmSignUpBody = z.infer<typeof confirmSignUpBodySchema>;

export const signInBodySchema = z.object({
  email,
  // Sign-in does not enforce the length rule: a wrong password is a 401, not a 400.
  password: z.string().min(1, 'Enter your password.').max(PASSWORD_MAX_LENGTH),
});
export type SignInBody = z.infer<typeof signInBodySchema>;

export const forgotBodySchema = z.object({ email });
export type ForgotBody = z.infer<typeof forgotBodySchema>;

export const resetBodySchema = z.object({
  token: z.string().min(1).max(200),
  password,
});
export type ResetBody = z.infer<typeof resetBodySchema>;

/** The reset page's form: the new password twice (the token comes from the mailed link). */
export const resetFormSchema = z.object({ password, confirm: z.string() })
  .refine((f) => f.password === f.confirm, { path: ['confirm'], message: 'The two passwords differ.' });

export const membershipSchema = z.object({
  studioId: z.number().int(),
  studioName: z.string(),
  role: studioRoleSchema,
});
export type Membership = z.infer<typeof membershipSchema>;

export const sessionUserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  isAdmin: z.boolean(),
  memberships: z.array(membershipSchema),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

/** `csrfToken` comes with a signed-in user, so the client's first write needs no token request. */
export const sessionResponseSchema = z.object({ user: sessionUserSchema.nullable(), csrfToken: z.string().optional() });
export type SessionResponse = z.infer<typeof sessionResponseSchema>;

/** Sign-up, sign-in and reset: the session was regenerated, so a fresh CSRF token comes along. */
export const authResponseSchema = z.object({ user: sessionUserSchema, csrfToken: z.string() });
export type AuthResponse = z.infer<typeof authResponseSchema>;

export const signOutResponseSchema = z.object({ csrfToken: z.string() });
export const csrfResponseSchema = z.object({ token: z.string() });
