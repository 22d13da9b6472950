import { randomBytes } from 'node:crypto';

export interface DbConfig {
  host: string;
  port: number;
  name: string;
  user: string;
  password: string;
}

export interface RateLimitConfig {
  windowMs: number;
  /** Sign-in attempts per window and client address. */
  signIn: number;
  /** Forgot and reset requests per window and client address. */
  passwordReset: number;
  /** Sign-ups (and the links from their mails) per window and client address. */
  signUp: number;
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
  /** Where uploaded photos are kept: outside the served client, never under staticDir. */
  attachmentsDir: string;
  /** How long a session lasts after it was last saved; an older session cookie signs nobody in. */
  sessionMaxAgeMs: number;
  rateLimit: RateLimitConfig;
}

type Env = Record<string, string | undefined>;

function int(env: Env, key: string, fallback: number): number {
  const raw = env[key];
  if (raw === undefined || raw === '') return fallback;
  const value = Number(raw);
  if (!Number.isInteger(value) || value < 0) throw new Error(`${key} must be a whole number, got "${raw}"`);
  return value;
}

/** Reads the SHEDWRIGHT_* settings; every one has a default that suits a single machine. */
export function loadConfig(env: Env = process.env): Config {
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
    publicUrl: (env.SHEDWRIGHT_PUBLIC_URL || 'http://127.0.0.1:4780').replace(/\/+$/, ''),
    // A random secret still works for one run; the start script passes a stable one so restarts keep sessions.
    sessionSecret: env.SHEDWRIGHT_SESSION_SECRET || randomBytes(32).toString('hex'),
    dev: env.SHEDWRIGHT_DEV === '1',
    staticDir: env.SHEDWRIGHT_STATIC_DIR || 'dist',
    bodyLimit: env.SHEDWRIGHT_BODY_LIMIT || '2mb',
    attachmentsDir: env.SHEDWRIGHT_ATTACHMENTS_DIR || '.data/attachments',
    sessionMaxAgeMs: int(env, 'SHEDWRIGHT_SESSION_MAX_AGE_MS', 30 * 24 * 60 * 60 * 1000),
    rateLimit: {
      windowMs: int(env, 'SHEDWRIGHT_RATE_WINDOW_MS', 15 * 60 * 1000),
      signIn: int(env, 'SHEDWRIGHT_SIGNIN_LIMIT', 10),
      passwordReset: int(env, 'SHEDWRIGHT_RESET_LIMIT', 5),
      signUp: int(env, 'SHEDWRIGHT_SIGNUP_LIMIT', 5),
    },
  };
}
