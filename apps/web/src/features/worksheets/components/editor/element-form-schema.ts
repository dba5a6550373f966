import {
  elementSchema,
  formatSpiceNumber,
  isEngineError,
  parseValue,
  resistorSchema,
  sameName,
  type DeviceModel,
  type Element,
  type ElementKind,
} from '@biasproof/calc';
import { z } from 'zod';
import {
  kindSpecs,
  type ValueFieldSpec,
} from '@/features/worksheets/components/editor/element-kinds.ts';
import { modelKindsFor } from '@/features/worksheets/draft/circuit-facts.ts';

/**
 * The element form: text as typed (`4k7`, `10u`, `1meg`), turned into an engine element by the
 * engine's own parser and schema, so that the form refuses exactly what the engine would.
 */

export interface ElementFormValues {
  name: string;
  nodes: string[];
  values: Partial<Record<ValueFieldSpec['key'], string>>;
  model: string;
}

export interface ElementFormContext {
  kind: ElementKind;
  /** Names of the other elements (a name must be unique). */
  otherNames: readonly string[];
  models: readonly DeviceModel[];
}

/** The engine's rule for one node name. */
const nodeNameSchema = resistorSchema.shape.nodes.def.items[0];
const elementNameSchema = resistorSchema.shape.name;

type Issue = { path: (string | number)[]; message: string };

function readValue(
  spec: ValueFieldSpec,
  text: string | undefined,
  issues: Issue[],
): number | undefined {
  const trimmed = (text ?? '').trim();
  if (trimmed === '') {
    if (!spec.optional)
      issues.push({
        path: ['values', spec.key],
        message: `Enter the ${spec.label.toLowerCase()}.`,
      });
    return undefined;
  }
  try {
    const x = parseValue(trimmed, spec.unit === undefined ? {} : { unit: spec.unit });
    if (spec.positive && !(x > 0)) {
      issues.push({
        path: ['values', spec.key],
        message: `The ${spec.label.toLowerCase()} must be greater than 0.`,
      });
    }
    return x;
  } catch (e) {
    issues.push({ path: ['values', spec.key], message: isEngineError(e) ? e.message : String(e) });
    return undefined;
  }
}

function checkName(form: ElementFormValues, ctx: ElementFormContext, issues: Issue[]) {
  const name = form.name.trim();
  const parsed = elementNameSchema.safeParse(name);
  if (!parsed.success) {
    issues.push({ path: ['name'], message: parsed.error.issues[0]?.message ?? 'invalid name' });
  } else if (name[0]?.toUpperCase() !== ctx.kind) {
    issues.push({
      path: ['name'],
      message: `A ${kindSpecs[ctx.kind].label.toLowerCase()}'s name starts with ${ctx.kind} (SPICE's letter), e.g. ${ctx.kind}1.`,
    });
  } else if (ctx.otherNames.some((other) => sameName(other, name))) {
    issues.push({ path: ['name'], message: `${name} is already the name of another element.` });
  }
}

function checkNodes(form: ElementFormValues, count: number, issues: Issue[]): string[] {
  const nodes: string[] = [];
  for (let i = 0; i < count; i++) {
    const text = (form.nodes[i] ?? '').trim().toLowerCase();
    const parsed = nodeNameSchema.safeParse(text);
    if (!parsed.success)
      issues.push({
        path: ['nodes', i],
        message: parsed.error.issues[0]?.message ?? 'invalid node',
      });
    nodes.push(text);
  }
  return nodes;
}

function checkModel(form: ElementFormValues, ctx: ElementFormContext, issues: Issue[]): string {
  const kinds = modelKindsFor(ctx.kind);
  const model = ctx.models.find((m) => sameName(m.name, form.model) && kinds.includes(m.kind));
  if (!model)
    issues.push({
      path: ['model'],
      message: `Choose a ${kinds.join(' or ')} model, or make a new one.`,
    });
  return model?.name ?? form.model;
}

