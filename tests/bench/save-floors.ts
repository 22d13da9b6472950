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
 * the draft, compute the derived columns, run the app's save transaction (through the mariadb
 * driver) and answer the new version. No session, sign-in, CSRF check, security headers, request
 * validation or ORM. `express` runs it in a bare Express app (express.json and one route), `node` in
 * a bare node:http server. The Express floor also answers GET /api/drafts?as=<user id> with the
 * library's first page, read with the same SQL as the app's library query.
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
    // The app's save transaction (server/services/draft-versions.ts), statement for statement.
    const version = body.baseVersion + 1;
    const now = new Date();
    const json = JSON.stringify(document);
    const conn = await pool.getConnection();
    try {
      await conn.beginTransaction();
      const moved = await conn.query(
        'UPDATE drafts SET document = ?, version = ?, ends = ?, picks = ?, shafts = ?, colors = ?, structure = ?, thumbnail = NULL, updatedAt = ? WHERE id = ? AND version = ?',
        [json, version, ends, picks, shafts, colors, JSON.stringify(structure), now, id, body.baseVersion],
      );
      if (moved.affectedRows !== 1) {
        await conn.rollback();
        return 0;
      }
      const continued = await conn.query(
        'UPDATE draft_versions SET version = ?, document = ?, savedAt = ?, named = 0 WHERE draftId = ? AND version = ? AND named = 0 AND authorId = ? AND savedAt > ?',
        [version, json, now, id, body.baseVersion, owners.get(id), new Date(now.getTime() - 30 * 60_000)],
      );
      if (continued.affectedRows === 0) {
        await conn.query(
          'INSERT INTO draft_versions (draftId, version, firstVersion, authorId, named, message, document, createdAt, savedAt) VALUES (?, ?, ?, ?, 0, ?, ?, ?, ?)',
          [id, version, version, owners.get(id), body.message ?? '', json, now, now],
        );
      }
      await conn.commit();
      return version;
    } finally {
      conn.release();
    }
  }
  // The library's first page and count, as the app's plain-SQL library query reads them for a weaver in no studio.
  async function listPage(userId: number): Promise<string> {
    const [rows, [{ total }]] = await Promise.all([
      pool.query(`SELECT id, name, studioId, ends, picks, shafts, colors, tags, structure, version, updatedAt,
          (SELECT name FROM users WHERE users.id = drafts.ownerId) AS ownerName,
          (SELECT name FROM studios WHERE studios.id = drafts.studioId) AS studioName
        FROM drafts WHERE ownerId = ? ORDER BY updatedAt DESC, id DESC LIMIT 20 OFFSET 0`, [userId]),
      pool.query('SELECT COUNT(*) AS total FROM drafts WHERE ownerId = ?', [userId]),
    ]);
    return JSON.stringify({ items: rows, total: Number(total), page: 1, pageSize: 20 });
  }
  if (kind === 'express') {
    const app = express();
    app.use(express.json({ limit: config.bodyLimit }));
    app.get('/api/drafts', async (req, res) => {
      res.type('json').send(await listPage(Number(req.query.as)));
    });
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
