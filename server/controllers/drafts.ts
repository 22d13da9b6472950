import type { CreateDraftBody, DraftListQuery, ForkBody, SaveDraftBody, UpdateDraftBody } from '../../shared/api';
import { clothSett } from '../../shared/plan';
import { toWif } from '../../shared/weave';
import type { Ctx } from '../http/handler';
import { versionDocument } from '../services/draft-documents';
import { attachmentDisposition } from '../services/draft-files';
import { parseWifUpload } from '../services/wif-parse';
import { draftThumbnail } from '../services/draft-thumbnails';
import { binContents, binDraft, createFromBody, createFromDocument, forkDraft, lineage, restoreDraft, updateDraft } from '../services/draft-lifecycle';
import { saveDraft, VersionConflict } from '../services/draft-versions';
import { draftDetail, listDraftsJson } from '../services/drafts';
import { getPlan } from '../services/plans';

export async function list({ app, req, res, query }: Ctx<unknown, DraftListQuery, unknown>) {
  res.type('json').send(await listDraftsJson(app.models, req.user!.id, query));
}

export async function detail({ app, res, params, role }: Ctx<unknown, unknown, { id: number }>) {
  res.json({ draft: await draftDetail(app.models, params.id, role!) });
}

export async function create({ app, req, res, body }: Ctx<CreateDraftBody, unknown, unknown>) {
  res.status(201).json({ draft: await createFromBody(app.models, req.user!.id, body) });
}

export async function update({ app, req, res, params, body, role }: Ctx<UpdateDraftBody, unknown, { id: number }>) {
  await updateDraft(app.models, req.user!.id, params.id, body);
  res.json({ draft: await draftDetail(app.models, params.id, role!) });
}

export async function remove({ app, res, params }: Ctx<unknown, unknown, { id: number }>) {
  await binDraft(app.models, params.id);
  res.status(204).end();
}

export async function restore({ app, res, params, role }: Ctx<unknown, unknown, { id: number }>) {
  await restoreDraft(app.models, params.id);
  res.json({ draft: await draftDetail(app.models, params.id, role!) });
}

export async function bin({ app, req, res }: Ctx<unknown, unknown, unknown>) {
  res.json(await binContents(app.models, app.storage, req.user!.id));
}

/** 409 carries the server's version and document beside the error, so the client can offer both. */
export async function save({ app, req, res, params, body }: Ctx<SaveDraftBody, unknown, { id: number }>) {
  try {
    res.json(await saveDraft(app.models, params.id, req.user!.id, body));
  } catch (err) {
    if (!(err instanceof VersionConflict)) throw err;
    res.status(409).json({ error: { code: err.code, message: err.message }, current: err.current });
  }
}

export async function thumbnail({ app, res, params }: Ctx<unknown, unknown, { id: number }>) {
  const png = await draftThumbnail(app.models, params.id);
  // Addresses carry ?v=<version>, so a cached copy is never stale.
  res.set('Cache-Control', 'private, max-age=31536000, immutable').type('image/png').send(png);
}

export async function fork({ app, req, res, params, body }: Ctx<ForkBody, unknown, { id: number }>) {
  res.status(201).json({ draft: await forkDraft(app.models, req.user!.id, params.id, body) });
}

export async function draftLineage({ app, req, res, params }: Ctx<unknown, unknown, { id: number }>) {
  res.json(await lineage(app.models, req.user!.id, params.id));
}

export async function importWif({ app, req, res, body }: Ctx<{ studioId?: number }, unknown, unknown>) {
  const { draft: document, warnings, derived } = await parseWifUpload(req.file);
  const draft = await createFromDocument(app.models, req.user!.id, document, body.studioId, `Imported from ${req.file!.originalname}`, derived);
  res.status(201).json({ draft, warnings });
}

async function exported({ app, res, params, query }: Ctx<unknown, { version?: number }, { id: number }>, format: 'wif' | 'json') {
  const [{ document: stored }, row, saved] = await Promise.all([
    versionDocument(app.models, params.id, query.version),
    app.models.Draft.findByPk(params.id, { attributes: ['name'] }),
    getPlan(app.models, params.id),
  ]);
  // One sett everywhere: with a saved plan, the file carries the plan's sett, as the print and the plan page do.
  const document = saved.plan ? { ...stored, sett: clothSett(stored, saved.plan) } : stored;
  const name = row?.name ?? document.name;
  res.set('Content-Disposition', attachmentDisposition(name, format));
  if (format === 'wif') res.type('text/plain; charset=utf-8').send(toWif(document));
  else res.type('application/json; charset=utf-8').send(`${JSON.stringify(document, null, 2)}\n`);
}

export const exportWif = (ctx: Ctx<unknown, { version?: number }, { id: number }>) => exported(ctx, 'wif');
export const exportJson = (ctx: Ctx<unknown, { version?: number }, { id: number }>) => exported(ctx, 'json');
