import { z } from 'zod';

/** `GET /api/health`: 200 with the database up, 503 with it down (the same shape either way). */
export const HealthResponse = z.object({ ok: z.boolean(), db: z.enum(['up', 'down']) });
export type HealthResponse = z.infer<typeof HealthResponse>;
