import { z } from 'zod';

export const HealthResponse = z.object({
  ok: z.boolean(),
  db: z.string(),
  /**
   * Whether this server catches mail in its dev inbox (MAIL_FAKE). A server that leaves it out
   * is asked at the inbox itself.
   */
  devMail: z.boolean().optional(),
});
export type HealthResponse = z.infer<typeof HealthResponse>;
