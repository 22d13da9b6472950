import type { Ctx } from '../http/handler';
import { addPhoto, listPhotos, readPhoto } from '../services/photos';

export async function upload({ app, req, res, params }: Ctx<unknown, unknown, { id: number; n: number }>) {
  res.status(201).json({ photo: await addPhoto(app.models, app.storage, params.id, params.n, req.user!.id, req.file?.buffer) });
}

export async function list({ app, res, params }: Ctx<unknown, unknown, { id: number }>) {
  res.json({ photos: await listPhotos(app.models, params.id) });
}

export async function bytes({ app, res, params }: Ctx<unknown, unknown, { id: number; photoId: number }>) {
  const photo = await readPhoto(app.models, app.storage, params.id, params.photoId);
  // The type was found from the bytes at upload; nosniff keeps browsers from second-guessing it.
  res.set({ 'Cache-Control': 'private, max-age=86400', 'X-Content-Type-Options': 'nosniff', 'Content-Disposition': 'inline' })
    .type(photo.contentType).send(photo.bytes);
}
