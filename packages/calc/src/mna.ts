import type { Element } from './circuit.ts';
import { toKelvin } from './constants.ts';
import { EngineError } from './errors.ts';
import { bjtAtTemperature, makeBjtStamp } from './models/bjt.ts';
import { diodeAtTemperature, makeDiodeStamp } from './models/diode.ts';
import { makeMosfetStamp } from './models/mosfet-stamp.ts';
import { mosfetAtTemperature } from './models/mosfet.ts';
import type { DeviceStamp } from './models/stamp.ts';
import type { ResultShapes } from './operating-point.ts';
import { stampLinear, type LinearPlan } from './mna-linear.ts';
import { GROUND, type ValidatedCircuit } from './topology.ts';

/**
 * Modified nodal analysis: unknowns are the node voltages (external, then the internal nodes
 * behind series resistances) followed by the branch currents of voltage-defined elements.
 * The matrix is (size+1)², row-major; row and column `size` stand for ground and are never
 * factored, so stamps need no ground test. Linear elements are stamped once into g0/b0
 * (mna-linear.ts); each Newton iteration copies them and adds the devices' linearizations.
 */

/** One element with the unknowns it touches. */
export interface CompiledElement {
  /** The validated element (lowercase names). */
  el: Element;
  /** Unknown index of each terminal, in the element's node order (ground → the ground index). */
  terms: number[];
  /** Branch-current unknown (V, L, E, and diodes under a simplified law), or −1. */
  branch: number;
  /** The nonlinear stamp of a D, Q or M. */
  device?: DeviceStamp;
  /** Series resistances of the device's model (RS, RB, RC, RE, RD), stamped as linear conductances. */
  series: SeriesResistance[];
}

/** A model's series resistance between an external terminal and an internal node. */
export interface SeriesResistance {
  /** Model parameter it comes from, lowercase (`rs`, `rb`…). */
  label: string;
  /** [external, internal] unknown indices. */
  nodes: [number, number];
  /** Ω. */
  value: number;
}

export interface MnaSystem {
  /** Number of unknowns. */
  size: number;
  /** Row stride of the matrix (size + 1). */
  stride: number;
  /** Index standing for ground (= size); x[ground] is always 0. */
  ground: number;
  /** Unknowns 0…nodeCount−1 are node voltages. */
  nodeCount: number;
  /** Name of each unknown: node name, or `i(element)` for a branch current. */
  unknownNames: string[];
  /** Node name → unknown index (ground included, mapped to `ground`). */
  nodeIndex: Map<string, number>;
  elements: CompiledElement[];
  devices: DeviceStamp[];
  /** Linear part of the matrix. */
  g0: Float64Array;
  /** Independent sources at full value (scaled during source stepping). */
  b0: Float64Array;
  /**
   * The result records' keys, made by the first result built from this system and shared by
   * the variants a prepared circuit derives from it (their element names are the same).
   */
  resultShapes: { value: ResultShapes | undefined };
  /**
   * Which elements write which entries of g0/b0, made when a prepared circuit's variant is first
   * re-stamped and shared by all its variants (their topology is the same).
   */
  linearPlan: { value: LinearPlan | undefined };
}

/** Builds the stamp of a diode under a simplified law (see assumed-state.ts). */
export type DiodeStampFactory = (
  name: string,
  anode: number,
  cathode: number,
  branch: number,
  stride: number,
) => DeviceStamp;

export interface BuildOptions {
  /** Circuit temperature, °C. */
  temperature: number;
  /** Nominal temperature of model parameters, °C, unless a card gives TNOM. */
  nominalTemperature: number;
  /** When given, diodes become switched branches built by this factory instead of exponential junctions. */
  diodeFactory?: DiodeStampFactory;
}

/** Compiles a validated circuit into its MNA system at one temperature. */
export function buildSystem(v: ValidatedCircuit, opts: BuildOptions): MnaSystem {
  const { circuit } = v;
  const unknownNames: string[] = [...v.nodes];
  const internals = circuit.elements.map((el) =>
    internalNodesOf(el, v.cards, opts.diodeFactory !== undefined, unknownNames),
  );
  const nodeCount = unknownNames.length;
  const branches = circuit.elements.map((el) =>
    el.kind === 'V' || el.kind === 'L' || el.kind === 'E' || (el.kind === 'D' && opts.diodeFactory)
      ? unknownNames.push(`i(${el.name})`) - 1
      : -1,
  );
  const size = unknownNames.length;
  const stride = size + 1;
  const ground = size;
  const nodeIndex = new Map<string, number>(v.nodes.map((n, i) => [n, i]));
  nodeIndex.set(GROUND, ground);
  const devices: DeviceStamp[] = [];
  const scaling: DeviceScaling = {
    tempK: toKelvin(opts.temperature),
    nominalTemperature: opts.nominalTemperature,
    scaled: new Map(),
  };
  const elements = circuit.elements.map((el, i): CompiledElement => {
    const terms = el.nodes.map((n) => nodeIndex.get(n)!);
    const ce: CompiledElement = { el, terms, branch: branches[i]!, series: [] };
    if (el.kind === 'D' || el.kind === 'Q' || el.kind === 'M') {
      ce.device = compileDevice(v, el, ce, internals[i]!, scaling, stride, opts.diodeFactory);
      devices.push(ce.device);
    }
    return ce;
  });
  // One backing store for both (see createWork).
  const linear = new ArrayBuffer(8 * (stride * stride + stride));
  const g0 = new Float64Array(linear, 0, stride * stride);
  const b0 = new Float64Array(linear, 8 * stride * stride, stride);
  stampLinear(elements, stride, g0, b0);
  return {
    size,
    stride,
    ground,
    nodeCount,
    unknownNames,
    nodeIndex,
    elements,
    devices,
    g0,
    b0,
    resultShapes: { value: undefined },
    linearPlan: { value: undefined },
  };
}

