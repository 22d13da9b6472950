// The ports `npm start` listens on, each a setting: a port named in the environment must be free; a
// default that is taken gives way to the next free one, and the start says so.
import { createServer } from 'node:net';

/** True when nothing listens on host:port (by listening there for a moment). */
export function isFree(port, host = '127.0.0.1') {
  return new Promise((resolve) => {
    const probe = createServer();
    probe.once('error', () => resolve(false));
    probe.listen(port, host, () => probe.close(() => resolve(true)));
  });
}

/**
 * One port per entry `{ variable, fallback, what }`, in order, none used twice. A port set through
 * its variable is taken as it is, and an error names the variable when it is busy; a default that is
 * busy moves to the next free port, with a line saying which and how to choose another.
 */
export async function choosePorts(entries, env = process.env, host = '127.0.0.1') {
  const chosen = {};
  const used = new Set();
  for (const { variable, fallback, what } of entries) {
    const given = env[variable];
    if (given !== undefined && given !== '') {
      const port = Number(given);
      if (!(await isFree(port, host)) || used.has(port)) {
        throw new Error(`port ${port} (${what}) is taken; set ${variable} to a free port`);
      }
      chosen[variable] = port;
      used.add(port);
      continue;
    }
    let port = fallback;
    while (used.has(port) || !(await isFree(port, host))) port += 1;
    if (port !== fallback) console.log(`Port ${fallback} (${what}) is taken; using ${port}. Set ${variable} to choose another.`);
    chosen[variable] = port;
    used.add(port);
  }
  return chosen;
}
