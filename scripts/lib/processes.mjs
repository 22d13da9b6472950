// Child processes the scripts start, stopped together on exit, Ctrl-C or failure.
import { spawn } from 'node:child_process';

const children = new Set();
const cleanups = [];
let stopping = null;

/** Spawns a long-lived child (no npm/npx wrapper, so its pid is the real server's). */
export function startChild(cmd, args, options = {}) {
  const child = spawn(cmd, args, { stdio: 'inherit', ...options });
  children.add(child);
  child.on('exit', () => children.delete(child));
  return child;
}

/** Registers work to run when everything stops (e.g. shutting MariaDB down). */
export function onStop(fn) {
  cleanups.push(fn);
}

export function stopAll() {
  stopping ??= (async () => {
    for (const child of children) child.kill('SIGTERM');
    const deadline = Date.now() + 10_000;
    while (children.size > 0 && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
    for (const child of children) child.kill('SIGKILL');
    for (const fn of cleanups.reverse()) {
      try { await fn(); } catch (err) { console.error(err); }
    }
  })();
  return stopping;
}

// A signal to this process alone (not only Ctrl-C, which reaches the whole group) stops every child
// and service it started, then says so.
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP']) {
  process.on(signal, () => {
    stopAll().then(() => {
      console.log('stopped');
      process.exit(130);
    });
  });
}

export function waitForExit(child) {
  return new Promise((resolve) => child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0))));
}

/** Polls a URL until it answers (any HTTP status) or the child dies. */
export async function waitForHttp(url, child, timeoutMs = 60_000) {
  const started = Date.now();
  for (;;) {
    if (child.exitCode !== null) throw new Error(`server exited with ${child.exitCode} before answering`);
    try {
      await fetch(url);
      return;
    } catch {
      if (Date.now() - started > timeoutMs) throw new Error(`${url} did not answer within ${timeoutMs / 1000} s`);
      await new Promise((r) => setTimeout(r, 200));
    }
  }
}
