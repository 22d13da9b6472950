import { rateLimit } from 'express-rate-limit';
import type { RateLimitConfig } from '../config';
import { HttpError } from '../http/errors';

/** One limiter per kind of sensitive route, counting per client address within the window. */
export function createLimiters(config: RateLimitConfig) {
  const make = (limit: number, what: string) => rateLimit({
    windowMs: config.windowMs,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => next(new HttpError(429, 'rate_limited', `Too many ${what}; wait a few minutes and try again`)),
  });
  return {
    signIn: make(config.signIn, 'sign-in attempts'),
    passwordReset: make(config.passwordReset, 'password reset requests'),
    signUp: make(config.signUp, 'sign-ups from your address'),
  };
}
