import { randomBytes } from 'node:crypto';
import { request as httpRequest } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config';
import { pointTwillScarf } from '../../server/db/seeders/demo-drafts';
import { createSequelize } from '../../server/db/sequelize';
import { defineModels, type Models } from '../../server/models';
import { createAccount } from '../../server/services/auth';
import { toWif } from '../../shared/weave';
import { startAppServer, type AppServer } from '../helpers/e2e';
import { HttpClient } from '../helpers/http-client';

/**
 * SIGTERM while saves, a WIF import and a print are in flight, against a real server process: each
 * request either completes with its answer or never committed, and every acknowledged save is in the
 * history afterwards. The saves and the import have sent their headers and half their bodies when the
 * signal comes (so the server is reading them), and the rest after it.
 */
let app: AppServer;
let sequelize: ReturnType<typeof createSequelize>;
let models: Models;

beforeAll(async () => {
  app = await startAppServer();
  // The server's own database (startAppServer's), read directly afterwards.
  sequelize = createSequelize(loadConfig(app.env).db);
  models = defineModels(sequelize);
}, 120_000);
afterAll(async () => {
  await app?.stop();
  await sequelize?.close();
});

type Outcome = { status: number; body: Buffer } | { error: string };

/** A request whose headers and first half of the body go now; `finish()` sends the rest. */
function halfSent(path: string, method: string, headers: Record<string, string>, body: Buffer) {
  const { port } = new URL(app.url);
  const req = httpRequest({ host: '127.0.0.1', port, method, path, agent: false, headers: { ...headers, 'content-length': String(body.length) } });
  const outcome = new Promise<Outcome>((resolve) => {
    req.on('response', (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, body: Buffer.concat(chunks) }));
      res.on('error', (err) => resolve({ error: err.message }));
    });
    req.on('error', (err) => resolve({ error: err.message }));
  });
  const half = Math.floor(body.length / 2);
  req.write(body.subarray(0, half));
  return { outcome, finish: () => req.end(body.subarray(half)) };
}

describe('a clean stop', () => {
  it('lets saves, an import and a print in flight at SIGTERM finish or never commit; every acknowledged save is in the history', async () => {
    const client = new HttpClient();
    const email = `stop-${randomBytes(4).toString('hex')}@test.shedwright.test`;
    await createAccount(models, { email, name: 'Weaver at closing time', password: 'closing-time-password-7' });
    const signIn = await client.post(app.url, '/api/auth/sign-in', { email, password: 'closing-time-password-7' });
    expect(signIn.status, JSON.stringify(signIn.body)).toBe(200);
    const ids: number[] = [];
    for (let i = 0; i < 6; i++) {
      const created = await client.post(app.url, '/api/drafts', { name: `Before the stop ${i}`, document: pointTwillScarf() });
      expect(created.status).toBe(201);
      ids.push((created.body.draft as { id: number }).id);
    }
    const headers = { cookie: client.cookie!, 'x-csrf-token': client.token! };

    const saves = ids.map((id, i) => halfSent(`/api/drafts/${id}`, 'PUT', { ...headers, 'content-type': 'application/json' },
      Buffer.from(JSON.stringify({ document: { ...pointTwillScarf(), name: `Saved at the stop ${i}` }, baseVersion: 1 }))));
    const importName = `Imported at the stop ${randomBytes(3).toString('hex')}`;
    const boundary = `----stop${randomBytes(8).toString('hex')}`;
    const multipart = Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="stop.wif"\r\n`
      + `Content-Type: text/plain\r\n\r\n${toWif({ ...pointTwillScarf(), name: importName })}\r\n--${boundary}--\r\n`);
    const imported = halfSent('/api/drafts/import-wif', 'POST', { ...headers, 'content-type': `multipart/form-data; boundary=${boundary}` }, multipart);
    // Give the server time to read the headers of every request before the signal.
    await new Promise((resolve) => setTimeout(resolve, 1000));
    const print = halfSent(`/api/drafts/${ids[0]}/print.pdf`, 'GET', headers, Buffer.alloc(0));
    print.finish();

    const exited = new Promise<number | null>((resolve) => {
      const timer = setInterval(() => {
        try {
          process.kill(app.pid, 0);
        } catch {
          clearInterval(timer);
          resolve(null);
        }
      }, 50);
    });
    process.kill(app.pid, 'SIGTERM');
    for (const request of [...saves, imported]) request.finish();
    const saveOutcomes = await Promise.all(saves.map((s) => s.outcome));
    const importOutcome = await imported.outcome;
    const printOutcome = await print.outcome;
    await exited;

    // Each save: answered 200 with its version and in the history, or never committed.
    let acknowledged = 0;
    for (const [i, outcome] of saveOutcomes.entries()) {
      const draft = await models.Draft.findByPk(ids[i]);
      const history = await models.DraftVersion.findAll({ where: { draftId: ids[i] }, order: [['version', 'ASC']] });
      if ('status' in outcome && outcome.status === 200) {
        acknowledged += 1;
        expect(JSON.parse(outcome.body.toString('utf8'))).toEqual({ version: 2 });
        expect(draft!.version).toBe(2);
        expect(history.map((v) => [v.version, (v.document as { name: string }).name])).toEqual([[1, `Before the stop ${i}`], [2, `Saved at the stop ${i}`]]);
      } else {
        expect(draft!.version, `save ${i} was not answered (${JSON.stringify(outcome)}) but committed`).toBe(1);
        expect(history.map((v) => v.version)).toEqual([1]);
      }
    }
    // The signal came while the saves were being read: a clean stop finishes them.
    expect(acknowledged).toBeGreaterThan(0);

    const importedRows = await models.Draft.count({ where: { name: importName } });
    if ('status' in importOutcome && importOutcome.status === 201) expect(importedRows).toBe(1);
    else expect(importedRows, `the import was not answered (${JSON.stringify(importOutcome)}) but committed`).toBe(0);

    // A print commits nothing: it either arrives whole or not at all.
    if ('status' in printOutcome && printOutcome.status === 200) expect(printOutcome.body.subarray(0, 5).toString()).toBe('%PDF-');
    console.log(`clean stop: ${acknowledged} of ${saves.length} saves acknowledged, import ${'status' in importOutcome ? importOutcome.status : 'cut'}, `
      + `print ${'status' in printOutcome ? printOutcome.status : 'cut'}`);
  }, 120_000);
});
