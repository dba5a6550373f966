import {
  formatSpiceNumber,
  isEngineError,
  modelKinds,
  modelSchema,
  parseValue,
  sameName,
  type DeviceModel,
  type ModelKind,
} from '@biasproof/calc';
import { z } from 'zod';

/** The model form: a name, a kind and SPICE parameters typed as `IS` = `1e-14`. */

export interface ModelFormValues {
  name: string;
  kind: ModelKind;
  params: { name: string; value: string }[];
}

export function modelFormSchema(otherNames: readonly string[]) {
  return z
    .object({
      name: z.string(),
      kind: z.enum(modelKinds),
      params: z.array(z.object({ name: z.string(), value: z.string() })),
    })
    .transform((form, ctx): DeviceModel => {
      const issue = (path: (string | number)[], message: string) =>
        ctx.addIssue({ code: 'custom', path, message });
      const name = form.name.trim();
      const nameCheck = modelSchema.shape.name.safeParse(name);
      if (!nameCheck.success) issue(['name'], nameCheck.error.issues[0]?.message ?? 'invalid name');
      else if (otherNames.some((other) => sameName(other, name)))
        issue(['name'], `A model named ${name} exists already.`);
      const params: Record<string, number> = {};
      form.params.forEach((p, i) => {
        const key = p.name.trim().toUpperCase();
        if (!/^[A-Z][A-Z0-9]*$/.test(key)) {
          issue(
            ['params', i, 'name'],
            'A parameter name is letters and digits, starting with a letter (IS, BF, VAF…).',
          );
        } else if (key in params) {
          issue(['params', i, 'name'], `${key} is given twice.`);
        }
        try {
          params[key] = parseValue(p.value);
        } catch (e) {
          issue(['params', i, 'value'], isEngineError(e) ? e.message : String(e));
        }
      });
      const parsed = modelSchema.safeParse({ name, kind: form.kind, params });
      if (!parsed.success) {
        if (ctx.issues.length === 0)
          issue(['name'], parsed.error.issues[0]?.message ?? 'invalid model');
        return z.NEVER;
      }
      return parsed.data;
    });
}

export function modelFormValues(model: DeviceModel): ModelFormValues {
  return {
    name: model.name,
    kind: model.kind,
    params: Object.entries(model.params).map(([name, value]) => ({
      name,
      value: formatSpiceNumber(value),
    })),
  };
}

/** A new model of a kind, with the parameters an author sets first. */
export function newModelFormValues(kind: ModelKind, name: string): ModelFormValues {
  const starters: Record<ModelKind, string[]> = {
    D: ['IS', 'N'],
    NPN: ['IS', 'BF', 'VAF'],
    PNP: ['IS', 'BF', 'VAF'],
    NMOS: ['VTO', 'KP', 'LAMBDA'],
    PMOS: ['VTO', 'KP', 'LAMBDA'],
  };
  return { name, kind, params: starters[kind].map((p) => ({ name: p, value: '' })) };
}
