import { z } from 'zod';
import { modelKinds, modelSchema } from '@biasproof/calc';
import { pageLimitSchema, pageOffsetSchema, searchTextSchema } from './projects.ts';

const rating = (unit: string) =>
  z
    .number(`Enter the rating in ${unit}.`)
    .finite(`Enter the rating in ${unit}.`)
    .positive(`A rating is greater than 0 ${unit}.`);

/** Absolute maximum ratings of a part, for the stress checks; each is optional. */
export const modelRatingsSchema = z.object({
  /** Power, W */
  power: rating('W').optional(),
  /** Current, A */
  current: rating('A').optional(),
  /** Voltage, V */
  voltage: rating('V').optional(),
});
export type ModelRatings = z.infer<typeof modelRatingsSchema>;

const notesSchema = z.string().trim().max(4000, 'Notes have at most 4000 characters.');

/**
 * Model-card parameters, with a message per bad entry, then checked by the engine's own
 * rule (modelSchema.params) so that the library accepts exactly what the engine does.
 */
export const modelParamsSchema = z
  .record(z.string(), z.unknown(), 'Send the parameters as an object of name → number.')
  .superRefine((params, ctx) => {
    for (const [name, value] of Object.entries(params)) {
      if (!/^[A-Z][A-Z0-9]*$/.test(name)) {
        ctx.addIssue({
          code: 'custom',
          path: [name],
          message: 'Use the SPICE parameter name in upper case, like IS or BF.',
        });
      } else if (typeof value !== 'number' || !Number.isFinite(value)) {
        ctx.addIssue({ code: 'custom', path: [name], message: 'Enter a number.' });
      }
    }
  })
  .pipe(modelSchema.shape.params.unwrap());

/** A device model of the organization's library (`GET /api/orgs/:orgId/models[/:id]`). */
export const modelLibraryEntrySchema = z.object({
  id: z.string(),
  /** Unique in the organization regardless of case; circuits refer to models by it. */
  name: z.string(),
  kind: z.enum(modelKinds),
  /** SPICE model-card parameters by their upper-case names (IS, N, RS, BF, VAF, VTO, KP…). */
  params: z.record(z.string(), z.number()),
  ratings: modelRatingsSchema,
  notes: z.string(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type ModelLibraryEntry = z.infer<typeof modelLibraryEntrySchema>;

/** `POST /api/orgs/:orgId/models`: name, kind and params are checked with the engine's modelSchema. */
export const createModelRequestSchema = modelSchema.extend({
  params: modelParamsSchema.default({}),
  ratings: modelRatingsSchema.default({}),
  notes: notesSchema.default(''),
});
export type CreateModelRequest = z.input<typeof createModelRequestSchema>;

/** `PATCH /api/orgs/:orgId/models/:id`: `params` and `ratings` replace the stored ones as a whole. */
export const updateModelRequestSchema = z
  .object({
    name: modelSchema.shape.name.optional(),
    kind: modelSchema.shape.kind.optional(),
    params: modelParamsSchema.optional(),
    ratings: modelRatingsSchema.optional(),
    notes: notesSchema.optional(),
  })
  .refine((b) => Object.values(b).some((v) => v !== undefined), { message: 'Nothing to change.' });
export type UpdateModelRequest = z.input<typeof updateModelRequestSchema>;

/** Query of `GET /api/orgs/:orgId/models`: `kind`, `q` (name and notes), paging; ordered by name. */
export const modelListQuerySchema = z.object({
  kind: z.enum(modelKinds, `Use one of ${modelKinds.join(', ')}.`).optional(),
  q: searchTextSchema.optional(),
  limit: pageLimitSchema.default(100),
  offset: pageOffsetSchema.default(0),
});
export type ModelListQuery = z.input<typeof modelListQuerySchema>;
