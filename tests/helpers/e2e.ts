// Drives the built app as a person would: a real server process on a free port over the e2e
// database (migrated and seeded with the demo studio), and Debian's headless Chromium.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { mkdtempSync, mkdirSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';
import { DEMO_PASSWORD } from '../../server/db/demo-accounts';

const root = new URL('../..', import.meta.url).pathname;
export const artifactsDir = join(root, 'tests/e2e/artifacts');

export interface AppServer {
  url: string;
  /** The server's process. */
  pid: number;
  env: NodeJS.ProcessEnv;
  stop(): Promise<void>;
}

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as { port: number };
      srv.close(() => resolve(port));
    });
    srv.on('error', reject);
  });
}

/** Migrates and seeds the e2e database, then starts `server/index.ts` as `npm start` would. */
export async function startAppServer(extraEnv: NodeJS.ProcessEnv = {}): Promise<AppServer> {
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    SHEDWRIGHT_DB_NAME: process.env.SHEDWRIGHT_E2E_DB_NAME ?? process.env.SHEDWRIGHT_DB_NAME,
    SHEDWRIGHT_HOST: '127.0.0.1',
    SHEDWRIGHT_PORT: String(port),
    SHEDWRIGHT_SMTP_PORT: String(await freePort()),
    SHEDWRIGHT_PUBLIC_URL: url,
    SHEDWRIGHT_SESSION_SECRET: 'e2e-session-secret-not-for-production',
    SHEDWRIGHT_STATIC_DIR: join(root, 'dist'),
    SHEDWRIGHT_DEV: '1',
    // Rate-limit counters live in the database every browser test's server shares: keep them out of reach.
    SHEDWRIGHT_SIGNIN_LIMIT: '100000',
    SHEDWRIGHT_ACCOUNT_SIGNIN_LIMIT: '100000',
    SHEDWRIGHT_SIGNUP_LIMIT: '100000',
    SHEDWRIGHT_RESET_LIMIT: '100000',
    ...extraEnv,
  };
  const setup = spawnSync(process.execPath, ['--import', 'tsx', 'server/db/setup.ts'], { cwd: root, env, encoding: 'utf8' });
  if (setup.status !== 0) throw new Error(`setup failed:\n${setup.stdout}\n${setup.stderr}`);

  const child: ChildProcess = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], { cwd: root, env, stdio: ['ignore', 'pipe', 'pipe'] });
  let output = '';
  child.stdout?.on('data', (d) => { output += d; });
  child.stderr?.on('data', (d) => { output += d; });
  const started = Date.now();
  for (;;) {
    if (child.exitCode !== null) throw new Error(`server exited with ${child.exitCode}:\n${output}`);
    try {
      const res = await fetch(`${url}/api/session`);
      if (res.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() - started > 60_000) throw new Error(`server did not answer:\n${output}`);
    await new Promise((r) => setTimeout(r, 200));
  }
  return {
    url,
    pid: child.pid!,
    env,
    async stop() {
      if (child.exitCode !== null) return;
      const exited = new Promise((r) => child.once('exit', r));
      child.kill('SIGTERM');
      await Promise.race([exited, new Promise((r) => setTimeout(r, 10_000))]);
      if (child.exitCode === null) child.kill('SIGKILL');
    },
  };
}

export interface Browser {
  context: BrowserContext;
  page: Page;
  /** Console errors and page errors seen so far (a clean run has none). */
  errors: string[];
  close(): Promise<void>;
}

/** Debian's Chromium, headless, in a fresh profile (see STACK.md "Browser tests"). */
export async function openBrowser(): Promise<Browser> {
  const profile = mkdtempSync(join(tmpdir(), 'shedwright-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1400, height: 900 },
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
      '--disable-component-update', '--disable-sync'],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(String(e)));
  page.on('console', (m) => { if (m.type() === 'error') errors.push(m.text()); });
  return {
    context,
    page,
    errors,
    async close() {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(artifactsDir, { recursive: true });
  const path = join(artifactsDir, `${name}.png`);
  await page.screenshot({ path, fullPage: true });
  return path;
}

/**
 * One served app and one browser for a whole test file, started before its tests and stopped after.
 * Read `app.server` and `app.browser` inside the tests.
 */
export function useAppAndBrowser(): { server: AppServer; browser: Browser } {
  const app = {} as { server: AppServer; browser: Browser };
  beforeAll(async () => {
    app.server = await startAppServer();
    app.browser = await openBrowser();
  });
  afterAll(async () => {
    await app.browser?.close();
    await app.server?.stop();
  });
  return app;
}

/** Signs in through the form as a person would and waits for the drafts library. */
export async function signIn(page: Page, server: AppServer, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/drafts$/);
}

/** What a view's canvases show: a fingerprint of their pixels and how many different colours. */
export interface CanvasLook {
  hash: string;
  colours: number;
}

/** The pixels of every canvas under a test id, as a {@link CanvasLook}. */
export async function canvasLook(page: Page, testId: string): Promise<CanvasLook> {
  return page.evaluate((id) => {
    let h = 2166136261;
    const seen = new Set<number>();
    for (const c of [...document.querySelectorAll(`[data-testid="${id}"] canvas`)] as HTMLCanvasElement[]) {
      const data = c.getContext('2d')!.getImageData(0, 0, c.width, c.height).data;
      for (let i = 0; i < data.length; i += 4) {
        const v = (data[i] << 16) | (data[i + 1] << 8) | data[i + 2];
        seen.add(v);
        h = Math.imul(h ^ v, 16777619) >>> 0;
      }
    }
    return { hash: h.toString(16), colours: seen.size };
  }, testId);
}

/**
 * Waits until the canvases under a test id have shown the same pixels for two seconds (the cloth
 * views repaint once edits pause) and returns what they show. Given `unlike` (a hash), first waits
 * up to 60 s for the pixels to differ from it, so a repaint still to come is not taken for the
 * settled picture on a busy machine.
 */
export async function settledCanvas(page: Page, testId: string, unlike?: string): Promise<CanvasLook> {
  await page.getByTestId(testId).locator('canvas').first().waitFor();
  let last = await canvasLook(page, testId);
  for (const until = Date.now() + 60_000; unlike !== undefined && last.hash === unlike && Date.now() < until; ) {
    await page.waitForTimeout(250);
    last = await canvasLook(page, testId);
  }
  let stableSince = Date.now();
  const deadline = Date.now() + 30_000;
  while (Date.now() < deadline) {
    await page.waitForTimeout(250);
    const next = await canvasLook(page, testId);
    if (next.hash !== last.hash) {
      last = next;
      stableSince = Date.now();
    } else if (Date.now() - stableSince >= 2000) break;
  }
  return last;
}
