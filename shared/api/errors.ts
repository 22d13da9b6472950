import { z } from 'zod';

/** Machine-readable error codes the server sends; the client switches on these, never on messages. */
export const errorCodes = [
  'bad_request', 'validation', 'unauthenticated', 'forbidden', 'csrf', 'not_found', 'conflict',
  'too_large', 'unprocessable', 'rate_limited', 'database_unavailable', 'internal',
] as const;
export type ErrorCode = (typeof errorCodes)[number];

export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    /** Per-field messages for bad input, keyed by the dotted path of the field. */
    fields: z.record(z.string(), z.string()).optional(),
  }),
});
export type ApiError = z.infer<typeof apiErrorSchema>;
