import { z } from 'zod';

const hexColour = z.string().regex(/^#[0-9a-fA-F]{6}$/, { error: 'must be a colour like "#1a2b3c"' });

/** A yarn in the weaver's own stash: what it is, its colour, and its grist as written on the label. */
export const yarnBodySchema = z.object({
  name: z.string().trim().min(1).max(100),
  fibre: z.string().trim().max(100).default(''),
  colour: hexColour,
  /** The count as the weaver writes it, e.g. "2/8" (cotton count) or "20/2 Nm". */
  count: z.string().trim().max(50).default(''),
  yardsPerPound: z.number().positive().max(1_000_000).nullable().default(null),
});
export type YarnBody = z.infer<typeof yarnBodySchema>;
export const yarnPatchSchema = z.object({
  name: z.string().trim().min(1).max(100).optional(),
  fibre: z.string().trim().max(100).optional(),
  colour: hexColour.optional(),
  count: z.string().trim().max(50).optional(),
  yardsPerPound: z.number().positive().max(1_000_000).nullable().optional(),
});
export type YarnPatch = z.infer<typeof yarnPatchSchema>;

export const yarnSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  fibre: z.string(),
  colour: z.string(),
  count: z.string(),
  yardsPerPound: z.number().nullable(),
});
export type Yarn = z.infer<typeof yarnSchema>;
export const yarnListResponseSchema = z.object({ yarns: z.array(yarnSchema) });
export const yarnResponseSchema = z.object({ yarn: yarnSchema });
