import { z } from 'zod';

/**
 * The circuit as plain data: the contract between the deck parser, the editor, the server and
 * the numerics. Values are SI numbers (ohms, farads, henries, volts, amperes); text forms such
 * as `4k7` are parsed before they reach this schema (see values.ts).
 *
 * Node names are case-insensitive and stored lowercase; `0` and `gnd` both name ground.
 * Element names carry their SPICE letter as first character (`R1`, `Q2`) and are unique
 * case-insensitively.
 */

const nodeName = z
  .string()
  .trim()
  .min(1, 'node name is empty')
  .max(64, 'node name is longer than 64 characters')
  .regex(/^[A-Za-z0-9_.:+-]+$/, 'node name may hold letters, digits and _ . : + - only');

const elementName = z
  .string()
  .trim()
  .min(2, 'element name needs its letter and at least one more character')
  .max(64)
  .regex(
    /^[A-Za-z][A-Za-z0-9_.]*$/,
    'element name must start with its letter and hold letters, digits, _ or .',
  );

const finite = z.number().finite();
const positive = finite.positive();

/** Small-signal AC stimulus of an independent source: magnitude (V or A) and phase (degrees). */
const acStimulus = z.object({ mag: finite, phase: finite.default(0) });

export const resistorSchema = z.object({
  kind: z.literal('R'),
  name: elementName,
  /** [n+, n-] */
  nodes: z.tuple([nodeName, nodeName]),
  /** Resistance in Ω; must be > 0. */
  value: positive,
});
export const capacitorSchema = z.object({
  kind: z.literal('C'),
  name: elementName,
  nodes: z.tuple([nodeName, nodeName]),
  /** Capacitance in F (> 0). Open circuit at DC. */
  value: positive,
});
export const inductorSchema = z.object({
  kind: z.literal('L'),
  name: elementName,
  nodes: z.tuple([nodeName, nodeName]),
  /** Inductance in H (> 0). Short circuit at DC. */
  value: positive,
});
export const voltageSourceSchema = z.object({
  kind: z.literal('V'),
  name: elementName,
  /** [n+, n-]; the source holds V(n+) − V(n−) = dc. */
  nodes: z.tuple([nodeName, nodeName]),
  /** DC value in V. */
  dc: finite.default(0),
  /** AC stimulus for small-signal analysis; absent means 0. */
  ac: acStimulus.optional(),
});
export const currentSourceSchema = z.object({
  kind: z.literal('I'),
  name: elementName,
  /** [n+, n-]; as in SPICE, positive current flows from n+ through the source to n−. */
  nodes: z.tuple([nodeName, nodeName]),
  /** DC value in A. */
  dc: finite.default(0),
  ac: acStimulus.optional(),
});
export const diodeSchema = z.object({
  kind: z.literal('D'),
  name: elementName,
  /** [anode, cathode] */
  nodes: z.tuple([nodeName, nodeName]),
  model: z.string().trim().min(1),
  /** Area factor (scales IS, divides RS); default 1. */
  area: positive.default(1),
});
export const bjtSchema = z.object({
  kind: z.literal('Q'),
  name: elementName,
  /** [collector, base, emitter] */
  nodes: z.tuple([nodeName, nodeName, nodeName]),
  model: z.string().trim().min(1),
  area: positive.default(1),
});
export const mosfetSchema = z.object({
  kind: z.literal('M'),
  name: elementName,
  /** [drain, gate, source, bulk] */
  nodes: z.tuple([nodeName, nodeName, nodeName, nodeName]),
  model: z.string().trim().min(1),
  /** Channel width in m; default 100 µm as in SPICE's DEFW. */
  w: positive.default(100e-6),
  /** Channel length in m; default 100 µm as in SPICE's DEFL. */
  l: positive.default(100e-6),
});
export const vcvsSchema = z.object({
  kind: z.literal('E'),
  name: elementName,
  /** [out+, out−, control+, control−] */
  nodes: z.tuple([nodeName, nodeName, nodeName, nodeName]),
  /** Voltage gain V/V. */
  gain: finite,
});
export const vccsSchema = z.object({
  kind: z.literal('G'),
  name: elementName,
  /** [out+, out−, control+, control−]; current gain·V(c+,c−) flows from out+ through the source to out−. */
  nodes: z.tuple([nodeName, nodeName, nodeName, nodeName]),
  /** Transconductance in S. */
  gain: finite,
});

export const elementSchema = z.discriminatedUnion('kind', [
  resistorSchema,
  capacitorSchema,
  inductorSchema,
  voltageSourceSchema,
  currentSourceSchema,
  diodeSchema,
  bjtSchema,
  mosfetSchema,
  vcvsSchema,
  vccsSchema,
]);

export const modelKinds = ['D', 'NPN', 'PNP', 'NMOS', 'PMOS'] as const;

export const modelSchema = z.object({
  name: z
    .string()
    .trim()
    .min(1)
    .max(64)
    .regex(/^[A-Za-z][A-Za-z0-9_.-]*$/, 'model name must start with a letter'),
  kind: z.enum(modelKinds),
  /**
   * SPICE model-card parameters by their upper-case names (IS, N, RS, BF, VAF, VTO, KP…).
   * Omitted parameters take SPICE's defaults (see models/defaults.ts).
   */
  params: z
    .record(z.string().regex(/^[A-Z][A-Z0-9]*$/, 'parameter names are upper case'), finite)
    .default({}),
});

export const circuitSchema = z.object({
  title: z.string().max(200).default(''),
  elements: z.array(elementSchema).max(2000, 'at most 2000 elements'),
  models: z.array(modelSchema).default([]),
});

export type Resistor = z.infer<typeof resistorSchema>;
export type Capacitor = z.infer<typeof capacitorSchema>;
export type Inductor = z.infer<typeof inductorSchema>;
export type VoltageSource = z.infer<typeof voltageSourceSchema>;
export type CurrentSource = z.infer<typeof currentSourceSchema>;
export type Diode = z.infer<typeof diodeSchema>;
export type Bjt = z.infer<typeof bjtSchema>;
export type Mosfet = z.infer<typeof mosfetSchema>;
export type Vcvs = z.infer<typeof vcvsSchema>;
export type Vccs = z.infer<typeof vccsSchema>;
export type Element = z.infer<typeof elementSchema>;
export type ElementKind = Element['kind'];
export type ModelKind = (typeof modelKinds)[number];
export type DeviceModel = z.infer<typeof modelSchema>;
/** A circuit after validation: defaults filled in. */
export type Circuit = z.infer<typeof circuitSchema>;
/** A circuit as a caller may write it, before defaults. */
export type CircuitInput = z.input<typeof circuitSchema>;

/** True for the names SPICE treats as ground. */
export function isGround(node: string): boolean {
  const n = node.toLowerCase();
  return n === '0' || n === 'gnd';
}

/** A frequency sweep as SPICE's `.ac` line states it. */
export const acSweepSchema = z
  .object({
    /** `dec`: points per decade; `oct`: points per octave; `lin`: points in all. */
    type: z.enum(['dec', 'oct', 'lin']),
    points: z.number().int().min(1).max(10_000),
    /** Start frequency in Hz (> 0). */
    fstart: positive,
    /** Stop frequency in Hz (≥ fstart). */
    fstop: positive,
  })
  .refine((s) => s.fstop >= s.fstart, {
    message: 'stop frequency is below start frequency',
    path: ['fstop'],
  });
export type AcSweep = z.infer<typeof acSweepSchema>;
