import { z } from 'zod';

/** `GET /api/health`: the server is up and its database answers a query. */
export const HealthResponse = z.object({
  ok: z.literal(true),
  db: z.literal('ok'),
  /**
   * Whether this server catches mail in its dev inbox (MAIL_FAKE), so the client knows whether
   * to offer the inbox without asking for it. A server that leaves it out is asked at the inbox.
   */
  devMail: z.boolean().optional(),
});
export type HealthResponse = z.infer<typeof HealthResponse>;
