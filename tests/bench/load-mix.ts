/*
 * Mixed API traffic for the load check (`npm run load`) and its quick form in `npm test`
 * (tests/server/load-smoke.test.ts): many signed-in weavers at once, each on its own connection with
 * its own draft, listing, opening, saving, forking and exporting. Every save carries the version the
 * weaver last saw, so a 409 means the server lost track (or a save whose answer never came
 * committed); afterwards every acknowledged save is looked up in the draft's history.
 */
import autocannon from 'autocannon';
import { routeTable } from '../../server/routes';
import type { Draft } from '../../shared/weave';

/** A weaver signed in over HTTP: the session cookie and the CSRF token that goes with it. */
export interface Session {
  cookie: string;
  csrf: string;
}

/** One simulated person: their session and the draft only they save to. */
export interface Weaver extends Session {
  draftId: number;
  /** The draft's version when the traffic starts. */
  version: number;
}

const cookiesOf = (res: Response) => res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');

/** Signs in as a browser would: a CSRF token first, then the sign-in, keeping the new session's cookie and token. */
export async function signIn(base: string, email: string, password: string): Promise<Session> {
  const first = await fetch(`${base}/api/csrf`);
  const { token } = await first.json() as { token: string };
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-csrf-token': token, cookie: cookiesOf(first) },
    body: JSON.stringify({ email, password }),
  });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${await res.text()}`);
  const { csrfToken } = await res.json() as { csrfToken: string };
  return { cookie: cookiesOf(res), csrf: csrfToken };
}

/** Signs many weavers in, a few at a time: each sign-in is a deliberately slow password check. */
export async function signInAll<T extends { email: string }>(base: string, people: T[], password: string, parallel = 4) {
  const sessions: (T & Session)[] = [];
  for (let i = 0; i < people.length; i += parallel) {
    const batch = people.slice(i, i + parallel);
    sessions.push(...await Promise.all(batch.map(async (p) => ({ ...p, ...await signIn(base, p.email, password) }))));
  }
  return sessions;
}

export const routeNames = ['list', 'open', 'save', 'fork', 'export.wif', 'export.json', 'print.pdf'] as const;
export type RouteName = (typeof routeNames)[number];

interface RouteCall {
  method: 'GET' | 'POST' | 'PUT';
  /** The route as the table declares it, so a route that is not there is left out of the mix. */
  declared: string;
  path: (draftId: number) => string;
  success: number;
}

const calls: Record<RouteName, RouteCall> = {
  list: { method: 'GET', declared: 'GET /api/drafts', path: () => '/api/drafts?page=1&pageSize=20', success: 200 },
  open: { method: 'GET', declared: 'GET /api/drafts/:id', path: (id) => `/api/drafts/${id}`, success: 200 },
  save: { method: 'PUT', declared: 'PUT /api/drafts/:id', path: (id) => `/api/drafts/${id}`, success: 200 },
  fork: { method: 'POST', declared: 'POST /api/drafts/:id/fork', path: (id) => `/api/drafts/${id}/fork`, success: 201 },
  'export.wif': { method: 'GET', declared: 'GET /api/drafts/:id/export.wif', path: (id) => `/api/drafts/${id}/export.wif`, success: 200 },
  'export.json': { method: 'GET', declared: 'GET /api/drafts/:id/export.json', path: (id) => `/api/drafts/${id}/export.json`, success: 200 },
  'print.pdf': {
    method: 'GET', declared: 'GET /api/drafts/:id/print.pdf', path: (id) => `/api/drafts/${id}/print.pdf?paper=a4&lists=threading`, success: 200,
  },
};

/** The routes of the mix that the server's route table declares. */
export function availableRoutes(): RouteName[] {
  const declared = new Set(routeTable.map((r) => `${r.method.toUpperCase()} ${r.path}`));
  return routeNames.filter((name) => declared.has(calls[name].declared));
}

/**
 * One weaver's round of 20 requests: saves are the most common thing an editor does (autosave),
 * then opening and listing, then exports; a fork now and then. Every `printEvery`-th weaver prints
 * once a round instead of one of its opens, so printing stays light.
 */
function roundFor(index: number, routes: RouteName[], printEvery: number): RouteName[] {
  const round: RouteName[] = ['open', 'save', 'list', 'save', 'export.json', 'open', 'save', 'list', 'export.wif', 'save',
    'open', 'save', 'fork', 'list', 'save', 'export.json', 'open', 'save', 'export.wif', 'list'];
  if (printEvery > 0 && index % printEvery === 0) round[10] = 'print.pdf';
  const kept = round.filter((r) => routes.includes(r));
  // Start each weaver at a different point, so the routes are mixed at every moment, not in waves.
  const start = index % kept.length;
  return [...kept.slice(start), ...kept.slice(0, start)];
}

/** A save the server answered 200: this version of this draft holds the document marked `marker`. */
export interface AcknowledgedSave {
  draftId: number;
  version: number;
  marker: string;
}

export interface RouteFigures {
  route: RouteName;
  requests: number;
  /** Answers that were not the route's success status (a 409 on a save included). */
  errors: number;
  statuses: Record<number, number>;
  p50: number;
  p95: number;
  p99: number;
}

export interface LoadResult {
  seconds: number;
  connections: number;
  requests: number;
  perSecond: number;
  routes: RouteFigures[];
  /** Wrong statuses, and requests that got no answer (timeouts, broken connections). */
  errors: number;
  unanswered: number;
  saves: AcknowledgedSave[];
}

/** Nearest-rank percentile of sorted values. */
function percentile(sorted: number[], p: number): number {
  return sorted.length === 0 ? NaN : sorted[Math.max(0, Math.ceil((p / 100) * sorted.length) - 1)];
}

/**
 * Runs the mix for `seconds`, one connection per weaver (one autocannon instance each, so every
 * connection keeps its own cookie, draft and version). `document` is what the saves send, with a
 * distinct note per save.
 */
export async function runMixedLoad(options: {
  base: string;
  weavers: Weaver[];
  seconds: number;
  document: Draft;
  routes?: RouteName[];
  /** Every n-th weaver prints once a round; 0 never prints. */
  printEvery?: number;
  /** Seconds before a request without an answer counts as lost. */
  timeout?: number;
}): Promise<LoadResult> {
  const routes = options.routes ?? availableRoutes();
  const times = new Map<RouteName, number[]>(routes.map((r) => [r, []]));
  const statuses = new Map<RouteName, Record<number, number>>(routes.map((r) => [r, {}]));
  const saves: AcknowledgedSave[] = [];
  let unanswered = 0;
  // The note is swapped in as text, so a save costs no JSON.stringify of the whole draft.
  const [head, tail] = JSON.stringify({ ...options.document, notes: '\u0000' }).split('"\\u0000"');

  const instances = options.weavers.map((weaver, index) => {
    const round = roundFor(index, routes, options.printEvery ?? 10);
    let step = 0;
    let version = weaver.version;
    let inFlight: { route: RouteName; marker?: string } | null = null;
    let answered: RouteName | null = null;

    const request: autocannon.Request = {
      setupRequest: (req) => {
        // Building the next request while one is unanswered means it timed out or its connection broke.
        if (inFlight) unanswered += 1;
        const route = round[step++ % round.length];
        const call = calls[route];
        inFlight = { route };
        // autocannon writes Content-Length into the headers it is given: hand it a fresh copy each time,
        // or a GET after a save would announce the save's body length and the server would wait for it.
        const { 'Content-Length': _stale, ...headers } = req.headers ?? {};
        const built: autocannon.Request = { ...req, headers, method: call.method, path: call.path(weaver.draftId), body: undefined };
        if (route === 'save') {
          inFlight.marker = `load weaver ${index} save ${step}`;
          built.body = `{"baseVersion":${version},"message":${JSON.stringify(inFlight.marker)},"document":${head}${JSON.stringify(inFlight.marker)}${tail}}`;
        } else if (route === 'fork') {
          built.body = `{"name":"Load fork ${index}.${step}"}`;
        }
        return built;
      },
      onResponse: (status, body) => {
        if (!inFlight) return;
        const { route, marker } = inFlight;
        inFlight = null;
        answered = route;
        const counts = statuses.get(route)!;
        counts[status] = (counts[status] ?? 0) + 1;
        if (route !== 'save') return;
        if (status === 200) {
          version = (JSON.parse(body) as { version: number }).version;
          saves.push({ draftId: weaver.draftId, version, marker: marker! });
        } else if (status === 409) {
          // A save whose answer was lost may have committed: carry on from what the server holds.
          version = (JSON.parse(body) as { current: { version: number } }).current.version;
        }
      },
    };
    // autocannon 9 takes a timeout in seconds (its README); tests/bench/autocannon.d.ts leaves it out.
    const settings: autocannon.Options & { timeout: number } = {
      url: options.base,
      connections: 1,
      duration: options.seconds,
      timeout: options.timeout ?? 30,
      headers: { cookie: weaver.cookie, 'x-csrf-token': weaver.csrf, 'content-type': 'application/json' },
      requests: [request],
    };
    const instance = autocannon(settings);
    // autocannon reports the latency right after onResponse, for the same answer.
    instance.on('response', (_client: unknown, _status: number, _bytes: number, ms: number) => {
      if (answered) times.get(answered)!.push(ms);
      answered = null;
    });
    return instance;
  });

  await Promise.all(instances);
  const figures = routes.map((route): RouteFigures => {
    const sorted = times.get(route)!.sort((a, b) => a - b);
    const counts = statuses.get(route)!;
    const requests = Object.values(counts).reduce((a, b) => a + b, 0);
    return {
      route,
      requests,
      errors: requests - (counts[calls[route].success] ?? 0),
      statuses: counts,
      p50: percentile(sorted, 50),
      p95: percentile(sorted, 95),
      p99: percentile(sorted, 99),
    };
  });
  const requests = figures.reduce((a, f) => a + f.requests, 0);
  return {
    seconds: options.seconds,
    connections: options.weavers.length,
    requests,
    perSecond: requests / options.seconds,
    routes: figures,
    errors: figures.reduce((a, f) => a + f.errors, 0) + unanswered,
    unanswered,
    saves,
  };
}

/** The figures as a table for the console. */
export function formatFigures(result: LoadResult): string {
  const pad = (v: string | number, n: number) => String(v).padStart(n);
  const ms = (v: number) => (Number.isNaN(v) ? '-' : v.toFixed(0));
  const lines = [
    `${pad('route', 12)} ${pad('requests', 9)} ${pad('req/s', 7)} ${pad('p50 ms', 7)} ${pad('p95 ms', 7)} ${pad('p99 ms', 7)} ${pad('errors', 7)}  statuses`,
    ...result.routes.map((f) => `${pad(f.route, 12)} ${pad(f.requests, 9)} ${pad((f.requests / result.seconds).toFixed(1), 7)} `
      + `${pad(ms(f.p50), 7)} ${pad(ms(f.p95), 7)} ${pad(ms(f.p99), 7)} ${pad(f.errors, 7)}  `
      + Object.entries(f.statuses).map(([s, n]) => `${s}×${n}`).join(' ')),
    `${pad('all', 12)} ${pad(result.requests, 9)} ${pad(result.perSecond.toFixed(1), 7)}`
      + ` — ${result.connections} connections, ${result.seconds} s; errors ${result.errors} (no answer: ${result.unanswered})`,
  ];
  return lines.join('\n');
}

/**
 * Looks every acknowledged save up in its draft's history over the API: some version must hold its
 * number (a working version holds its sitting's run of saves), and a version whose newest save it is
 * must carry the save's message and, for each draft's latest acknowledged save, its note. Returns how many saves were checked and a line for each one that is missing.
 */
export async function findLostSaves(base: string, weavers: Weaver[], saves: AcknowledgedSave[]): Promise<{ checked: number; lost: string[] }> {
  const lost: string[] = [];
  const byDraft = new Map<number, AcknowledgedSave[]>();
  for (const save of saves) byDraft.set(save.draftId, [...(byDraft.get(save.draftId) ?? []), save]);
  const get = async (weaver: Weaver, path: string) => {
    const res = await fetch(`${base}${path}`, { headers: { cookie: weaver.cookie } });
    return { status: res.status, body: await res.json() as Record<string, unknown> };
  };
  for (const weaver of weavers) {
    const acknowledged = byDraft.get(weaver.draftId) ?? [];
    if (acknowledged.length === 0) continue;
    const list = await get(weaver, `/api/drafts/${weaver.draftId}/versions`);
    if (list.status !== 200) throw new Error(`the history of draft ${weaver.draftId} did not load: ${list.status}`);
    const history = list.body.versions as { version: number; firstVersion: number; message: string }[];
    for (const save of acknowledged) {
      const row = history.find((v) => v.firstVersion <= save.version && save.version <= v.version);
      if (!row || (row.version === save.version && row.message !== save.marker)) {
        lost.push(`draft ${save.draftId} version ${save.version}: expected "${save.marker}", history has "${row?.message ?? 'nothing'}"`);
      }
    }
    // The last acknowledged save's document, unless a save made on top of it (whose answer the run did not wait for) carried it on.
    const last = acknowledged.reduce((a, b) => (b.version > a.version ? b : a));
    const latest = await get(weaver, `/api/drafts/${weaver.draftId}/versions/${last.version}`);
    const found = latest.body.version as { version: number; document: { notes?: string } } | undefined;
    if (!found || (found.version === last.version && found.document.notes !== last.marker)) {
      lost.push(`draft ${last.draftId} version ${last.version}: the document saved is not there (${latest.status})`);
    }
  }
  return { checked: saves.length, lost };
}
