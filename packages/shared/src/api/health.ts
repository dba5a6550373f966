import { z } from 'zod';

/** `GET /api/health`: 200 when the database answers, 503 with `db: "down"` when it does not. */
export const healthResponseSchema = z.object({
  status: z.enum(['ok', 'degraded']),
  db: z.enum(['ok', 'down']),
  version: z.string(),
});
export type HealthResponse = z.infer<typeof healthResponseSchema>;
