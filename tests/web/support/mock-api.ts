// A stand-in for the server: answers fetch from a table of `METHOD /path` handlers and records every request.
import { afterEach, vi } from 'vitest';

export interface RecordedRequest {
  method: string;
  path: string;
  query: URLSearchParams;
  headers: Headers;
  credentials: RequestCredentials | undefined;
  body: unknown;
}

export interface MockReply {
  status?: number;
  body?: unknown;
  /** Raw text instead of JSON, e.g. a proxy's HTML error page. */
  text?: string;
}

export type MockHandler = MockReply | ((request: RecordedRequest, calls: number) => MockReply | Promise<MockReply>);

export interface MockApi {
  requests: RecordedRequest[];
  /** Requests to one `METHOD /path`. */
  to: (route: string) => RecordedRequest[];
  /** Adds or replaces handlers mid-test. */
  set: (routes: Record<string, MockHandler>) => void;
}

let unmatched: string[] = [];
afterEach(() => {
  const missed = unmatched;
  unmatched = [];
  if (missed.length > 0) throw new Error(`Requests with no mock: ${missed.join(', ')}`);
});

/** Replaces global fetch for this test; unmocked requests answer 501 and fail the test afterwards. */
export function mockApi(routes: Record<string, MockHandler>): MockApi {
  const table = new Map(Object.entries(routes));
  const counts = new Map<string, number>();
  const requests: RecordedRequest[] = [];

  const fetchMock = vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const url = new URL(String(input), 'http://localhost');
    const method = (init.method ?? 'GET').toUpperCase();
    const request: RecordedRequest = {
      method,
      path: url.pathname,
      query: url.searchParams,
      headers: new Headers(init.headers),
      credentials: init.credentials,
      body: typeof init.body === 'string' ? JSON.parse(init.body) : undefined,
    };
    requests.push(request);
    const key = `${method} ${url.pathname}`;
    const handler = table.get(key);
    if (!handler) {
      unmatched.push(key);
      return json(501, { error: { code: 'unmocked', message: `No mock for ${key}` } });
    }
    const n = (counts.get(key) ?? 0) + 1;
    counts.set(key, n);
    const reply = typeof handler === 'function' ? await handler(request, n) : handler;
    if (reply.text !== undefined) return new Response(reply.text, { status: reply.status ?? 200, headers: { 'content-type': 'text/html' } });
    return json(reply.status ?? 200, reply.body);
  });
  vi.stubGlobal('fetch', fetchMock);

  return {
    requests,
    to: (route) => {
      const [method, path] = route.split(' ');
      return requests.filter((r) => r.method === method && r.path === path);
    },
    set: (more) => {
      for (const [key, handler] of Object.entries(more)) table.set(key, handler);
    },
  };
}

function json(status: number, body: unknown): Response {
  // 202/204 style answers carry no body.
  const text = body === undefined ? null : JSON.stringify(body);
  return new Response(text, { status, headers: { 'content-type': 'application/json' } });
}

/** The contract's error body. */
export function apiError(status: number, code: string, message: string, fields?: Record<string, string>): MockReply {
  return { status, body: { error: { code, message, ...(fields ? { fields } : {}) } } };
}
