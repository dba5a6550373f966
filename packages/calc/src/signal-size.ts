import { acVoltage, buildAcSystem, solveAcAt } from './ac-system.ts';
import type { Circuit, CircuitInput, Element } from './circuit.ts';
import { solveValidated, type SolvedBias } from './dc.ts';
import { EngineError } from './errors.ts';
import { linearizeSolved } from './linearize.ts';
import { buildSystem } from './mna.ts';
import type { DeviceOp, OperatingPoint } from './operating-point.ts';
import { resolveOperatingPointOptions } from './options.ts';
import { createWork } from './newton.ts';
import { solveNonlinear } from './solve-nonlinear.ts';
import { prepareCircuit, type ValidatedCircuit } from './topology.ts';

/**
 * Is the intended signal small enough for the small-signal model? The input source is moved
 * quasi-statically through a sine of the stated amplitude and the exact (nonlinear) output is
 * compared with the linear prediction. The check is at midband: capacitors hold their bias-point
 * voltage (a signal short) and inductors their bias-point current (a signal open).
 */

export interface SignalSizeOptions {
  /** Independent V or I source carrying the signal. */
  input: string;
  /** Peak signal amplitude, V (or A for a current source); > 0. */
  amplitude: number;
  /** Output node. */
  output: string;
  /** Node the output is measured against. Default ground. */
  reference?: string;
  /** Largest acceptable linearity error, %. Default 10. */
  errorLimit?: number;
  /** Circuit temperature, °C. Default 27. */
  temperature?: number;
}

/** One controlling port's signal swing against the voltage scale of its nonlinearity. */
export interface PortSwing {
  /** Device name. */
  device: string;
  /** `D`, `BE`, `BC` junctions or `GS` of a MOSFET. */
  port: 'D' | 'BE' | 'BC' | 'GS';
  /** Peak small-signal swing across the port predicted by the linear model, V. */
  swing: number;
  /** N·VT for a junction; the overdrive |VGS − VTH| at Q for a MOSFET, V. */
  scale: number;
  /** swing/scale. */
  ratio: number;
  /** First-order linearity error of the port alone, ratio/2 as a %, for exponential and square law alike. */
  estimatedErrorPercent: number;
  /** Common practice: the swing stays well under the scale (≤ 0.2, about 5 mV for a junction at room temperature ≈ 10 % error). */
  withinCommonPractice: boolean;
}

export interface SignalSizeResult {
  /** Peak input amplitude, V or A. */
  amplitude: number;
  /** Small-signal gain at midband, V/V (Ω for a current-source input). */
  linearGain: number;
  /** Linear prediction of the output's peak excursion, V. */
  linearPeak: number;
  /** Exact output excursion at +amplitude and at −amplitude from the bias point, V. */
  exactPositive: number;
  exactNegative: number;
  /** Largest deviation of the exact excursions from the linear prediction, % of the prediction. */
  errorPercent: number;
  /** Second-harmonic amplitude relative to the fundamental for a sine input, % (16-point DFT of the quasi-static response). */
  secondHarmonicPercent: number;
  /** Error limit used, %. */
  errorLimit: number;
  /** errorPercent ≤ errorLimit. */
  pass: boolean;
  /** Swing of every conducting junction and every on MOSFET's gate against its scale. */
  ports: PortSwing[];
  operatingPoint: OperatingPoint;
}

/** Only a conducting junction (or an on MOSFET) makes the response nonlinear in its swing. */
function conducts(op: DeviceOp, port: PortSwing['port']): boolean {
  if (op.kind === 'D') return op.region === 'forward';
  if (op.kind === 'M') return op.region !== 'cut-off';
  if (port === 'BE') return op.region === 'active' || op.region === 'saturation';
  return op.region === 'saturation' || op.region === 'reverse-active';
}
const SAMPLES = 16;

/**
 * The midband version of the circuit: each capacitor becomes a voltage source holding its
 * bias-point voltage (a signal short), each inductor a current source holding its bias-point
 * current (a signal open). A capacitor whose nodes are already tied together by voltage-defined
 * branches (sources, controlled-source outputs, capacitors held before it) has its voltage fixed
 * by them, so it is left out instead: a second source there would close a loop of voltage
 * sources. Holding by exact sources rather than by a huge shunt conductance keeps the matrix well
 * conditioned, so Newton converges to the same tolerances as the bias point itself.
 */
function midbandCircuit(circuit: Circuit, op: OperatingPoint): Circuit {
  const v = (n: string): number => (n === '0' ? 0 : op.nodes[n]!);
  const tied = nodeUnion();
  for (const el of circuit.elements)
    if (el.kind === 'V' || el.kind === 'E') tied.join(el.nodes[0], el.nodes[1]);
  const elements: Element[] = [];
  for (const el of circuit.elements) {
    if (el.kind === 'C') {
      const [p, m] = el.nodes;
      if (tied.same(p, m)) continue;
      tied.join(p, m);
      elements.push({ kind: 'V', name: `${el.name}.hold`, nodes: [p, m], dc: v(p) - v(m) });
    } else if (el.kind === 'L') {
      elements.push({
        kind: 'I',
        name: `${el.name}.q`,
        nodes: [...el.nodes],
        dc: op.elements[el.name]!.current,
      });
    } else elements.push(el);
  }
  return { ...circuit, elements };
}

