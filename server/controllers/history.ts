import type { CompareQuery } from '../../shared/api';
import type { Ctx } from '../http/handler';
import { compareVersions, comparePng, getVersion, listVersions, restoreVersion, versionThumbnail } from '../services/draft-versions';

type Id = { id: number };
type Version = { id: number; n: number };

export async function versions({ app, res, params }: Ctx<unknown, unknown, Id>) {
  res.json({ versions: await listVersions(app.models, params.id) });
}

export async function version({ app, res, params }: Ctx<unknown, unknown, Version>) {
  res.json(await getVersion(app.models, params.id, params.n));
}

export async function restore({ app, req, res, params }: Ctx<unknown, unknown, Version>) {
  res.json(await restoreVersion(app.models, params.id, req.user!.id, params.n));
}

export async function compare({ app, res, params, query }: Ctx<unknown, CompareQuery, Id>) {
  res.json(await compareVersions(app.models, params.id, query.a, query.b));
}

export async function compareImage({ app, res, params, query }: Ctx<unknown, CompareQuery, Id>) {
  // Versions never change, so the picture of two of them never does either.
  res.set('Cache-Control', 'private, max-age=31536000, immutable').type('image/png').send(await comparePng(app.models, params.id, query.a, query.b));
}

export async function thumbnail({ app, res, params }: Ctx<unknown, unknown, Version>) {
  const { png, version } = await versionThumbnail(app.models, params.id, params.n);
  // A version's number moves on with every save it takes in, so what its own number shows never changes;
  // an earlier save number of a working version shows that version as it is now.
  res.set('Cache-Control', version === params.n ? 'private, max-age=31536000, immutable' : 'private, no-cache');
  res.type('image/png').send(png);
}
