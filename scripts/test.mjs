// `npm test`: the linter, then every suite against a throwaway MariaDB, fake S3 object store and
// headless Chromium it starts itself. Ends with one plain line `N passed, N failed` summing all suites, the lint counted
// as one check. Extra arguments go to vitest (e.g. `npm test -- --project shared`); the lint always runs.
import { spawnSync } from 'node:child_process';
import { rmSync, mkdirSync, readFileSync, existsSync } from 'node:fs';
import { join } from 'node:path';
import { ensureDebianPackages, ensureNodeModules, root, run } from './lib/system.mjs';

ensureNodeModules();
ensureDebianPackages({ mariadbd: 'mariadb-server', chromium: 'chromium', pdftoppm: 'poppler-utils' });

const { removeStrayInstances, startMariaDB } = await import('./lib/mariadb.mjs');
const { databases } = await import('./lib/databases.mjs');
const { startChild, onStop, stopAll, waitForExit } = await import('./lib/processes.mjs');
const { startS3Fake } = await import('./lib/s3-fake.mjs');

const resultsDir = join(root, 'tests', '.results');
const resultsFile = join(resultsDir, 'vitest.json');
const vitestArgs = process.argv.slice(2);
let exitCode = 1;
const lint = runLint();
try {
  // Throwaway: a fresh data directory every run, so no state leaks between runs.
  const dir = join(root, databases.test.dir);
  rmSync(dir, { recursive: true, force: true });
  const db = await startMariaDB({ ...databases.test, dir });
  onStop(() => db.stop());

  // The browser suite gets a database of its own, so the demo seed never meets other suites' rows.
  const e2eDatabase = `${databases.test.database}_e2e`;
  db.sql(`CREATE DATABASE \`${e2eDatabase}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
    GRANT ALL PRIVILEGES ON \`${e2eDatabase}\`.* TO '${databases.test.user}'@'127.0.0.1';`);

  // A throwaway fake S3 object store on a free loopback port (SHEDWRIGHT_TEST_S3_PORT to fix one).
  const s3Dir = join(root, `${databases.test.dir}-s3`);
  rmSync(s3Dir, { recursive: true, force: true });
  const s3 = await startS3Fake({ port: Number(process.env.SHEDWRIGHT_TEST_S3_PORT ?? 0), dir: s3Dir, bucket: 'shedwright-test' });
  onStop(() => s3.stop());

  rmSync(resultsDir, { recursive: true, force: true });
  mkdirSync(resultsDir, { recursive: true });
  const env = { ...process.env, ...db.env, ...s3.env, SHEDWRIGHT_TEST: '1', SHEDWRIGHT_E2E_DB_NAME: e2eDatabase, SHEDWRIGHT_STATIC_DIR: join(root, 'dist') };

  // The browser suite serves the built client.
  run(join(root, 'node_modules/.bin/vite'), ['build', '--logLevel', 'warn'], { env });

  const vitest = startChild(join(root, 'node_modules/.bin/vitest'),
    ['run', '--reporter=default', '--reporter=json', `--outputFile.json=${resultsFile}`, ...vitestArgs],
    { env, cwd: root });
  const code = await waitForExit(vitest);
  for (const dir of await removeStrayInstances(join(root, '.data'), 'restore-test-')) {
    console.log(`Stopped a MariaDB that a test started and did not stop (its worker died?): ${dir}`);
  }
  const suites = countResults(code);
  const passed = suites.passed + lint.passed;
  const failed = suites.failed + lint.failed;
  exitCode = code !== 0 || failed > 0 ? 1 : 0;
  await stopAll();
  console.log(`${passed} passed, ${failed} failed`);
} catch (err) {
  console.error(`npm test could not run: ${err.stack ?? err}`);
  await stopAll();
  console.log(`${lint.passed} passed, ${lint.failed + 1} failed`);
}
process.exit(exitCode);

/**
 * ESLint over the whole repository (eslint.config.js), no warning allowed. A problem fails the run but
 * the suites still run, so one report shows everything that is wrong.
 */
function runLint() {
  console.log('Lint (eslint.config.js) …');
  const r = spawnSync(join(root, 'node_modules/.bin/eslint'), ['.', '--max-warnings', '0'], { stdio: 'inherit', cwd: root });
  const clean = r.status === 0;
  console.log(clean ? 'Lint: no problems.' : 'Lint: FAILED (problems above).');
  return { passed: clean ? 1 : 0, failed: clean ? 0 : 1 };
}

/** Sums vitest's JSON report; a file that failed to load counts as one failure. */
function countResults(code) {
  if (!existsSync(resultsFile)) return { passed: 0, failed: Math.max(1, code) };
  const report = JSON.parse(readFileSync(resultsFile, 'utf8'));
  const brokenFiles = report.testResults.filter((f) => f.status === 'failed' && f.assertionResults.length === 0).length;
  return { passed: report.numPassedTests, failed: report.numFailedTests + brokenFiles };
}