/** Which nodes are joined by voltage-defined branches (union-find over node names). */
function nodeUnion(): { join(a: string, b: string): void; same(a: string, b: string): boolean } {
  const parent = new Map<string, string>();
  const root = (n: string): string => {
    let r = n;
    while (parent.has(r) && parent.get(r) !== r) r = parent.get(r)!;
    parent.set(n, r);
    return r;
  };
  return {
    join: (a, b) => parent.set(root(a), root(b)),
    same: (a, b) => root(a) === root(b),
  };
}

export function checkSignalSize(
  circuit: CircuitInput,
  options: SignalSizeOptions,
): SignalSizeResult {
  const opts = resolveOperatingPointOptions({ temperature: options.temperature });
  const amplitude = options.amplitude;
  const errorLimit = options.errorLimit ?? 10;
  if (!(amplitude > 0) || !Number.isFinite(amplitude))
    throw new EngineError('bad-option', 'amplitude must be a finite number > 0');
  if (!(errorLimit > 0)) throw new EngineError('bad-option', 'errorLimit must be > 0 %');
  const original = prepareCircuit(circuit);
  const input = options.input.toLowerCase();
  const output = options.output.toLowerCase();
  const ref =
    (options.reference ?? '0').toLowerCase() === 'gnd'
      ? '0'
      : (options.reference ?? '0').toLowerCase();
  const src = original.circuit.elements.find((el) => el.name === input);
  if (!src || (src.kind !== 'V' && src.kind !== 'I'))
    throw new EngineError('bad-option', `input ${input} is not an independent source`, {
      element: input,
    });
  for (const n of [output, ref])
    if (n !== '0' && !original.nodes.includes(n))
      throw new EngineError('bad-option', `node ${n} is not in the circuit`, { node: n });

  const q = solveValidated(original, opts);
  const mid: ValidatedCircuit = prepareCircuit(midbandCircuit(original.circuit, q.op));
  const bias: SolvedBias = solveValidated(mid, opts);

  // Linear prediction at midband (ω = 0 of the midband circuit).
  const ac = buildAcSystem(linearizeSolved(bias, { source: input }));
  solveAcAt(ac, 0);
  const linearGain = acVoltage(ac, output, ref).re;
  const linearPeak = linearGain * amplitude;
  const name = (i: number): string =>
    i === bias.system.ground ? '0' : bias.system.unknownNames[i]!;
  const ports: PortSwing[] = [];
  for (const ce of bias.system.elements) {
    const d = ce.device;
    if (!d) continue;
    const op = q.op.devices[d.name]!;
    for (const port of d.ports) {
      if (!conducts(op, port.label)) continue;
      const swing = Math.abs(acVoltage(ac, name(port.p), name(port.m)).re) * amplitude;
      const scale = port.nvt > 0 ? port.nvt : op.kind === 'M' ? Math.abs(op.vgs - op.vth) : 0;
      const ratio = scale > 0 ? swing / scale : Infinity;
      ports.push({
        device: d.name,
        port: port.label,
        swing,
        scale,
        ratio,
        estimatedErrorPercent: (ratio / 2) * 100,
        withinCommonPractice: ratio <= 0.2,
      });
    }
  }

  // Exact quasi-static response over one sine period.
  const sys = buildSystem(mid, {
    temperature: opts.temperature,
    nominalTemperature: opts.nominalTemperature,
  });
  const work = createWork(sys);
  const inputIndex = mid.circuit.elements.findIndex((el) => el.name === input);
  const base = src.dc;
  const outAt = (i: number, j: number, x: Float64Array): number => x[i]! - x[j]!;
  const oi = sys.nodeIndex.get(output)!;
  const ri = sys.nodeIndex.get(ref)!;
  const y: number[] = [];
  for (let k = 0; k < SAMPLES; k++) {
    const value = base + amplitude * Math.sin((2 * Math.PI * k) / SAMPLES);
    const elements = mid.circuit.elements.map((el, i) =>
      i === inputIndex ? ({ ...el, dc: value } as Element) : el,
    );
    const stepped = buildSystem(
      { ...mid, circuit: { ...mid.circuit, elements } },
      { temperature: opts.temperature, nominalTemperature: opts.nominalTemperature },
    );
    const r = solveNonlinear(
      stepped,
      work,
      { maxIterations: opts.maxIterations, gmin: opts.gmin },
      bias.x,
    );
    y.push(outAt(oi, ri, r.x));
  }
  const y0 = y[0]!;
  const exactPositive = y[SAMPLES / 4]! - y0;
  const exactNegative = y[(3 * SAMPLES) / 4]! - y0;
  const errorPercent =
    (Math.max(Math.abs(exactPositive - linearPeak), Math.abs(exactNegative + linearPeak)) /
      Math.abs(linearPeak)) *
    100;
  const harmonic = (h: number): number => {
    let re = 0;
    let im = 0;
    y.forEach((v, k) => {
      re += v * Math.cos((2 * Math.PI * h * k) / SAMPLES);
      im += v * Math.sin((2 * Math.PI * h * k) / SAMPLES);
    });
    return Math.hypot(re, im);
  };
  const secondHarmonicPercent = (harmonic(2) / harmonic(1)) * 100;
  return {
    amplitude,
    linearGain,
    linearPeak,
    exactPositive,
    exactNegative,
    errorPercent,
    secondHarmonicPercent,
    errorLimit,
    pass: errorPercent <= errorLimit,
    ports,
    operatingPoint: q.op,
  };
}
