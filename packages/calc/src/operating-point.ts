import type { BjtOp } from './models/bjt.ts';
import type { DiodeOp } from './models/diode.ts';
import type { MosfetOp } from './models/mosfet.ts';
import type { MnaSystem } from './mna.ts';
import type { DiodeLaw } from './options.ts';

export type { BjtOp } from './models/bjt.ts';
export type { DiodeOp } from './models/diode.ts';
export type { MosfetOp } from './models/mosfet.ts';

export type DeviceOp = DiodeOp | BjtOp | MosfetOp;

/** How the bias point was found. */
export type OperatingPointMethod = 'plain' | 'gmin-stepping' | 'source-stepping' | 'assumed-state';

/** Current and absorbed power of one element. */
export interface ElementOp {
  /** Current into the element's first terminal, A. */
  current: number;
  /** Power absorbed, W (negative for a source delivering power). */
  power: number;
}

/** The bias point. Infinite resistances are `Infinity` (serialized as null by JSON.stringify). */
export interface OperatingPoint {
  /** Node voltages by lowercase name, V (ground and the internal nodes behind series resistances omitted). */
  nodes: Record<string, number>;
  /** Current of each V (and E) source by lowercase name, A, positive into its + terminal (SPICE's branch current). */
  sources: Record<string, number>;
  /** Operating quantities of every D, Q and M by lowercase name. */
  devices: Record<string, DeviceOp>;
  /** Current and power of every element by lowercase name. */
  elements: Record<string, ElementOp>;
  /** Power delivered by all independent sources together, W. */
  supplyPower: number;
  /** Newton iterations in all attempts; for `assumed-state`, the number of diode-state assignments solved. */
  iterations: number;
  method: OperatingPointMethod;
  /** Largest KCL residual over the circuit's nodes at the reported solution, A. */
  residual: number;
  /** Circuit temperature, °C. */
  temperature: number;
  diodeLaw: DiodeLaw;
  /** Model parameters the engine did not evaluate. */
  warnings: string[];
}

export interface OperatingPointMeta {
  iterations: number;
  method: OperatingPointMethod;
  temperature: number;
  diodeLaw: DiodeLaw;
  gmin: number;
  warnings: string[];
}

/** KCL sums of buildOperatingPoint, reused across calls (a typed-array allocation costs more than the sums). */
let kclScratch = new Float64Array(64);

/**
 * The keys of a system's result records, in result order, each record built once with
 * placeholder values: a result clones them (one copy of a known shape) and overwrites the
 * values, instead of adding its keys one by one. Names do not change when a prepared circuit's
 * values are altered, so the variants of one system share them (see MnaSystem.resultShapes).
 */
export interface ResultShapes {
  nodes: Record<string, number>;
  sources: Record<string, number>;
  devices: Record<string, DeviceOp | null>;
  elements: Record<string, ElementOp | null>;
}

function resultShapes(sys: MnaSystem, externalCount: number): ResultShapes {
  const nodes: Record<string, number> = {};
  for (let i = 0; i < externalCount; i++) nodes[sys.unknownNames[i]!] = 0;
  const sources: Record<string, number> = {};
  const devices: Record<string, DeviceOp | null> = {};
  const elements: Record<string, ElementOp | null> = {};
  for (const { el, device } of sys.elements) {
    if (device) devices[el.name] = null;
    else if (el.kind === 'V' || el.kind === 'E') sources[el.name] = 0;
    elements[el.name] = null;
  }
  return { nodes, sources, devices, elements };
}

/** Evaluates every element at the solution x and assembles the user-facing result. */
export function buildOperatingPoint(
  sys: MnaSystem,
  x: Float64Array,
  meta: OperatingPointMeta,
): OperatingPoint {
  // Unknowns 0…externalCount−1 are the circuit's own nodes, in order of first appearance.
  const externalCount = sys.nodeIndex.size - 1;
  const shapes = (sys.resultShapes.value ??= resultShapes(sys, externalCount));
  const names = sys.unknownNames;
  const nodes = { ...shapes.nodes };
  for (let i = 0; i < externalCount; i++) nodes[names[i]!] = x[i]!;
  const sources = { ...shapes.sources };
  const devices = { ...shapes.devices } as Record<string, DeviceOp>;
  const elements = { ...shapes.elements } as Record<string, ElementOp>;
  if (kclScratch.length < sys.stride) kclScratch = new Float64Array(sys.stride);
  const kcl = kclScratch;
  kcl.fill(0, 0, sys.stride);
  let supplyPower = 0;
  const compiled = sys.elements;
  for (let k = 0; k < compiled.length; k++) {
    const ce = compiled[k]!;
    const { el, terms } = ce;
    const p = terms[0]!;
    const m = terms[1]!;
    const vpm = x[p]! - x[m]!;
    let current = 0;
    let power: number;
    if (ce.device) {
      // The device adds its terminal currents to the KCL sums itself, in terminal order.
      const op = ce.device.reportInto(x, meta.gmin, kcl) as DeviceOp;
      devices[el.name] = op;
      // The current into the first terminal (collector, anode, drain).
      current = op.kind === 'Q' ? op.ic : op.id;
      power = op.power;
    } else {
      switch (el.kind) {
        case 'R':
          current = vpm / el.value;
          break;
        case 'C':
          current = 0;
          break;
        case 'I':
          current = el.dc;
          break;
        case 'G':
          current = el.gain * (x[terms[2]!]! - x[terms[3]!]!);
          break;
        default:
          current = x[ce.branch]!;
      }
      kcl[p]! += current;
      kcl[m]! -= current;
      power = vpm * current;
      if (el.kind === 'V' || el.kind === 'E') sources[el.name] = current;
      if (el.kind === 'V' || el.kind === 'I') supplyPower -= power;
    }
    elements[el.name] = { current, power };
  }
  let residual = 0;
  for (let i = 0; i < externalCount; i++) residual = Math.max(residual, Math.abs(kcl[i]!));
  return {
    nodes,
    sources,
    devices,
    elements,
    supplyPower,
    residual,
    iterations: meta.iterations,
    method: meta.method,
    temperature: meta.temperature,
    diodeLaw: meta.diodeLaw,
    warnings: meta.warnings,
  };
}
