import { z } from 'zod';
import { studioRoleSchema } from './auth';

export const draftSorts = ['updated', 'name', 'size'] as const;
export const DRAFTS_MAX_PAGE_SIZE = 100;

const positiveInt = z.coerce.number().int().positive();

export const draftListQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  tag: z.string().trim().max(50).optional(),
  shafts: positiveInt.max(32).optional(),
  studio: positiveInt.optional(),
  sort: z.enum(draftSorts).default('updated'),
  dir: z.enum(['asc', 'desc']).default('desc'),
  page: positiveInt.default(1),
  pageSize: positiveInt.max(DRAFTS_MAX_PAGE_SIZE).default(20),
});
export type DraftListQuery = z.infer<typeof draftListQuerySchema>;

export const draftSummarySchema = z.object({
  id: z.number().int(),
  name: z.string(),
  ownerName: z.string(),
  studioId: z.number().int().nullable(),
  studioName: z.string().nullable(),
  ends: z.number().int(),
  picks: z.number().int(),
  shafts: z.number().int(),
  colors: z.number().int(),
  tags: z.array(z.string()),
  version: z.number().int(),
  updatedAt: z.string(),
  thumbnailUrl: z.string().nullable(),
});
export type DraftSummary = z.infer<typeof draftSummarySchema>;

export const draftListResponseSchema = z.object({
  items: z.array(draftSummarySchema),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type DraftListResponse = z.infer<typeof draftListResponseSchema>;

/** The document is checked by the weave engine's parser, not here, so it stays `unknown` at this layer. */
export const draftDetailSchema = draftSummarySchema.extend({ document: z.unknown(), role: studioRoleSchema });
export type DraftDetail = z.infer<typeof draftDetailSchema>;
export const draftDetailResponseSchema = z.object({ draft: draftDetailSchema });
