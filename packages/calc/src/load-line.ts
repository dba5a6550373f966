import { acVoltage, buildAcSystem, solveAcAt } from './ac-system.ts';
import type { CircuitInput } from './circuit.ts';
import { solveValidated } from './dc.ts';
import { EngineError } from './errors.ts';
import { linearizeSolved, type LinearElement } from './linearize.ts';
import { resolveOperatingPointOptions } from './options.ts';
import { prepareCircuit } from './topology.ts';

/**
 * Picture data for the graphical bias check of a diode or a BJT's base-emitter junction: the
 * junction's I–V curve, the load line of the rest of the circuit (its Thevenin equivalent seen
 * by the junction), their intersection at the Q-point, and the tangent at Q (slope 1/rd or 1/rπ).
 * The Thevenin resistance is the rest of the circuit's small-signal resistance at Q, so for a
 * nonlinear rest the load line is its tangent there; for a linear rest it is exact. For a BJT the
 * collector current follows the base current (βac·IB), so an emitter resistance appears
 * multiplied by (βac + 1), as in the classic input load line.
 */

export interface LoadLineOptions {
  /** Diode or BJT name. */
  device: string;
  /** Points on the device curve. Default 101. */
  points?: number;
  /** Circuit temperature, °C. Default 27. */
  temperature?: number;
}

/** A point of the picture: junction voltage V, junction current A. */
export interface CurvePoint {
  v: number;
  i: number;
}

export interface LoadLineResult {
  device: string;
  /** `D` (diode junction) or `BE` (base-emitter junction; current is the base current). */
  junction: 'D' | 'BE';
  /** Thevenin equivalent of the rest of the circuit at the junction: open-circuit voltage V and resistance Ω. */
  thevenin: { voltage: number; resistance: number };
  /** The bias point on the junction (intrinsic voltage, current into the junction). */
  q: CurvePoint;
  /** Junction conductance at Q (1/rd or 1/rπ), S. */
  slope: number;
  /** The junction's I–V curve, other device voltages held at Q, sampled evenly in voltage. */
  curve: CurvePoint[];
  /** The load line from its voltage intercept (VTh, 0) to its current intercept (0, VTh/RTh). */
  loadLine: [CurvePoint, CurvePoint];
  /** The tangent at Q over the plotted voltage range. */
  tangent: [CurvePoint, CurvePoint];
}

export function loadLine(circuit: CircuitInput, options: LoadLineOptions): LoadLineResult {
  const opts = resolveOperatingPointOptions({ temperature: options.temperature });
  const points = options.points ?? 101;
  if (!Number.isInteger(points) || points < 2 || points > 10_000)
    throw new EngineError('bad-option', 'points must be an integer from 2 to 10000');
  const validated = prepareCircuit(circuit);
  const name = options.device.toLowerCase();
  const bias = solveValidated(validated, opts);
  const ce = bias.system.elements.find((e) => e.el.name === name);
  if (!ce?.device || (ce.el.kind !== 'D' && ce.el.kind !== 'Q')) {
    throw new EngineError('bad-option', `${name} is not a diode or a bipolar transistor`, {
      element: name,
    });
  }
  const device = ce.device;
  const port = device.ports[0]!;
  const sign = port.polarity;
  const { x, system } = bias;
  const node = (i: number): string => (i === system.ground ? '0' : system.unknownNames[i]!);
  const current = (xx: Float64Array): number => {
    const rep = device.report(xx, opts.gmin);
    return sign * rep.terminals[ce.el.kind === 'D' ? 0 : 1]!.current;
  };

  // Junction voltage and current at Q (normalized so that forward is positive).
  const vq = sign * (x[port.p]! - x[port.m]!);
  const iq = current(x);

  // The rest of the circuit's response to the junction drawing 1 A (and, for a BJT, the
  // collector's βac·1 A that comes with it): the port voltage falls by RTh volts.
  const lin = linearizeSolved(bias, 'none');
  const own = ce.el.kind === 'D' ? [`${name}.rd`] : [`${name}.rpi`, `${name}.gm`];
  const junction = lin.find((e) => e.name === own[0])!;
  const gj = 1 / junction.value;
  const drawn = (from: number, to: number, amps: number, label: string): LinearElement => ({
    kind: 'I',
    name: `${name}.${label}`,
    nodes: sign === 1 ? [node(from), node(to)] : [node(to), node(from)],
    value: 0,
    ac: { mag: amps, phase: 0 },
    origin: 'test source',
  });
  const tests = [drawn(port.p, port.m, 1, 'test')];
  if (ce.el.kind === 'Q') {
    const op = bias.op.devices[name]!;
    const collector = device.ports[1]!.m;
    if (op.kind === 'Q') tests.push(drawn(collector, port.m, op.betaAc, 'beta-test'));
  }
  const ac = buildAcSystem([...lin.filter((e) => !own.includes(e.name)), ...tests]);
  solveAcAt(ac, 0);
  const rth = -sign * acVoltage(ac, node(port.p), node(port.m)).re;
  const vth = vq + iq * rth;

  // Device curve: move the junction voltage with every other unknown held at Q.
  const probe = new Float64Array(x);
  const curveAt = (v: number): number => {
    probe.set(x);
    probe[port.p] = x[port.m]! + sign * v;
    return current(probe);
  };
  const isc = Number.isFinite(rth) ? vth / rth : iq;
  const iTop = 1.5 * Math.max(iq, isc, 1e-12);
  // Highest plotted voltage: where the curve reaches iTop (bisection; the curve is monotone).
  let lo = vq;
  let hi = vq + 1;
  for (let k = 0; k < 60 && curveAt(hi) < iTop; k++) hi += 1;
  for (let k = 0; k < 100; k++) {
    const mid = (lo + hi) / 2;
    if (curveAt(mid) < iTop) lo = mid;
    else hi = mid;
  }
  const vmax = Math.max(hi, Number.isFinite(vth) ? Math.min(vth, 1.2 * hi) : hi);
  const vmin = Math.min(0, vq);
  const curve: CurvePoint[] = [];
  for (let k = 0; k < points; k++) {
    const v = vmin + ((vmax - vmin) * k) / (points - 1);
    curve.push({ v, i: curveAt(v) });
  }
  const slope = gj;
  return {
    device: name,
    junction: ce.el.kind === 'D' ? 'D' : 'BE',
    thevenin: { voltage: vth, resistance: rth },
    q: { v: vq, i: iq },
    slope,
    curve,
    loadLine: [
      { v: vth, i: 0 },
      { v: 0, i: Number.isFinite(rth) ? vth / rth : iq },
    ],
    tangent: [
      { v: vmin, i: iq + slope * (vmin - vq) },
      { v: vmax, i: iq + slope * (vmax - vq) },
    ],
  };
}
