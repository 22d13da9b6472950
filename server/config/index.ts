import { randomBytes } from 'node:crypto';
import type { S3Config } from '../storage/s3';

export interface DbConfig {
  host: string;
  port: number;
  name: string;
  user: string;
  password: string;
}

export interface RateLimitConfig {
  windowMs: number;
  /** Failed sign-ins per window and client address. */
  signIn: number;
  /** Failed sign-ins per window and account (the e-mail tried), whatever the address. */
  signInPerAccount: number;
  /** Forgot and reset requests per window and client address. */
  passwordReset: number;
  /** Sign-ups (and the links from their mails) per window and client address. */
  signUp: number;
  /**
   * Put before every counter's key. Empty in use (every server shares the counters); tests give each
   * app of their own a namespace so suites running side by side do not count each other's requests.
   */
  namespace: string;
}

export interface Config {
  host: string;
  port: number;
  db: DbConfig;
  smtpPort: number;
  publicUrl: string;
  sessionSecret: string;
  dev: boolean;
  /** The built client; served with index.html for client routes when it exists. */
  staticDir: string;
  /** Largest JSON body accepted, in the body parser's notation. */
  bodyLimit: string;
  /** The object store (S3 API) that keeps uploaded photos; `npm start` and `npm test` run a local fake. */
  s3: S3Config;
  /** How long a session lasts after it was last saved; an older session cookie signs nobody in. */
  sessionMaxAgeMs: number;
  rateLimit: RateLimitConfig;
  /**
   * Express's `trust proxy`: which hops' X-Forwarded-For and X-Forwarded-Proto are believed, and so
   * the client address that rate limits count and whether a request came over https.
   */
  trustProxy: boolean | number | string;
  /** Structured request logs (pino): level, where they go and whether each line is written at once. */
  log: { level: string; file: string | null; sync?: boolean };
}

type Env = Record<string, string | undefined>;

/**
 * SHEDWRIGHT_TRUST_PROXY as Express takes it: `true`/`false`, a number of hops, or addresses and
 * subnets (`loopback`, `10.0.0.0/8, 192.168.1.7`). Unset: loopback when the public address is https
 * (a terminating proxy on this machine), else nothing.
 */
function trustProxy(raw: string | undefined, publicUrl: string): boolean | number | string {
  if (raw === undefined || raw.trim() === '') return publicUrl.startsWith('https:') ? 'loopback' : false;
  const value = raw.trim();
  if (value === 'true' || value === 'false') return value === 'true';
  if (/^\d+$/.test(value)) return Number(value);
  return value;
}

function int(env: Env, key: string, fallback: number): number {
  const raw = env[key];
  if (raw === undefined || raw === '') return fallback;
  const value = Number(raw);
  if (!Number.isInteger(value) || value < 0) throw new Error(`${key} must be a whole number, got "${raw}"`);
  return value;
}

/** Reads the SHEDWRIGHT_* settings; every one has a default that suits a single machine. */
export function loadConfig(env: Env = process.env): Config {
  const publicUrl = (env.SHEDWRIGHT_PUBLIC_URL || 'http://127.0.0.1:4780').replace(/\/+$/, '');
  return {
    host: env.SHEDWRIGHT_HOST || '127.0.0.1',
    port: int(env, 'SHEDWRIGHT_PORT', 4780),
    db: {
      host: env.SHEDWRIGHT_DB_HOST || '127.0.0.1',
      port: int(env, 'SHEDWRIGHT_DB_PORT', 4781),
      name: env.SHEDWRIGHT_DB_NAME || 'shedwright',
      user: env.SHEDWRIGHT_DB_USER || 'shedwright',
      password: env.SHEDWRIGHT_DB_PASSWORD ?? '',
    },
    smtpPort: int(env, 'SHEDWRIGHT_SMTP_PORT', 4782),
    publicUrl,
    // A random secret still works for one run; the start script passes a stable one so restarts keep sessions.
    sessionSecret: env.SHEDWRIGHT_SESSION_SECRET || randomBytes(32).toString('hex'),
    dev: env.SHEDWRIGHT_DEV === '1',
    staticDir: env.SHEDWRIGHT_STATIC_DIR || 'dist',
    bodyLimit: env.SHEDWRIGHT_BODY_LIMIT || '2mb',
    s3: {
      endpoint: env.SHEDWRIGHT_S3_ENDPOINT ?? `http://127.0.0.1:${int(env, 'SHEDWRIGHT_S3_PORT', 4783)}`,
      region: env.SHEDWRIGHT_S3_REGION || 'us-east-1',
      bucket: env.SHEDWRIGHT_S3_BUCKET || 'shedwright',
      // The local fake's fixed pair (s3rver's defaults); a real store gets its own through the environment.
      accessKeyId: env.SHEDWRIGHT_S3_ACCESS_KEY_ID || 'S3RVER',
      secretAccessKey: env.SHEDWRIGHT_S3_SECRET_ACCESS_KEY || 'S3RVER',
    },
    sessionMaxAgeMs: int(env, 'SHEDWRIGHT_SESSION_MAX_AGE_MS', 30 * 24 * 60 * 60 * 1000),
    rateLimit: {
      windowMs: int(env, 'SHEDWRIGHT_RATE_WINDOW_MS', 15 * 60 * 1000),
      signIn: int(env, 'SHEDWRIGHT_SIGNIN_LIMIT', 10),
      signInPerAccount: int(env, 'SHEDWRIGHT_ACCOUNT_SIGNIN_LIMIT', 10),
      passwordReset: int(env, 'SHEDWRIGHT_RESET_LIMIT', 5),
      signUp: int(env, 'SHEDWRIGHT_SIGNUP_LIMIT', 5),
      namespace: '',
    },
    trustProxy: trustProxy(env.SHEDWRIGHT_TRUST_PROXY, publicUrl),
    log: { level: env.SHEDWRIGHT_LOG_LEVEL || 'info', file: env.SHEDWRIGHT_LOG_FILE || null },
  };
}
