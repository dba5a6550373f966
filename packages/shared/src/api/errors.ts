import { z } from 'zod';

/** Every error answer of the API: `{"error":{"code","message","fields"?}}`. */
export const apiErrorBodySchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    /** Field path → message, for 400 answers on bad input. */
    fields: z.record(z.string(), z.string()).optional(),
  }),
});
export type ApiErrorBody = z.infer<typeof apiErrorBodySchema>;
