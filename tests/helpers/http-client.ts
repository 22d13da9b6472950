import { SESSION_COOKIE } from '../../server/app';

/** One answer, read whole: status, headers, the JSON body (when JSON) and the raw bytes. */
export interface Answer {
  status: number;
  headers: Headers;
  body: { [key: string]: unknown } & { error?: { code: string; message: string } };
  bytes: Buffer;
}

/**
 * A browser stand-in over real HTTP (fetch), for servers listening on ports: it keeps the session
 * cookie and the CSRF token, and may be pointed at any server, so one sign-in can be tried on
 * another server. `forwardedFor` sends X-Forwarded-For, as a proxy in front of the app would.
 */
export class HttpClient {
  cookie: string | null = null;
  /** The CSRF token of the session, once fetched (or handed over by a sign-in). */
  token: string | null = null;

  constructor(public forwardedFor?: string) {}

  private headers(extra: Record<string, string> = {}): Record<string, string> {
    return {
      ...(this.cookie ? { cookie: this.cookie } : {}),
      ...(this.forwardedFor ? { 'x-forwarded-for': this.forwardedFor } : {}),
      ...extra,
    };
  }

  private keep(res: Response): void {
    const set = res.headers.getSetCookie().find((c) => c.startsWith(`${SESSION_COOKIE}=`));
    if (set) this.cookie = set.split(';')[0];
  }

  async request(base: string, method: string, path: string, body?: unknown | FormData): Promise<Answer> {
    if (method !== 'GET' && !this.token) {
      const csrf = await this.request(base, 'GET', '/api/csrf');
      this.token = csrf.body.token as string;
    }
    const form = body instanceof FormData;
    const res = await fetch(`${base}${path}`, {
      method,
      headers: this.headers({
        ...(method !== 'GET' && this.token ? { 'x-csrf-token': this.token } : {}),
        ...(body !== undefined && !form ? { 'content-type': 'application/json' } : {}),
      }),
      body: body === undefined ? undefined : form ? body : JSON.stringify(body),
    });
    this.keep(res);
    const bytes = Buffer.from(await res.arrayBuffer());
    let parsed: Answer['body'] = {};
    if ((res.headers.get('content-type') ?? '').includes('json')) parsed = JSON.parse(bytes.toString('utf8')) as Answer['body'];
    if (typeof parsed.csrfToken === 'string') this.token = parsed.csrfToken;
    return { status: res.status, headers: res.headers, body: parsed, bytes };
  }

  get(base: string, path: string) { return this.request(base, 'GET', path); }
  post(base: string, path: string, body?: unknown) { return this.request(base, 'POST', path, body); }
  put(base: string, path: string, body?: unknown) { return this.request(base, 'PUT', path, body); }
  delete(base: string, path: string) { return this.request(base, 'DELETE', path); }
}
