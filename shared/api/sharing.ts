import { z } from 'zod';
import { studioRoleSchema } from './auth';

/** 32 random bytes in base64url are 43 characters. */
const token = z.string().trim().min(20).max(100).regex(/^[A-Za-z0-9_-]+$/, { error: 'is not a valid link' });

export const shareTokenParamsSchema = z.object({ token });
export const shareLinkResponseSchema = z.object({ url: z.string(), token: z.string() });
export type ShareLinkResponse = z.infer<typeof shareLinkResponseSchema>;
/** Whether a draft has a live public link (the link itself is shown only once, when made). */
export const shareStatusResponseSchema = z.object({ shared: z.boolean(), createdAt: z.string().nullable() });
export type ShareStatusResponse = z.infer<typeof shareStatusResponseSchema>;

export const sharedDraftResponseSchema = z.object({
  draft: z.object({ name: z.string(), ownerName: z.string(), version: z.number().int(), updatedAt: z.string(), document: z.unknown() }),
});
export type SharedDraftResponse = z.infer<typeof sharedDraftResponseSchema>;

export const inviteBodySchema = z.object({
  email: z.string().trim().toLowerCase().pipe(z.email().max(254)),
  role: studioRoleSchema,
});
export type InviteBody = z.infer<typeof inviteBodySchema>;
export const inviteResponseSchema = z.object({ invitation: z.object({ email: z.string(), role: studioRoleSchema, expiresAt: z.string() }) });

export const acceptInviteBodySchema = z.object({ token });
export type AcceptInviteBody = z.infer<typeof acceptInviteBodySchema>;
export const acceptInviteResponseSchema = z.object({
  studio: z.object({ id: z.number().int(), name: z.string(), role: studioRoleSchema }),
});
export type AcceptInviteResponse = z.infer<typeof acceptInviteResponseSchema>;
