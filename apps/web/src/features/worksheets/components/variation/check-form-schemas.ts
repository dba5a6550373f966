import {
  formatSpiceNumber,
  handCheckSchema,
  isEngineError,
  limitSchema,
  parseResultPath,
  parseValue,
  type HandCheck,
  type Limit,
} from '@biasproof/calc';
import { z } from 'zod';

/** The limit and hand-check forms: text in engineering notation in, the engine's objects out. */

export interface LimitFormValues {
  path: string;
  min: string;
  max: string;
  unit: string;
}

export interface HandCheckFormValues {
  path: string;
  expected: string;
  tolerance: string;
  note: string;
}

type Ctx = z.RefinementCtx;
const message = (e: unknown) => (isEngineError(e) ? e.message : String(e));

function readPath(ctx: Ctx, text: string): string {
  const path = text.trim();
  if (path === '') {
    ctx.addIssue({
      code: 'custom',
      path: ['path'],
      message: 'Enter a result path, e.g. nodes.out.',
    });
    return path;
  }
  try {
    parseResultPath(path);
  } catch (e) {
    ctx.addIssue({ code: 'custom', path: ['path'], message: message(e) });
  }
  return path;
}

function readNumber(ctx: Ctx, field: string, text: string): number | undefined {
  if (text.trim() === '') return undefined;
  try {
    return parseValue(text);
  } catch (e) {
    ctx.addIssue({ code: 'custom', path: [field], message: message(e) });
    return undefined;
  }
}

export const limitFormSchema = z
  .object({ path: z.string(), min: z.string(), max: z.string(), unit: z.string() })
  .transform((form, ctx): Limit => {
    const path = readPath(ctx, form.path);
    const min = readNumber(ctx, 'min', form.min);
    const max = readNumber(ctx, 'max', form.max);
    if (form.min.trim() === '' && form.max.trim() === '')
      ctx.addIssue({ code: 'custom', path: ['min'], message: 'Give a min, a max or both.' });
    if (min !== undefined && max !== undefined && min > max)
      ctx.addIssue({ code: 'custom', path: ['max'], message: 'The max is below the min.' });
    if (form.unit.trim().length > 16)
      ctx.addIssue({ code: 'custom', path: ['unit'], message: 'At most 16 characters.' });
    if (ctx.issues.length > 0) return z.NEVER;
    return limitSchema.parse({ path, min, max, unit: form.unit.trim() });
  });

export const handCheckFormSchema = z
  .object({ path: z.string(), expected: z.string(), tolerance: z.string(), note: z.string() })
  .transform((form, ctx): HandCheck => {
    const path = readPath(ctx, form.path);
    const expected = readNumber(ctx, 'expected', form.expected);
    if (form.expected.trim() === '')
      ctx.addIssue({
        code: 'custom',
        path: ['expected'],
        message: 'Enter your hand-calculated value.',
      });
    else if (expected === 0)
      ctx.addIssue({
        code: 'custom',
        path: ['expected'],
        message: 'A % deviation needs a value other than 0.',
      });
    const tolerance = readNumber(ctx, 'tolerance', form.tolerance) ?? 5;
    if (!(tolerance > 0))
      ctx.addIssue({
        code: 'custom',
        path: ['tolerance'],
        message: 'The tolerance must be above 0 %.',
      });
    if (form.note.length > 500)
      ctx.addIssue({ code: 'custom', path: ['note'], message: 'At most 500 characters.' });
    if (ctx.issues.length > 0) return z.NEVER;
    return handCheckSchema.parse({
      path,
      expected,
      tolerancePercent: tolerance,
      note: form.note.trim(),
    });
  });

const spice = (x: number | undefined) => (x === undefined ? '' : formatSpiceNumber(x));

export function limitFormValues(limit?: Limit): LimitFormValues {
  return {
    path: limit?.path ?? '',
    min: spice(limit?.min),
    max: spice(limit?.max),
    unit: limit?.unit ?? '',
  };
}

export function handCheckFormValues(check?: HandCheck): HandCheckFormValues {
  return {
    path: check?.path ?? '',
    expected: spice(check?.expected),
    tolerance: String(check?.tolerancePercent ?? 5),
    note: check?.note ?? '',
  };
}
