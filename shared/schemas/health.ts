import { z } from 'zod';

/** `GET /api/health`: the server is up and its database answers a query. */
export const HealthResponse = z.object({ ok: z.literal(true), db: z.literal('ok') });
export type HealthResponse = z.infer<typeof HealthResponse>;
