import { z } from 'zod';

const id = z.coerce.number().int().positive().max(2 ** 31 - 1);
export const photoParamsSchema = z.object({ id, photoId: id });

/** Largest photo accepted, in bytes. */
export const PHOTO_MAX_BYTES = 5 * 1024 * 1024;
/** Largest WIF file accepted, in bytes (a 20 000-end file with colours stays well under this). */
export const WIF_MAX_BYTES = 4 * 1024 * 1024;
export const photoTypes = ['image/jpeg', 'image/png', 'image/webp'] as const;

export const photoSchema = z.object({
  id: z.number().int(),
  version: z.number().int(),
  url: z.string(),
  contentType: z.enum(photoTypes),
  bytes: z.number().int(),
  uploaderName: z.string(),
  createdAt: z.string(),
});
export type Photo = z.infer<typeof photoSchema>;
export const photoListResponseSchema = z.object({ photos: z.array(photoSchema) });
export const photoResponseSchema = z.object({ photo: photoSchema });

/** Text fields that come with the WIF file in the multipart form. */
export const importWifFieldsSchema = z.object({ studioId: z.coerce.number().int().positive().optional() });
