import { z } from 'zod';
import { studioRoleSchema } from './auth';

export const createStudioBodySchema = z.object({ name: z.string().trim().min(1).max(100) });
export type CreateStudioBody = z.infer<typeof createStudioBodySchema>;

export const memberRoleBodySchema = z.object({ role: studioRoleSchema });
export type MemberRoleBody = z.infer<typeof memberRoleBodySchema>;

export const studioListItemSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  role: studioRoleSchema,
  memberCount: z.number().int(),
});
export type StudioListItem = z.infer<typeof studioListItemSchema>;
export const studioListResponseSchema = z.object({ studios: z.array(studioListItemSchema) });

export const studioSchema = z.object({ id: z.number().int(), name: z.string(), role: studioRoleSchema });
export type Studio = z.infer<typeof studioSchema>;
export const createStudioResponseSchema = z.object({ studio: studioSchema });

export const studioMemberSchema = z.object({
  userId: z.number().int(),
  name: z.string(),
  email: z.string(),
  role: studioRoleSchema,
});
export type StudioMember = z.infer<typeof studioMemberSchema>;

export const studioDetailResponseSchema = z.object({ studio: studioSchema, members: z.array(studioMemberSchema) });
export type StudioDetailResponse = z.infer<typeof studioDetailResponseSchema>;

/** PATCH and DELETE of a member answer with the studio's members as they now stand. */
export const membersResponseSchema = z.object({ members: z.array(studioMemberSchema) });
