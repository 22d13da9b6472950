import { z } from 'zod';

const versionNumber = z.coerce.number().int().positive().max(2 ** 31 - 1);

export const versionParamsSchema = z.object({ id: versionNumber, n: versionNumber });
export const versionQuerySchema = z.object({ version: versionNumber.optional() });

/**
 * One version in a draft's history. A working version is an editing sitting's autosaves, carried
 * forward in one entry: `version` is its newest save, `firstVersion` its first, and any save number
 * from one to the other finds it. A named version was saved on purpose ("Save version", a restore,
 * a new draft or colourway, an import) and is never continued.
 */
export const versionSummarySchema = z.object({
  version: z.number().int(),
  firstVersion: z.number().int(),
  named: z.boolean(),
  authorName: z.string(),
  message: z.string(),
  /** When the version began (its first save). */
  createdAt: z.string(),
  /** When it was last saved: the time to show. */
  savedAt: z.string(),
  /** A small picture of the version's cloth; null when it has no ends or picks. */
  thumbnailUrl: z.string().nullable(),
});
export type VersionSummary = z.infer<typeof versionSummarySchema>;
export const versionListResponseSchema = z.object({ versions: z.array(versionSummarySchema) });
export type VersionListResponse = z.infer<typeof versionListResponseSchema>;

export const versionDetailResponseSchema = z.object({ version: versionSummarySchema.extend({ document: z.unknown() }) });
export type VersionDetailResponse = z.infer<typeof versionDetailResponseSchema>;

export const compareQuerySchema = z.object({ a: versionNumber, b: versionNumber });
export type CompareQuery = z.infer<typeof compareQuerySchema>;

/** What changed from version a to version b; ends and picks are 1-based here, as a weaver counts them. */
/** Threads lined up by content (1-based): inserted and changed numbered in version b, removed in version a. */
const alignmentSchema = z.object({
  inserted: z.array(z.number().int()),
  removed: z.array(z.number().int()),
  changed: z.array(z.number().int()),
});

export const compareResponseSchema = z.object({
  a: z.number().int(),
  b: z.number().int(),
  /** Ends and picks that differ place by place (1-based). */
  ends: z.array(z.number().int()),
  picks: z.array(z.number().int()),
  /** The same, lined up by content: an insertion reads as an insertion. */
  aligned: z.object({ ends: alignmentSchema, picks: alignmentSchema }),
  tieup: z.array(z.object({ treadle: z.number().int(), shaft: z.number().int() })),
  cells: z.number().int(),
  imageUrl: z.string(),
});
export type CompareResponse = z.infer<typeof compareResponseSchema>;

const hexColour = z.string().regex(/^#[0-9a-fA-F]{6}$/, { error: 'must be a colour like "#1a2b3c"' });

/** POST /api/drafts/:id/fork: a copy with its own history, optionally recoloured (one colour per palette entry). */
export const forkBodySchema = z.object({
  version: z.number().int().positive().optional(),
  name: z.string().trim().min(1).max(200),
  palette: z.array(hexColour).min(1).max(1024).optional(),
  studioId: z.number().int().positive().optional(),
});
export type ForkBody = z.infer<typeof forkBodySchema>;

export const lineageDraftSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  ownerName: z.string(),
  /** The version of its parent this draft was forked from (null for the first draft of a line). */
  parentVersion: z.number().int().nullable(),
});
export type LineageDraft = z.infer<typeof lineageDraftSchema>;

/** Ancestors nearest first; only drafts the caller can see are named, the rest are counted. */
export const lineageResponseSchema = z.object({
  draft: lineageDraftSchema,
  ancestors: z.array(lineageDraftSchema),
  hiddenAncestors: z.number().int(),
  children: z.array(lineageDraftSchema),
});
export type LineageResponse = z.infer<typeof lineageResponseSchema>;
