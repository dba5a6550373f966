import { z } from 'zod';

/** Every list answer of the API: `{"items":[…],"total":N}` (total counts all matches, not the page). */
export function listResponseSchema<T extends z.ZodType>(item: T) {
  return z.object({ items: z.array(item), total: z.number().int().min(0) });
}

export const idSchema = z.uuid('must be an id');

export const emailSchema = z
  .string()
  .trim()
  .min(1, 'Enter an e-mail address.')
  .max(254, 'An e-mail address has at most 254 characters.')
  .pipe(z.email('Enter a valid e-mail address, like name@company.example.'))
  .transform((e) => e.toLowerCase());

export const personNameSchema = z
  .string()
  .trim()
  .min(1, 'Enter a name.')
  .max(120, 'A name has at most 120 characters.');
