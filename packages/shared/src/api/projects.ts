import { z } from 'zod';

/** Free-text search of a list (`q`). */
export const searchTextSchema = z.string().trim().max(200, 'Search with at most 200 characters.');

export const pageLimitSchema = z.coerce
  .number('Use a whole number.')
  .int('Use a whole number.')
  .min(1, 'Use 1 to 100.')
  .max(100, 'Use 1 to 100.');
export const pageOffsetSchema = z.coerce
  .number('Use a whole number.')
  .int('Use a whole number.')
  .min(0, 'Use 0 or more.');

export const projectNameSchema = z
  .string()
  .trim()
  .min(1, 'Enter a project name.')
  .max(120, 'A project name has at most 120 characters.');

/** Short code shown beside worksheets, unique in the organization regardless of case; stored upper case. */
export const projectCodeSchema = z
  .string()
  .trim()
  .min(1, 'Enter a project code.')
  .max(20, 'A project code has at most 20 characters.')
  .regex(
    /^[A-Za-z0-9][A-Za-z0-9_.-]*$/,
    'Use letters, digits, - _ and . only, starting with a letter or digit.',
  )
  .transform((c) => c.toUpperCase());

/** A description of a project or of the analog block a worksheet captures. */
export const descriptionTextSchema = z
  .string()
  .trim()
  .max(4000, 'A description has at most 4000 characters.');

/** A project as the API answers it (`GET /api/orgs/:orgId/projects[/:id]`). */
export const projectSchema = z.object({
  id: z.string(),
  name: z.string(),
  code: z.string(),
  description: z.string(),
  /** Archived projects stay readable but take no new worksheets; projects are never deleted. */
  archived: z.boolean(),
  /** Worksheets in the project. */
  worksheetCount: z.number().int().min(0),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Project = z.infer<typeof projectSchema>;

/** `POST /api/orgs/:orgId/projects` */
export const createProjectRequestSchema = z.object({
  name: projectNameSchema,
  code: projectCodeSchema,
  description: descriptionTextSchema.default(''),
});
export type CreateProjectRequest = z.input<typeof createProjectRequestSchema>;

/** `PATCH /api/orgs/:orgId/projects/:id`: archive with `{"archived":true}` (there is no delete). */
export const updateProjectRequestSchema = z
  .object({
    name: projectNameSchema.optional(),
    code: projectCodeSchema.optional(),
    description: descriptionTextSchema.optional(),
    archived: z.boolean('Use true or false.').optional(),
  })
  .refine((b) => Object.values(b).some((v) => v !== undefined), { message: 'Nothing to change.' });
export type UpdateProjectRequest = z.input<typeof updateProjectRequestSchema>;

/**
 * Query of `GET /api/orgs/:orgId/projects`: `archived` = `false` (default, active ones),
 * `true` (archived ones) or `all`; `q` searches name, code and description; paging.
 */
export const projectListQuerySchema = z.object({
  archived: z.enum(['true', 'false', 'all'], 'Use true, false or all.').default('false'),
  q: searchTextSchema.optional(),
  limit: pageLimitSchema.default(100),
  offset: pageOffsetSchema.default(0),
});
export type ProjectListQuery = z.input<typeof projectListQuerySchema>;
