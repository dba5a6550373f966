import { acBranchCurrent, acVoltage, buildAcSystem, solveAcAt } from './ac-system.ts';
import type { CircuitInput } from './circuit.ts';
import { cabs, cargDeg, cdiv, type Complex } from './complex.ts';
import { solveValidated } from './dc.ts';
import { EngineError } from './errors.ts';
import {
  deviceSmallSignal,
  linearizeSolved,
  type DeviceSmallSignal,
  type LinearElement,
} from './linearize.ts';
import type { OperatingPoint } from './operating-point.ts';
import { resolveOperatingPointOptions } from './options.ts';
import { prepareCircuit } from './topology.ts';

export type { DeviceSmallSignal, LinearElement, Stimulus } from './linearize.ts';

export interface SmallSignalOptions {
  /** Independent source (V or I) that drives the input; it gets 1∠0°, every other source is zeroed. */
  input: string;
  /** Output node. */
  output: string;
  /** Node the output is measured against. Default ground. */
  reference?: string;
  /** Frequency, Hz (0 for the DC small-signal response). Default 0. */
  frequency?: number;
  /** Circuit temperature for the bias point, °C. Default 27. */
  temperature?: number;
}

/** A complex quantity with its polar form. */
export interface Phasor {
  re: number;
  im: number;
  /** |z|. */
  mag: number;
  /** arg z, degrees in (−180, 180]. */
  deg: number;
}

export interface SmallSignalResult {
  /** Frequency of the analysis, Hz. */
  frequency: number;
  /** V(output)/input: V/V for a voltage-source input, Ω (transimpedance) for a current-source input. */
  gain: Phasor & { /** 20·log10|gain|, dB. */ db: number };
  /** Impedance the input source sees, Ω (Infinity when it drives an open circuit). */
  zin: Phasor;
  /** Impedance at the output node with the input zeroed, by a 1 A test source, Ω. */
  zout: Phasor;
  /** Each device's parameters at Q by name. */
  devices: Record<string, DeviceSmallSignal>;
  /** The linearized circuit that was solved (input stimulus included). */
  linearized: LinearElement[];
  operatingPoint: OperatingPoint;
}

const phasor = (z: Complex): Phasor => ({ re: z.re, im: z.im, mag: cabs(z), deg: cargDeg(z) });

/**
 * Gain, input impedance and output impedance of a circuit at one frequency, about its bias point.
 */
export function smallSignalAt(
  circuit: CircuitInput,
  options: SmallSignalOptions,
): SmallSignalResult {
  const opts = resolveOperatingPointOptions({ temperature: options.temperature });
  const validated = prepareCircuit(circuit);
  const input = options.input.toLowerCase();
  const output = options.output.toLowerCase();
  const ref =
    options.reference === undefined || options.reference.toLowerCase() === 'gnd'
      ? '0'
      : options.reference.toLowerCase();
  const frequency = options.frequency ?? 0;
  if (!(frequency >= 0) || !Number.isFinite(frequency))
    throw new EngineError('bad-option', 'frequency must be a finite number ≥ 0 Hz');
  const src = validated.circuit.elements.find((el) => el.name === input);
  if (!src || (src.kind !== 'V' && src.kind !== 'I')) {
    throw new EngineError(
      'bad-option',
      `input ${input} is not an independent voltage or current source`,
      { element: input },
    );
  }
  for (const n of [output, ref]) {
    if (n !== '0' && !validated.nodes.includes(n))
      throw new EngineError('bad-option', `node ${n} is not in the circuit`, { node: n });
  }
  if (output === ref)
    throw new EngineError('bad-option', 'the output node and its reference are the same node', {
      node: output,
    });

  const bias = solveValidated(validated, opts);
  const linearized = linearizeSolved(bias, { source: input });
  const sys = buildAcSystem(linearized);
  solveAcAt(sys, frequency);
  const gain = acVoltage(sys, output, ref);
  const one = { re: 1, im: 0 };
  let zin: Complex;
  if (src.kind === 'V') {
    const i = acBranchCurrent(sys, input);
    const delivered = { re: -i.re, im: -i.im };
    zin = delivered.re === 0 && delivered.im === 0 ? { re: Infinity, im: 0 } : cdiv(one, delivered);
  } else {
    // An I source pushes its current out of its second node: the circuit sees V(n−) − V(n+).
    zin = acVoltage(sys, src.nodes[1], src.nodes[0]);
  }

  // Output impedance: every source zeroed, 1 A pushed into the output node from the reference.
  const test: LinearElement = {
    kind: 'I',
    name: 'i.test',
    nodes: [ref, output],
    value: 0,
    ac: { mag: 1, phase: 0 },
    origin: 'test source',
  };
  const zsys = buildAcSystem([...linearizeSolved(bias, 'none'), test]);
  solveAcAt(zsys, frequency);
  const zout = acVoltage(zsys, output, ref);

  const devices: Record<string, DeviceSmallSignal> = {};
  for (const [name, op] of Object.entries(bias.op.devices)) devices[name] = deviceSmallSignal(op);
  const g = phasor(gain);
  return {
    frequency,
    gain: { ...g, db: 20 * Math.log10(g.mag) },
    zin: phasor(zin),
    zout: phasor(zout),
    devices,
    linearized,
    operatingPoint: bias.op,
  };
}

export interface LinearizedCircuit {
  /** The small-signal equivalent, with each source's own AC stimulus. */
  elements: LinearElement[];
  /** Each device's parameters at Q by name. */
  devices: Record<string, DeviceSmallSignal>;
  operatingPoint: OperatingPoint;
}

/** The linearized circuit at the bias point, for display. */
export function linearizeCircuit(
  circuit: CircuitInput,
  options: { temperature?: number } = {},
): LinearizedCircuit {
  const bias = solveValidated(
    prepareCircuit(circuit),
    resolveOperatingPointOptions({ temperature: options.temperature }),
  );
  const devices: Record<string, DeviceSmallSignal> = {};
  for (const [name, op] of Object.entries(bias.op.devices)) devices[name] = deviceSmallSignal(op);
  return { elements: linearizeSolved(bias, 'circuit'), devices, operatingPoint: bias.op };
}