/** Turns the form into an element, or lists what is wrong with it, field by field. */
export function readElementForm(
  form: ElementFormValues,
  ctx: ElementFormContext,
): { element: Element } | { issues: Issue[] } {
  const spec = kindSpecs[ctx.kind];
  const issues: Issue[] = [];
  checkName(form, ctx, issues);
  const nodes = checkNodes(form, spec.nodeLabels.length, issues);
  const numbers: Partial<Record<ValueFieldSpec['key'], number>> = {};
  for (const field of spec.fields)
    numbers[field.key] = readValue(field, form.values[field.key], issues);
  const model = spec.usesModel ? checkModel(form, ctx, issues) : '';
  if (issues.length > 0) return { issues };

  const name = form.name.trim();
  const candidate = assemble(ctx.kind, name, nodes, numbers, model);
  const parsed = elementSchema.safeParse(candidate);
  if (!parsed.success) {
    return {
      issues: parsed.error.issues.map((i) => ({ path: fieldPath(i.path), message: i.message })),
    };
  }
  return { element: parsed.data };
}

/** Where an engine-schema issue belongs in the form. */
function fieldPath(path: PropertyKey[]): (string | number)[] {
  const [head, index] = path;
  if (head === 'nodes' && typeof index === 'number') return ['nodes', index];
  if (head === 'ac') return ['values', path[1] === 'phase' ? 'acPhase' : 'acMag'];
  if (head === 'name' || head === 'model') return [head];
  return ['values', String(head)];
}

function assemble(
  kind: ElementKind,
  name: string,
  nodes: string[],
  n: Partial<Record<ValueFieldSpec['key'], number>>,
  model: string,
): unknown {
  switch (kind) {
    case 'R':
    case 'C':
    case 'L':
      return { kind, name, nodes, value: n.value };
    case 'V':
    case 'I':
      return {
        kind,
        name,
        nodes,
        dc: n.dc,
        ...(n.acMag === undefined ? {} : { ac: { mag: n.acMag, phase: n.acPhase ?? 0 } }),
      };
    case 'D':
    case 'Q':
      return { kind, name, nodes, model, area: n.area ?? 1 };
    case 'M':
      return { kind, name, nodes, model, w: n.w, l: n.l };
    case 'E':
    case 'G':
      return { kind, name, nodes, gain: n.gain };
  }
}

/** The zod schema react-hook-form validates with: text in, an engine element out. */
export function elementFormSchema(ctx: ElementFormContext) {
  return z
    .object({
      name: z.string(),
      nodes: z.array(z.string()),
      values: z.record(z.string(), z.string().optional()),
      model: z.string(),
    })
    .transform((form, zctx) => {
      const read = readElementForm(form, ctx);
      if ('element' in read) return read.element;
      for (const issue of read.issues)
        zctx.addIssue({ code: 'custom', message: issue.message, path: issue.path });
      return z.NEVER;
    });
}

const spice = (x: number | undefined): string => (x === undefined ? '' : formatSpiceNumber(x));

/** The form's text for an element (values in SPICE notation, which reads back exactly). */
export function elementFormValues(el: Element): ElementFormValues {
  const base = { name: el.name, nodes: [...el.nodes], model: 'model' in el ? el.model : '' };
  switch (el.kind) {
    case 'R':
    case 'C':
    case 'L':
      return { ...base, values: { value: spice(el.value) } };
    case 'V':
    case 'I':
      return {
        ...base,
        values: {
          dc: spice(el.dc),
          acMag: spice(el.ac?.mag),
          acPhase: el.ac ? spice(el.ac.phase) : '',
        },
      };
    case 'D':
    case 'Q':
      return { ...base, values: { area: spice(el.area) } };
    case 'M':
      return { ...base, values: { w: spice(el.w), l: spice(el.l) } };
    case 'E':
    case 'G':
      return { ...base, values: { gain: spice(el.gain) } };
  }
}

/** A blank form for a new element of this kind. */
export function newElementFormValues(
  kind: ElementKind,
  name: string,
  defaultModel = '',
): ElementFormValues {
  const spec = kindSpecs[kind];
  const values: ElementFormValues['values'] = {};
  for (const field of spec.fields) values[field.key] = field.key === 'area' ? '1' : '';
  const nodes = spec.nodeLabels.map((_, i) => (kind === 'M' && i === 3 ? '0' : ''));
  return { name, nodes, values, model: defaultModel };
}
