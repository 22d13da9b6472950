import { createHash } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit, type ClientRateLimitInfo, type Options, type Store } from 'express-rate-limit';
import { QueryTypes, type Sequelize } from 'sequelize';
import type { RateLimitConfig } from '../config';
import { HttpError } from '../http/errors';
import type { LimiterName } from '../http/handler';

/**
 * An express-rate-limit store over MariaDB's `rate_limits` table, so every app server sharing the
 * database counts the same hits: a row per key with its hits and the end of its window. Times are
 * the database's (NOW(3)), so servers whose clocks differ still agree on when a window ends.
 */
export class MariaDbStore implements Store {
  /** Keys live in one table for every server: no counter is this process's alone. */
  readonly localKeys = false;
  private windowMs = 60_000;

  constructor(private readonly sequelize: Sequelize, readonly prefix: string) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const [row] = await this.sequelize.query<{ hits: number; resetAt: Date }>(
      'SELECT hits, resetAt FROM rate_limits WHERE `key` = ? AND resetAt > NOW(3)',
      { replacements: [this.prefix + key], type: QueryTypes.SELECT },
    );
    return row ? { totalHits: row.hits, resetTime: row.resetAt } : undefined;
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const full = this.prefix + key;
    const window = this.windowMs * 1000; // microseconds, for TIMESTAMPADD
    // One statement, atomic per row under InnoDB's lock: a window that has ended starts again at 1.
    // NOTE: MariaDB assigns left to right, so `resetAt` in the hits expression is still the old one.
    await this.sequelize.query(
      'INSERT INTO rate_limits (`key`, hits, resetAt) VALUES (?, 1, TIMESTAMPADD(MICROSECOND, ?, NOW(3)))'
      + ' ON DUPLICATE KEY UPDATE hits = IF(resetAt <= NOW(3), 1, hits + 1),'
      + ' resetAt = IF(resetAt <= NOW(3), TIMESTAMPADD(MICROSECOND, ?, NOW(3)), resetAt)',
      { replacements: [full, window, window], type: QueryTypes.INSERT },
    );
    const [row] = await this.sequelize.query<{ hits: number; resetAt: Date }>(
      'SELECT hits, resetAt FROM rate_limits WHERE `key` = ?',
      { replacements: [full], type: QueryTypes.SELECT },
    );
    // Rows of windows long over are cleared now and then, by whichever server happens to count.
    if (Math.random() < 0.01) {
      await this.sequelize.query('DELETE FROM rate_limits WHERE resetAt < NOW(3) - INTERVAL 1 DAY', { type: QueryTypes.DELETE });
    }
    return { totalHits: row?.hits ?? 1, resetTime: row?.resetAt };
  }

  async decrement(key: string): Promise<void> {
    await this.sequelize.query(
      'UPDATE rate_limits SET hits = hits - 1 WHERE `key` = ? AND hits > 0 AND resetAt > NOW(3)',
      { replacements: [this.prefix + key], type: QueryTypes.UPDATE },
    );
  }

  async resetKey(key: string): Promise<void> {
    await this.sequelize.query('DELETE FROM rate_limits WHERE `key` = ?', { replacements: [this.prefix + key], type: QueryTypes.DELETE });
  }
}

/** The account a sign-in names, as a hash: the counter table never holds an e-mail address. */
function accountKey(req: Request): string {
  const email = typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase() : '';
  return createHash('sha256').update(email).digest('base64url');
}

/**
 * The limiters of the sensitive routes, each counting in MariaDB so the limits hold across servers:
 * sign-in failures per client address and per account (a sign-in that succeeds is not counted), and
 * sign-ups and reset requests per client address. The client address is `req.ip`, which follows
 * SHEDWRIGHT_TRUST_PROXY; IPv6 addresses count per /56, as express-rate-limit advises.
 */
export function createLimiters(config: RateLimitConfig, sequelize: Sequelize): Record<LimiterName, RequestHandler[]> {
  const make = (name: string, limit: number, what: string, extra: Partial<Options> = {}) => rateLimit({
    windowMs: config.windowMs,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    store: new MariaDbStore(sequelize, `${config.namespace}${name}:`),
    keyGenerator: (req) => ipKeyGenerator(req.ip ?? ''),
    handler: (_req, _res, next) => next(new HttpError(429, 'rate_limited', `Too many ${what}; wait a few minutes and try again`)),
    ...extra,
  });
  return {
    signIn: [
      make('sign-in', config.signIn, 'sign-in attempts', { skipSuccessfulRequests: true }),
      make('sign-in-account', config.signInPerAccount, 'sign-in attempts for this account', {
        skipSuccessfulRequests: true,
        keyGenerator: accountKey,
      }),
    ],
    signUp: [make('sign-up', config.signUp, 'sign-ups from this address')],
    passwordReset: [make('reset', config.passwordReset, 'password reset requests')],
  };
}
