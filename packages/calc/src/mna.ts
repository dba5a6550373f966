import type { Element } from './circuit.ts';
import { toKelvin } from './constants.ts';
import { EngineError } from './errors.ts';
import { bjtAtTemperature, makeBjtStamp } from './models/bjt.ts';
import { diodeAtTemperature, makeDiodeStamp } from './models/diode.ts';
import { makeMosfetStamp } from './models/mosfet-stamp.ts';
import { mosfetAtTemperature } from './models/mosfet.ts';
import type { DeviceStamp } from './models/stamp.ts';
import { GROUND, type ValidatedCircuit } from './topology.ts';

/**
 * Modified nodal analysis: unknowns are the node voltages (external, then the internal nodes
 * behind series resistances) followed by the branch currents of voltage-defined elements.
 * The matrix is (size+1)², row-major; row and column `size` stand for ground and are never
 * factored, so stamps need no ground test. Linear elements are stamped once into g0/b0;
 * each Newton iteration copies them and adds the devices' linearizations.
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

function addConductance(g0: Float64Array, stride: number, p: number, m: number, g: number): void {
  g0[p * stride + p]! += g;
  g0[p * stride + m]! -= g;
  g0[m * stride + p]! -= g;
  g0[m * stride + m]! += g;
}

function addBranch(g0: Float64Array, stride: number, p: number, m: number, k: number): void {
  g0[p * stride + k]! += 1;
  g0[m * stride + k]! -= 1;
  g0[k * stride + p]! += 1;
  g0[k * stride + m]! -= 1;
}

/** Compiles a validated circuit into its MNA system at one temperature. */
export function buildSystem(v: ValidatedCircuit, opts: BuildOptions): MnaSystem {
  const { circuit } = v;
  const unknownNames: string[] = [...v.nodes];
  const internal = (owner: string, suffix: string): number =>
    unknownNames.push(`${owner}:${suffix}`) - 1;
  const tempK = toKelvin(opts.temperature);
  const tnomOf = (params: Record<string, number>): number =>
    toKelvin(params.TNOM ?? opts.nominalTemperature);

  // Pass 1: internal nodes and device parameters.
  type Pending = {
    el: Element;
    internals: Record<string, number>;
    params?: Record<string, number>;
  };
  const pending: Pending[] = circuit.elements.map((el) => {
    const p: Pending = { el, internals: {} };
    if (el.kind !== 'D' && el.kind !== 'Q' && el.kind !== 'M') return p;
    const params = v.cards.get(el.model)!;
    p.params = params;
    if (el.kind === 'D' && !opts.diodeFactory && params.RS! > 0)
      p.internals.a = internal(el.name, 'a');
    if (el.kind === 'Q') {
      if (params.RC! > 0) p.internals.c = internal(el.name, 'c');
      if (params.RB! > 0 || (params.RBM ?? 0) > 0) p.internals.b = internal(el.name, 'b');
      if (params.RE! > 0) p.internals.e = internal(el.name, 'e');
    }
    if (el.kind === 'M') {
      if (params.RD! > 0) p.internals.d = internal(el.name, 'd');
      if (params.RS! > 0) p.internals.s = internal(el.name, 's');
    }
    return p;
  });
  const nodeCount = unknownNames.length;
  const branchOf = new Map<string, number>();
  for (const el of circuit.elements) {
    if (
      el.kind === 'V' ||
      el.kind === 'L' ||
      el.kind === 'E' ||
      (el.kind === 'D' && opts.diodeFactory)
    ) {
      branchOf.set(el.name, unknownNames.push(`i(${el.name})`) - 1);
    }
  }
  const size = unknownNames.length;
  const stride = size + 1;
  const ground = size;
  const nodeIndex = new Map<string, number>(v.nodes.map((n, i) => [n, i]));
  nodeIndex.set(GROUND, ground);
  const g0 = new Float64Array(stride * stride);
  const b0 = new Float64Array(stride);
  const devices: DeviceStamp[] = [];
  // Devices sharing a card and geometry share their temperature-scaled parameters.
  const scaled = new Map<string, unknown>();
  const once = <T>(key: string, make: () => T): T => {
    if (!scaled.has(key)) scaled.set(key, make());
    return scaled.get(key) as T;
  };

  // Pass 2: stamps.
  const elements = pending.map(({ el, internals, params }): CompiledElement => {
    const terms = el.nodes.map((n) => nodeIndex.get(n)!);
    const branch = branchOf.get(el.name) ?? -1;
    const ce: CompiledElement = { el, terms, branch, series: [] };
    const resistor = (label: string, ext: number, int: number, ohms: number): void => {
      addConductance(g0, stride, ext, int, 1 / ohms);
      ce.series.push({ label, nodes: [ext, int], value: ohms });
    };
    const [p, m, cp, cm] = terms as [number, number, number, number];
    switch (el.kind) {
      case 'R':
        addConductance(g0, stride, p, m, 1 / el.value);
        break;
      case 'C':
        break;
      case 'L':
        addBranch(g0, stride, p, m, branch);
        break;
      case 'V':
        addBranch(g0, stride, p, m, branch);
        b0[branch] = el.dc;
        break;
      case 'I':
        b0[p]! -= el.dc;
        b0[m]! += el.dc;
        break;
      case 'E':
        addBranch(g0, stride, p, m, branch);
        g0[branch * stride + cp]! -= el.gain;
        g0[branch * stride + cm]! += el.gain;
        break;
      case 'G':
        g0[p * stride + cp]! += el.gain;
        g0[p * stride + cm]! -= el.gain;
        g0[m * stride + cp]! -= el.gain;
        g0[m * stride + cm]! += el.gain;
        break;
      case 'D': {
        if (opts.diodeFactory) {
          ce.device = opts.diodeFactory(el.name, p, m, branch, stride);
          break;
        }
        const d = once(`${el.model}|${el.area}`, () =>
          diodeAtTemperature(params!, el.area, tempK, tnomOf(params!)),
        );
        const ai = internals.a ?? p;
        if (ai !== p) resistor('rs', p, ai, d.rs);
        ce.device = makeDiodeStamp(el.name, p, ai, m, d, stride);
        break;
      }
      case 'Q': {
        const model = v.models.get(el.model)!;
        const q = once(`${el.model}|${el.area}`, () =>
          bjtAtTemperature(params!, model.kind === 'PNP' ? -1 : 1, el.area, tempK, tnomOf(params!)),
        );
        const nd = {
          c: p,
          b: m,
          e: cp,
          ci: internals.c ?? p,
          bi: internals.b ?? m,
          ei: internals.e ?? cp,
        };
        if (nd.ci !== p) resistor('rc', p, nd.ci, q.rc);
        if (nd.ei !== cp) resistor('re', cp, nd.ei, q.re);
        if (nd.bi !== m && q.rbpi === 0) resistor('rb', m, nd.bi, q.rbpr);
        ce.device = makeBjtStamp(el.name, nd, q, stride);
        break;
      }
      case 'M': {
        const model = v.models.get(el.model)!;
        const leff = el.l - 2 * params!.LD!;
        if (!(leff > 0)) {
          throw new EngineError(
            'bad-value',
            `${el.name}: effective channel length L − 2·LD is not positive`,
            { element: el.name },
          );
        }
        const mt = once(`${el.model}|${el.w}|${el.l}`, () =>
          mosfetAtTemperature(
            params!,
            model.kind === 'PMOS' ? -1 : 1,
            el.w,
            el.l,
            tempK,
            tnomOf(params!),
          ),
        );
        const nd = { d: p, g: m, s: cp, b: cm, di: internals.d ?? p, si: internals.s ?? cp };
        if (nd.di !== p) resistor('rd', p, nd.di, mt.rd);
        if (nd.si !== cp) resistor('rs', cp, nd.si, mt.rs);
        ce.device = makeMosfetStamp(el.name, nd, mt, stride);
        break;
      }
    }
    if (ce.device) devices.push(ce.device);
    return ce;
  });
  return { size, stride, ground, nodeCount, unknownNames, nodeIndex, elements, devices, g0, b0 };
}
