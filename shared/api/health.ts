import { z } from 'zod';

export const HealthResponse = z.object({ ok: z.boolean(), db: z.string() });
export type HealthResponse = z.infer<typeof HealthResponse>;
