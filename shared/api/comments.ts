import { z } from 'zod';

const id = z.coerce.number().int().positive().max(2 ** 31 - 1);
export const commentParamsSchema = z.object({ id, commentId: id });

/** A comment on a draft, optionally on one version and pointing at an end and/or pick (1-based). */
export const commentBodySchema = z.object({
  text: z.string().trim().min(1).max(2000),
  version: z.number().int().positive().optional(),
  end: z.number().int().positive().max(20_000).optional(),
  pick: z.number().int().positive().max(20_000).optional(),
});
export type CommentBody = z.infer<typeof commentBodySchema>;

export const commentSchema = z.object({
  id: z.number().int(),
  authorId: z.number().int(),
  authorName: z.string(),
  text: z.string(),
  version: z.number().int().nullable(),
  end: z.number().int().nullable(),
  pick: z.number().int().nullable(),
  createdAt: z.string(),
});
export type Comment = z.infer<typeof commentSchema>;
export const commentListResponseSchema = z.object({ comments: z.array(commentSchema) });
export const commentResponseSchema = z.object({ comment: commentSchema });
