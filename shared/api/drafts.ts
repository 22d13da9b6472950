import { z } from 'zod';
import { STARTING_STRUCTURES } from '../weave/starting-draft';
import { PROFILE_UNIT_IDS } from '../weave/types';
import { studioRoleSchema } from './auth';

export const draftSorts = ['updated', 'name', 'size'] as const;
export const DRAFTS_MAX_PAGE_SIZE = 100;

const positiveInt = z.coerce.number().int().positive();

export const draftListQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  tag: z.string().trim().max(50).optional(),
  /** A structure the server found in the draft (STRUCTURE_TAGS), e.g. "twill". */
  structure: z.string().trim().max(50).optional(),
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
  /** Computed from the document when saved (plain weave, twill, double weave, …); the weaver's own words are in `tags`. */
  structure: z.array(z.string()),
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

const draftName = z.string().trim().min(1).max(200);
const tagList = z.array(z.string().trim().min(1).max(50)).max(20);

/**
 * What a new draft starts with when it is made from the New draft form: the loom (shafts, and
 * treadles with a tie-up, or 0 treadles for a lift plan), ends and picks, and a starting structure.
 * Only the types are checked here; the engine checks the values and its 422 names the field
 * (`start.shafts`, …) with the reason.
 */
export const startingDraftSchema = z.object({
  shafts: z.number(),
  treadles: z.number(),
  ends: z.number(),
  picks: z.number(),
  structure: z.enum(STARTING_STRUCTURES),
  /** The unit of a block design. */
  unit: z.enum(PROFILE_UNIT_IDS).optional(),
});
export type StartingDraftBody = z.infer<typeof startingDraftSchema>;

/**
 * POST /api/drafts: a new draft, personal unless a studio is named, from its whole `document` (422
 * without one, or with no ends or picks) or from `start`, the choices of the New draft form.
 */
export const createDraftBodySchema = z.object({
  name: draftName,
  document: z.unknown().optional(),
  start: startingDraftSchema.optional(),
  studioId: z.number().int().positive().optional(),
  tags: tagList.optional(),
});
export type CreateDraftBody = z.infer<typeof createDraftBodySchema>;
export const draftCreatedResponseSchema = z.object({ draft: draftSummarySchema });

/**
 * PATCH /api/drafts/:id: a draft's details, no new version. A new name reaches the library and the
 * stored document; `studioId` moves the draft into a studio (editor or owner there), and `null` takes
 * it back into its author's own drafts.
 */
export const updateDraftBodySchema = z.object({ name: draftName.optional(), tags: tagList.optional(), studioId: z.number().int().positive().nullable().optional() })
  .refine((b) => b.name !== undefined || b.tags !== undefined || b.studioId !== undefined, { error: 'Give a name, tags or a studio' });
export type UpdateDraftBody = z.infer<typeof updateDraftBodySchema>;

/** GET /api/bin: drafts the caller deleted (or could have: her own, and those of studios she owns), newest first. */
export const binItemSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  studioName: z.string().nullable(),
  binnedAt: z.string(),
  /** When it goes for good. */
  purgeAt: z.string(),
});
export type BinItem = z.infer<typeof binItemSchema>;
export const binResponseSchema = z.object({ drafts: z.array(binItemSchema) });
export type BinResponse = z.infer<typeof binResponseSchema>;

/**
 * PUT /api/drafts/:id: save the document on top of `baseVersion`, the version the client last had.
 * Without `named` it is an autosave: it carries the sitting's working version forward (the same
 * weaver, saving within SITTING_MINUTES of the last save, no named version in between) or starts
 * one. `named: true` ("Save version", with an optional message) makes a named version and ends the
 * sitting. Either way the answer's `version` is the base of the next save; a stale base gets 409.
 */
export const saveDraftBodySchema = z.object({
  document: z.unknown(),
  baseVersion: z.number().int().positive(),
  message: z.string().trim().max(500).optional(),
  named: z.boolean().optional(),
});
export type SaveDraftBody = z.infer<typeof saveDraftBodySchema>;
export const saveDraftResponseSchema = z.object({ version: z.number().int() });
/** How long after a weaver's last autosave the next one still continues the same working version. */
export const SITTING_MINUTES = 30;

/** The 409 answer to a save based on an old version: what the server holds now. */
export const saveConflictSchema = z.object({
  error: z.object({ code: z.literal('conflict'), message: z.string() }),
  current: z.object({ version: z.number().int(), document: z.unknown() }),
});
export type SaveConflict = z.infer<typeof saveConflictSchema>;
