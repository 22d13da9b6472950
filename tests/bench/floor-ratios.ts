/*
 * The drafts service's speed as ratios to its floor, in one run: `npx tsx tests/bench/floor-ratios.ts`
 * with the test database up. Runs drafts-load.ts against the app, then against the bare Express floor
 * (save-floors.ts: the same database work for the library's first page and a 400 × 400 save, without
 * sessions, validation or the ORM), and prints the app's requests per second as a share of the
 * floor's. Ratios, not milliseconds: both sides share the machine, so its load cancels out.
 * Options are passed on to drafts-load.ts (--duration=, --connections=).
 */
import { spawnSync } from 'node:child_process';

const passOn = process.argv.slice(2);
function measure(server: 'app' | 'express'): Record<string, number> {
  const script = new URL('./drafts-load.ts', import.meta.url).pathname;
  const result = spawnSync(process.execPath, ['--import', 'tsx', script, `--server=${server}`, ...passOn], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'inherit'] });
  process.stdout.write(result.stdout);
  const line = /^FIGURES (.*)$/m.exec(result.stdout);
  if (result.status !== 0 || !line) throw new Error(`drafts-load.ts --server=${server} failed (exit ${result.status})`);
  return JSON.parse(line[1]) as Record<string, number>;
}

const app = measure('app');
const floor = measure('express');
console.log('\nThe app as a share of the bare Express floor (requests per second):');
for (const run of ['list', 'save']) {
  console.log(`  ${run}: app ${app[run].toFixed(0)}/s, floor ${floor[run].toFixed(0)}/s, ratio ${(app[run] / floor[run]).toFixed(2)}`);
}
