// Floors for the drafts load test's save (drafts-load.ts --server=express|node): a save's own work and
// nothing else, to show how much of the app's time per save goes to the framework around it.
import http from 'node:http';
import express from 'express';
import mariadb from 'mariadb';
import { parseDraft } from '../../shared/weave';
import type { Config } from '../../server/config';
import { derivedColumns } from '../../server/services/draft-derived';

type Floor = 'express' | 'node';

/**
 * A server that answers PUT /api/drafts/:id as the app's save does at its core: parse the body and
 * the draft, compute the derived columns, call the save_draft_version procedure (through the mariadb
 * driver) and answer the new version. No session, sign-in, CSRF check, security headers, request
 * validation or ORM. `express` runs it in a bare Express app (express.json and one route), `node` in
 * a bare node:http server.
 */
export function floorServer(kind: Floor, config: Config): http.Server {
  const { db } = config;
  const pool = mariadb.createPool({ host: db.host, port: db.port, user: db.user, password: db.password, database: db.name, connectionLimit: 10 });
  // The author of each save is the draft's owner, looked up once per draft.
  const owners = new Map<number, number>();
  async function save(id: number, body: { baseVersion: number; message?: string; document: unknown }): Promise<number> {
    if (!owners.has(id)) owners.set(id, (await pool.query('SELECT ownerId FROM drafts WHERE id = ?', [id]))[0].ownerId);
    const document = parseDraft(body.document);
    const { ends, picks, shafts, colors, structure } = derivedColumns(document);
    const rows = await pool.query('CALL save_draft_version(?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)', [
      id, body.baseVersion, JSON.stringify(document), ends, picks, shafts, colors, JSON.stringify(structure), owners.get(id), body.message ?? '', new Date(),
    ]);
    return Number(rows[0][0].version);
  }
  if (kind === 'express') {
    const app = express();
    app.use(express.json({ limit: config.bodyLimit }));
    app.put('/api/drafts/:id', async (req, res) => {
      res.json({ version: await save(Number(req.params.id), req.body) });
    });
    return http.createServer(app);
  }
  return http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', async () => {
      const version = await save(Number(req.url!.split('/').pop()), JSON.parse(Buffer.concat(chunks).toString()));
      res.setHeader('content-type', 'application/json');
      res.end(JSON.stringify({ version }));
    });
  });
}
