/*
 * `npm run load`: the real server process over a MariaDB of its own, under mixed traffic from many
 * signed-in weavers at once (tests/bench/load-mix.ts), then a check that no acknowledged save was lost.
 *
 * It starts a private MariaDB in .data/load-db on a free port (never the app's or the test
 * instance), runs the migrations and the demo seed as `npm start` does, adds one weaver per
 * connection with a draft of realistic size (the demo's 440-end × 560-pick, 8-shaft double-weave
 * table mat), starts `server/index.ts`, signs everyone in over HTTP and runs the mix. It prints
 * requests/s, p50/p95/p99 per route and the error count, checks every acknowledged save against the
 * draft histories, and exits non-zero on an error or a lost save. Everything it started is stopped
 * on the way out, whatever happened.
 *
 * Options: --seconds=60 --connections=100 (or LOAD_SECONDS, LOAD_CONNECTIONS).
 */
import { rmSync } from 'node:fs';
import { join } from 'node:path';
import type { Sequelize } from 'sequelize';
import { startMariaDB, type MariaDB } from '../../scripts/lib/mariadb.mjs';
import { startS3Fake, type S3Fake } from '../../scripts/lib/s3-fake.mjs';
import { loadConfig } from '../../server/config';
import { doubleWeaveTableMat } from '../../server/db/seeders/demo-drafts';
import { createSequelize } from '../../server/db/sequelize';
import { defineModels } from '../../server/models';
import { createDraft, draftStats } from '../../server/services/drafts';
import { hashPassword } from '../../server/services/passwords';
import { freePort, startAppServer, type AppServer } from '../helpers/e2e';
import { availableRoutes, findLostSaves, formatFigures, routeNames, runMixedLoad, signInAll, type Weaver } from './load-mix';

const option = (name: string, envName: string, fallback: number) => {
  const raw = process.argv.find((a) => a.startsWith(`--${name}=`))?.split('=')[1] ?? process.env[envName];
  const value = raw === undefined || raw === '' ? fallback : Number(raw);
  if (!Number.isInteger(value) || value < 1) throw new Error(`--${name} (${envName}) must be a whole number above 0, got "${raw}"`);
  return value;
};
const SECONDS = option('seconds', 'LOAD_SECONDS', 60);
const CONNECTIONS = option('connections', 'LOAD_CONNECTIONS', 100);
const PASSWORD = 'load-test-password-loom';

const root = new URL('../..', import.meta.url).pathname;
const dir = join(root, '.data', 'load-db');
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const log = (text: string) => console.log(`[load] ${text}`);

let db: MariaDB | undefined;
let s3: S3Fake | undefined;
let sequelize: Sequelize | undefined;
let server: AppServer | undefined;

/** Stops the server, the seeding connection, MariaDB and the object store, and removes their data. */
async function stopEverything() {
  await server?.stop();
  await sequelize?.close().catch(() => undefined);
  await db?.stop();
  await s3?.stop();
  rmSync(dir, { recursive: true, force: true });
}

let stopping: Promise<void> | undefined;
const stopOnce = () => (stopping ??= stopEverything());
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) {
  process.on(signal, () => { void stopOnce().then(() => process.exit(130)); });
}

async function main(): Promise<number> {
  rmSync(dir, { recursive: true, force: true });
  const started = Date.now();
  db = await startMariaDB({ dir, port: await freePort(), database: 'shedwright_load', user: 'shedwright' });
  s3 = await startS3Fake({ port: 0, dir: join(dir, 's3'), bucket: 'shedwright-load' });
  // As `npm start` runs it (migrations, demo seed, server/index.ts), over the load database and object store.
  server = await startAppServer({
    ...db.env,
    ...s3.env,
    SHEDWRIGHT_DEV: '0',
    SHEDWRIGHT_STATIC_DIR: join(dir, 'no-client'),
    // Every weaver signs in from the same loopback address.
    SHEDWRIGHT_SIGNIN_LIMIT: String(CONNECTIONS * 10),
  });
  const { url, env } = server;

  // One password hash for all: hashing is deliberately slow, and the sign-ins below still check it each time.
  sequelize = createSequelize(loadConfig(env).db);
  const models = defineModels(sequelize);
  const passwordHash = await hashPassword(PASSWORD);
  const runId = Date.now().toString(36);
  const users = await models.User.bulkCreate(Array.from({ length: CONNECTIONS }, (_, i) => ({
    email: `load-${runId}-${i}@load.shedwright.test`, name: `Load weaver ${i + 1}`, passwordHash,
  })));
  const document = doubleWeaveTableMat();
  const people = [];
  for (const user of users) {
    const draft = await createDraft(models, { ownerId: user.id, studioId: null, document, tags: ['load'] });
    people.push({ email: user.email, draftId: draft.id, version: draft.version });
  }
  await sequelize.close();
  sequelize = undefined;
  const { ends, picks, shafts } = draftStats(document);
  log(`${CONNECTIONS} weavers with a ${ends}-end × ${picks}-pick, ${shafts}-shaft draft each, `
    + `${(JSON.stringify(document).length / 1024).toFixed(0)} kB of JSON per save`);

  const signInStarted = Date.now();
  const weavers: Weaver[] = await signInAll(url, people, PASSWORD);
  log(`${weavers.length} weavers signed in (${((Date.now() - signInStarted) / 1000).toFixed(1)} s); setup took `
    + `${((Date.now() - started) / 1000).toFixed(1)} s`);

  const routes = availableRoutes();
  const missing = routeNames.filter((r) => !routes.includes(r));
  if (missing.length > 0) log(`not in the route table, left out of the mix: ${missing.join(', ')}`);
  log(`running ${CONNECTIONS} connections for ${SECONDS} s: ${routes.join(', ')}`);
  const result = await runMixedLoad({ base: url, weavers, seconds: SECONDS, document, routes });
  console.log(formatFigures(result));

  // Let requests the load left running finish before looking at the histories.
  await sleep(2000);
  const { checked, lost } = await findLostSaves(url, weavers, result.saves);
  log(`no lost saves: ${checked} acknowledged saves checked on ${new Set(result.saves.map((s) => s.draftId)).size} drafts, ${lost.length} lost`);
  for (const line of lost.slice(0, 20)) console.log(`  LOST ${line}`);
  const failed = result.errors > 0 || lost.length > 0;
  log(failed ? 'FAILED' : 'passed: no errors, no lost saves');
  return failed ? 1 : 0;
}

let code = 1;
try {
  code = await main();
} catch (err) {
  console.error(err);
} finally {
  await stopOnce();
}
process.exit(code);
