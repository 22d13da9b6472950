import { z } from 'zod';

export const capturedMailSchema = z.object({
  id: z.string(),
  /** Recipients as the To header lists them, comma-separated. */
  to: z.string(),
  subject: z.string(),
  text: z.string(),
  html: z.string().optional(),
  date: z.string(),
});
export type CapturedMail = z.infer<typeof capturedMailSchema>;
export const mailsResponseSchema = z.object({ mails: z.array(capturedMailSchema) });