/** Internal nodes of a device with series resistances, appended to `unknownNames` (name → index). */
export function internalNodesOf(
  el: Element,
  cards: ValidatedCircuit['cards'],
  switchedDiodes: boolean,
  unknownNames: string[],
): Record<string, number> {
  const out: Record<string, number> = {};
  if (el.kind !== 'D' && el.kind !== 'Q' && el.kind !== 'M') return out;
  const params = cards.get(el.model)!;
  const add = (suffix: string): void => {
    out[suffix] = unknownNames.push(`${el.name}:${suffix}`) - 1;
  };
  if (el.kind === 'D' && !switchedDiodes && params.RS! > 0) add('a');
  if (el.kind === 'Q') {
    if (params.RC! > 0) add('c');
    if (params.RB! > 0 || (params.RBM ?? 0) > 0) add('b');
    if (params.RE! > 0) add('e');
  }
  if (el.kind === 'M') {
    if (params.RD! > 0) add('d');
    if (params.RS! > 0) add('s');
  }
  return out;
}

/** The circuit temperature and the temperature-scaled parameters already computed, shared by devices of one card and geometry. */
export interface DeviceScaling {
  /** K. */
  tempK: number;
  /** °C, unless a card gives TNOM. */
  nominalTemperature: number;
  scaled: Map<string, unknown>;
}

function scaledOnce<T>(s: DeviceScaling, key: string, make: () => T): T {
  let value = s.scaled.get(key) as T | undefined;
  if (value === undefined) {
    value = make();
    s.scaled.set(key, value);
  }
  return value;
}

/** Records a model's series resistance on the element; stampLinear stamps it. */
function addSeries(
  ce: CompiledElement,
  label: string,
  ext: number,
  int: number,
  ohms: number,
): void {
  ce.series.push({ label, nodes: [ext, int], value: ohms });
}

/** The nonlinear stamp of a D, Q or M (and its series resistances, recorded on `ce`). */
export function compileDevice(
  v: ValidatedCircuit,
  el: Extract<Element, { kind: 'D' | 'Q' | 'M' }>,
  ce: CompiledElement,
  internals: Record<string, number>,
  s: DeviceScaling,
  stride: number,
  diodeFactory: DiodeStampFactory | undefined,
): DeviceStamp {
  const [p, m, cp, cm] = ce.terms as [number, number, number, number];
  const params = v.cards.get(el.model)!;
  const tnomK = toKelvin(params.TNOM ?? s.nominalTemperature);
  switch (el.kind) {
    case 'D': {
      if (diodeFactory) return diodeFactory(el.name, p, m, ce.branch, stride);
      const d = scaledOnce(s, `${el.model}|${el.area}`, () =>
        diodeAtTemperature(params, el.area, s.tempK, tnomK),
      );
      const ai = internals.a ?? p;
      if (ai !== p) addSeries(ce, 'rs', p, ai, d.rs);
      return makeDiodeStamp(el.name, p, ai, m, d, stride);
    }
    case 'Q': {
      const type = v.models.get(el.model)!.kind === 'PNP' ? -1 : 1;
      const q = scaledOnce(s, `${el.model}|${el.area}`, () =>
        bjtAtTemperature(params, type, el.area, s.tempK, tnomK),
      );
      const nd = {
        c: p,
        b: m,
        e: cp,
        ci: internals.c ?? p,
        bi: internals.b ?? m,
        ei: internals.e ?? cp,
      };
      if (nd.ci !== p) addSeries(ce, 'rc', p, nd.ci, q.rc);
      if (nd.ei !== cp) addSeries(ce, 're', cp, nd.ei, q.re);
      if (nd.bi !== m && q.rbpi === 0) addSeries(ce, 'rb', m, nd.bi, q.rbpr);
      return makeBjtStamp(el.name, nd, q, stride);
    }
    case 'M': {
      const leff = el.l - 2 * params.LD!;
      if (!(leff > 0)) {
        throw new EngineError(
          'bad-value',
          `${el.name}: effective channel length L − 2·LD is not positive`,
          { element: el.name },
        );
      }
      const type = v.models.get(el.model)!.kind === 'PMOS' ? -1 : 1;
      const mt = scaledOnce(s, `${el.model}|${el.w}|${el.l}`, () =>
        mosfetAtTemperature(params, type, el.w, el.l, s.tempK, tnomK),
      );
      const nd = { d: p, g: m, s: cp, b: cm, di: internals.d ?? p, si: internals.s ?? cp };
      if (nd.di !== p) addSeries(ce, 'rd', p, nd.di, mt.rd);
      if (nd.si !== cp) addSeries(ce, 'rs', cp, nd.si, mt.rs);
      return makeMosfetStamp(el.name, nd, mt, stride);
    }
  }
}
