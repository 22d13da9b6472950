import { randomBytes } from 'node:crypto';
import type { Photo } from '../../shared/api';
import { HttpError, notFound } from '../http/errors';
import type { Models } from '../models';
import type { AttachmentRow } from '../models/attachment';
import type { BlobStorage } from '../storage';
import { versionRow } from './draft-documents';

type PhotoType = Photo['contentType'];

/**
 * The image type from the file's first bytes; the name and the type the browser claims are ignored.
 * Signatures from memory, checked against the formats' own documents where noted:
 * - PNG: 89 50 4E 47 0D 0A 1A 0A (PNG specification §5.2, as in server/print/png.ts);
 * - JPEG: FF D8 FF, the start-of-image marker followed by the next marker (ITU-T T.81 Annex B);
 * - WebP: "RIFF", a 4-byte size, then "WEBP" (RFC 9649 §2, the RIFF header).
 */
export function sniffImageType(bytes: Uint8Array): PhotoType | null {
  const at = (offset: number, text: string) => [...text].every((c, i) => bytes[offset + i] === c.charCodeAt(0));
  if (bytes.length >= 8 && [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a].every((b, i) => bytes[i] === b)) return 'image/png';
  if (bytes.length >= 3 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return 'image/jpeg';
  if (bytes.length >= 12 && at(0, 'RIFF') && at(8, 'WEBP')) return 'image/webp';
  return null;
}

const EXTENSION: Record<PhotoType, string> = { 'image/png': 'png', 'image/jpeg': 'jpg', 'image/webp': 'webp' };

function toPhoto(row: AttachmentRow): Photo {
  return {
    id: row.id,
    version: row.version,
    url: `/api/drafts/${row.draftId}/photos/${row.id}`,
    contentType: row.contentType as PhotoType,
    bytes: row.bytes,
    uploaderName: row.uploader?.name ?? '',
    createdAt: row.createdAt.toISOString(),
  };
}

/** Stores a photo of the cloth woven from version `version`; 422 for anything but JPEG, PNG or WebP. */
export async function addPhoto(
  models: Models, storage: BlobStorage, draftId: number, version: number, uploaderId: number, file: Buffer | undefined,
): Promise<Photo> {
  if (!file || file.length === 0) throw new HttpError(400, 'bad_request', 'Choose a photo to add.', { file: 'Choose a photo to add.' });
  const type = sniffImageType(file);
  if (!type) throw new HttpError(422, 'unprocessable', 'The file is not a JPEG, PNG or WebP image', { file: 'use a JPEG, PNG or WebP photo' });
  if (!await versionRow(models, draftId, version, ['id'])) throw notFound(`This draft has no version ${version}`);
  const storageKey = `drafts/${draftId}/${randomBytes(16).toString('hex')}.${EXTENSION[type]}`;
  await storage.put(storageKey, file);
  try {
    const row = await models.Attachment.create({ draftId, version, uploaderId, storageKey, contentType: type, bytes: file.length });
    const uploader = await models.User.findByPk(uploaderId, { attributes: ['name'] });
    return { ...toPhoto(row), uploaderName: uploader?.name ?? '' };
  } catch (err) {
    await storage.delete(storageKey);
    throw err;
  }
}

/** A draft's photos, newest first. */
export async function listPhotos(models: Models, draftId: number): Promise<Photo[]> {
  const rows = await models.Attachment.findAll({
    where: { draftId },
    include: [{ model: models.User, as: 'uploader', attributes: ['name'] }],
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
  });
  return rows.map(toPhoto);
}

/** The bytes and type of one photo of this draft. */
export async function readPhoto(models: Models, storage: BlobStorage, draftId: number, photoId: number) {
  const row = await models.Attachment.findOne({ where: { id: photoId, draftId } });
  const bytes = row && await storage.get(row.storageKey);
  if (!row || !bytes) throw notFound('No such photo');
  return { bytes, contentType: row.contentType };
}
