import { randomBytes } from 'node:crypto';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadConfig, type Config, type RateLimitConfig } from '../../server/config';

/** Settings a test may change; rate limits one by one, the rest kept high. */
export type TestConfigOverrides = Partial<Omit<Config, 'rateLimit'>> & { rateLimit?: Partial<RateLimitConfig> };

/**
 * Settings for tests: the test database from the SHEDWRIGHT_DB_* variables that `npm test` (or
 * `node scripts/db.mjs test`) exports, free ports, and rate limits (counted apart from other apps') high enough that only the tests
 * aimed at them ever reach them.
 */
export function testConfig(overrides: TestConfigOverrides = {}): Config {
  if (!process.env.SHEDWRIGHT_DB_PORT || !process.env.SHEDWRIGHT_DB_NAME) {
    throw new Error('SHEDWRIGHT_DB_* is not set: run the server tests through `npm test`, or start '
      + '`node scripts/db.mjs test` and export the lines it prints.');
  }
  const base = loadConfig({ ...process.env, SHEDWRIGHT_DEV: '0' });
  return {
    ...base,
    port: 0,
    smtpPort: 0,
    publicUrl: 'http://127.0.0.1:4780',
    sessionSecret: 'test-secret-shared-by-app-instances',
    staticDir: '.no-static-dir-in-tests',
    log: { level: 'info', file: testLogFile, sync: true },
    ...overrides,
    rateLimit: {
      windowMs: 60_000,
      signIn: 10_000,
      signInPerAccount: 10_000,
      signUp: 10_000,
      passwordReset: 10_000,
      // Counters live in the shared test database: each app counts on its own unless a test shares one on purpose.
      namespace: `test-${randomBytes(6).toString('hex')}:`,
      ...overrides.rateLimit,
    },
  };
}

/**
 * The log file of every app this test file starts (modules load afresh per test file), so a test
 * can read what its servers logged.
 */
export const testLogFile = join(tmpdir(), `shedwright-test-log-${process.pid}-${randomBytes(4).toString('hex')}.log`);

let counter = 0;
/** An e-mail no other test (or suite sharing the database) will use. */
export function uniqueEmail(prefix = 'user'): string {
  counter += 1;
  return `${prefix}-${Date.now().toString(36)}-${counter}-${randomBytes(3).toString('hex')}@test.shedwright.test`;
}
