import {
  distributions,
  E_SERIES_NAMES,
  isEngineError,
  parseResultPath,
  parseValue,
  temperaturesOf,
  worksheetVariationSchema,
  type ESeries,
  type PartRatingInput,
  type VariedParameterInput,
} from '@biasproof/calc';
import { z } from 'zod';
import {
  ratingFields,
  setupOf,
  type ParameterRowValues,
  type RatingRowValues,
  type SetupFormValues,
  type SetupValues,
} from '@/features/worksheets/components/variation/setup-form-values.ts';

/** Reads the setup form: each field's text checked, the engine's schema over the whole. */

const text = z.string();
const parameterRow = z.object({
  target: text,
  toleranceKind: z.enum(['percent', 'range']),
  tolerance: text,
  min: text,
  max: text,
  distribution: z.enum(distributions),
  sigmas: text,
  tempco: text,
});
const ratingRow = z.object({
  element: text,
  power: text,
  current: text,
  voltage: text,
  reverseVoltage: text,
  thetaJA: text,
  tjMax: text,
});

type Ctx = z.RefinementCtx;
const message = (e: unknown) => (isEngineError(e) ? e.message : String(e));

/** A number from the text, or undefined when empty and optional; adds an issue when it is bad. */
function number(ctx: Ctx, path: (string | number)[], value: string, optional = true) {
  if (value.trim() === '') {
    if (!optional) ctx.addIssue({ code: 'custom', path, message: 'Enter a value.' });
    return undefined;
  }
  try {
    return parseValue(value);
  } catch (e) {
    ctx.addIssue({ code: 'custom', path, message: message(e) });
    return undefined;
  }
}

const list = (value: string) => value.split(/[\s,;]+/).filter((item) => item !== '');

function readParameter(ctx: Ctx, row: ParameterRowValues, i: number, seen: Set<string>) {
  const at = (field: keyof ParameterRowValues) => ['parameters', i, field];
  const target = row.target.trim();
  if (target === '')
    ctx.addIssue({ code: 'custom', path: at('target'), message: 'Choose what varies.' });
  else if (seen.has(target.toLowerCase()))
    ctx.addIssue({ code: 'custom', path: at('target'), message: `${target} is varied twice.` });
  seen.add(target.toLowerCase());
  const out: VariedParameterInput = { target, distribution: row.distribution };
  if (row.toleranceKind === 'percent') {
    const tolerance = number(ctx, at('tolerance'), row.tolerance);
    if (tolerance !== undefined && (tolerance < 0 || tolerance >= 100))
      ctx.addIssue({ code: 'custom', path: at('tolerance'), message: 'Between 0 and 99 %.' });
    if (tolerance !== undefined) out.tolerancePercent = tolerance;
  } else {
    const min = number(ctx, at('min'), row.min, row.max.trim() === '');
    const max = number(ctx, at('max'), row.max, row.min.trim() === '');
    if (min !== undefined && max !== undefined) {
      if (min > max) ctx.addIssue({ code: 'custom', path: at('max'), message: 'Below the min.' });
      Object.assign(out, { min, max });
    }
  }
  const sigmas = number(ctx, at('sigmas'), row.sigmas, row.distribution === 'uniform');
  if (sigmas !== undefined && !(sigmas > 0 && sigmas <= 10))
    ctx.addIssue({ code: 'custom', path: at('sigmas'), message: 'Above 0, at most 10.' });
  out.sigmas = sigmas ?? 3;
  const tempco = number(ctx, at('tempco'), row.tempco) ?? 0;
  if (Math.abs(tempco) > 1e5)
    ctx.addIssue({ code: 'custom', path: at('tempco'), message: 'At most ±100 000 ppm/K.' });
  out.tempcoPpm = tempco;
  return out;
}

function readRating(ctx: Ctx, row: RatingRowValues, i: number, seen: Set<string>) {
  const element = row.element.trim();
  if (element === '')
    ctx.addIssue({ code: 'custom', path: ['ratings', i, 'element'], message: 'Choose a part.' });
  else if (seen.has(element.toLowerCase()))
    ctx.addIssue({
      code: 'custom',
      path: ['ratings', i, 'element'],
      message: `${element} is rated twice.`,
    });
  seen.add(element.toLowerCase());
  const out: PartRatingInput = { element };
  for (const [key] of ratingFields) {
    const value = number(ctx, ['ratings', i, key], row[key]);
    if (value === undefined) continue;
    if (key !== 'tjMax' && !(value > 0))
      ctx.addIssue({ code: 'custom', path: ['ratings', i, key], message: 'Above 0.' });
    out[key] = value;
  }
  return out;
}

function readTemperatures(ctx: Ctx, form: SetupFormValues): number[] {
  if (form.temperatureMode === 'list') {
    return list(form.temperatureList).flatMap((item) => {
      const t = number(ctx, ['temperatureList'], item);
      return t === undefined ? [] : [t];
    });
  }
  const from = number(ctx, ['temperatureFrom'], form.temperatureFrom, false);
  const to = number(ctx, ['temperatureTo'], form.temperatureTo, false);
  const step = number(ctx, ['temperatureStep'], form.temperatureStep, false);
  if (from === undefined || to === undefined || step === undefined) return [];
  try {
    return temperaturesOf({ from, to, step });
  } catch (e) {
    ctx.addIssue({ code: 'custom', path: ['temperatureStep'], message: message(e) });
    return [];
  }
}

/** Where a remaining issue of the engine's schema is shown. */
function fieldOf(path: PropertyKey[]): (string | number)[] {
  const [section, index, field] = path;
  if (section === 'parameters' && typeof index === 'number')
    return ['parameters', index, field === 'min' || field === 'max' ? String(field) : 'target'];
  if (section === 'ratings' && typeof index === 'number') return ['ratings', index, 'element'];
  if (section === 'temperatures') return ['temperatureList'];
  if (section === 'standardSeries') return ['series'];
  if (section === 'probes') return ['probes'];
  return ['ambient'];
}

export const setupFormSchema = z
  .object({
    parameters: z.array(parameterRow),
    ratings: z.array(ratingRow),
    temperatureMode: z.enum(['list', 'range']),
    temperatureList: text,
    temperatureFrom: text,
    temperatureTo: text,
    temperatureStep: text,
    probes: text,
    series: z.array(z.enum(E_SERIES_NAMES as [ESeries, ...ESeries[]])),
    ambient: text,
  })
  .transform((form, ctx): SetupValues => {
    const targets = new Set<string>();
    const parameters = form.parameters.map((row, i) => readParameter(ctx, row, i, targets));
    const elements = new Set<string>();
    const ratings = form.ratings.map((row, i) => readRating(ctx, row, i, elements));
    const temperatures = readTemperatures(ctx, form);
    const probes = list(form.probes);
    for (const path of probes) {
      try {
        parseResultPath(path);
      } catch (e) {
        ctx.addIssue({ code: 'custom', path: ['probes'], message: message(e) });
      }
    }
    if (form.series.length === 0)
      ctx.addIssue({ code: 'custom', path: ['series'], message: 'Choose at least one series.' });
    const ambient = number(ctx, ['ambient'], form.ambient);
    if (ctx.issues.length > 0) return z.NEVER;
    const parsed = worksheetVariationSchema.safeParse({
      parameters,
      ratings,
      temperatures,
      probes,
      standardSeries: form.series,
      ambient,
    });
    if (parsed.success) return setupOf(parsed.data);
    for (const issue of parsed.error.issues)
      ctx.addIssue({ code: 'custom', path: fieldOf(issue.path), message: issue.message });
    return z.NEVER;
  });
