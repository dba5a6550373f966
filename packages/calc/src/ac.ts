import { acSweepSchema, type AcSweep, type CircuitInput } from './circuit.ts';
import { acVoltage, buildAcSystem, solveAcAt, type AcSystem } from './ac-system.ts';
import { cabs, cargDeg } from './complex.ts';
import { solveValidated } from './dc.ts';
import { EngineError } from './errors.ts';
import { linearizeSolved } from './linearize.ts';
import type { OperatingPoint } from './operating-point.ts';
import { resolveOperatingPointOptions } from './options.ts';
import { prepareCircuit } from './topology.ts';

export interface AcOptions {
  /** Frequencies, as an `.ac` line states them. */
  sweep: AcSweep;
  /** Node whose voltage is the response. */
  probe: string;
  /** Node the probe is measured against. Default ground. */
  reference?: string;
  /** Circuit temperature for the bias point, °C. Default 27. */
  temperature?: number;
}

export interface AcSweepResult {
  /** Frequencies, Hz, generated as SPICE does. */
  freq: number[];
  /** 20·log10|V(probe) − V(reference)| per frequency, dB (re the stimulus: dB V/V for a 1 V source). */
  db: number[];
  /** Phase per frequency, degrees in (−180, 180]. */
  deg: number[];
  /** Real part of the response, V. */
  re: number[];
  /** Imaginary part of the response, V. */
  im: number[];
  /** Largest magnitude in the sweep (or the DC gain when the response is flat down to DC), dB. */
  midbandDb: number;
  /** Frequency below the peak where the magnitude is 1/√2 of midband, Hz; null if not within the sweep. */
  lowCornerHz: number | null;
  /** Frequency above the peak where the magnitude is 1/√2 of midband, Hz; null if not within the sweep. */
  highCornerHz: number | null;
  /** The bias point the circuit was linearized at. */
  operatingPoint: OperatingPoint;
}

/**
 * Sweep frequencies exactly as SPICE generates them: dec/oct multiply by 10^(1/N) or 2^(1/N)
 * from fstart while f ≤ fstop·(1 + δ·1e-3); lin steps (fstop − fstart)/(N − 1) from fstart.
 * (SPICE returns a single point for `lin 2`; the engine returns both end points.)
 */
export function sweepFrequencies(sweep: AcSweep): number[] {
  const { type, points, fstart, fstop } = acSweepSchema.parse(sweep);
  const reltol = 1e-3;
  const out: number[] = [];
  if (type === 'lin') {
    const delta = points > 1 ? (fstop - fstart) / (points - 1) : 0;
    let f = fstart;
    for (let i = 0; i < points; i++, f += delta) out.push(f);
    return out;
  }
  const delta = Math.exp(Math.log(type === 'dec' ? 10 : 2) / points);
  const tol = delta * fstop * reltol;
  for (let f = fstart; f <= fstop + tol && out.length < 1_000_000; f *= delta) out.push(f);
  return out;
}

/** |H| at f, on a system already built. */
const magnitudeAt = (sys: AcSystem, f: number, probe: string, ref: string): number => {
  solveAcAt(sys, f);
  return cabs(acVoltage(sys, probe, ref));
};

/** Frequency between f1 and f2 (bracketing) where |H| = target, by Illinois false position on log f. */
function refineCorner(
  sys: AcSystem,
  probe: string,
  ref: string,
  target: number,
  f1: number,
  f2: number,
): number {
  let u1 = Math.log(f1);
  let u2 = Math.log(f2);
  let g1 = magnitudeAt(sys, f1, probe, ref) / target - 1;
  let g2 = magnitudeAt(sys, f2, probe, ref) / target - 1;
  let side = 0;
  for (let i = 0; i < 100; i++) {
    const u = (u1 * g2 - u2 * g1) / (g2 - g1);
    const g = magnitudeAt(sys, Math.exp(u), probe, ref) / target - 1;
    if (Math.abs(g) < 1e-14 || Math.abs(u2 - u1) < 1e-14) return Math.exp(u);
    if (g * g2 > 0) {
      u2 = u;
      g2 = g;
      if (side === -1) g1 /= 2;
      side = -1;
    } else {
      u1 = u;
      g1 = g;
      if (side === 1) g2 /= 2;
      side = 1;
    }
  }
  return Math.exp((u1 + u2) / 2);
}

/** Runs an AC sweep: bias point, linearization at Q, complex MNA at every sweep frequency. */
export function runAcSweep(circuit: CircuitInput, options: AcOptions): AcSweepResult {
  const opts = resolveOperatingPointOptions({ temperature: options.temperature });
  const validated = prepareCircuit(circuit);
  const probe = options.probe.toLowerCase();
  const ref = (options.reference ?? '0').toLowerCase();
  for (const n of [probe, ref]) {
    if (n !== '0' && n !== 'gnd' && !validated.nodes.includes(n))
      throw new EngineError('bad-option', `node ${n} is not in the circuit`, { node: n });
  }
  const refNode = ref === 'gnd' ? '0' : ref;
  const bias = solveValidated(validated, opts);
  const sys = buildAcSystem(linearizeSolved(bias, 'circuit'));
  const freq = sweepFrequencies(options.sweep);
  const re: number[] = [],
    im: number[] = [],
    db: number[] = [],
    deg: number[] = [],
    mag: number[] = [];
  for (const f of freq) {
    solveAcAt(sys, f);
    const v = acVoltage(sys, probe, refNode);
    re.push(v.re);
    im.push(v.im);
    mag.push(cabs(v));
    db.push(20 * Math.log10(cabs(v)));
    deg.push(cargDeg(v));
  }
  let peak = 0;
  for (let i = 1; i < mag.length; i++) if (mag[i]! > mag[peak]!) peak = i;
  let mid = mag[peak] ?? 0;
  if (peak === 0) {
    // Flat toward DC (a low-pass): the midband gain is the DC gain.
    let dc = 0;
    try {
      dc = magnitudeAt(sys, 0, probe, refNode);
    } catch {
      dc = 0; // singular at DC (a node held only by capacitors): not a low-pass
    }
    if (dc >= mid * 0.99) mid = Math.max(mid, dc);
  }
  const target = mid / Math.SQRT2;
  let low: number | null = null;
  for (let i = peak; i > 0; i--) {
    if (mag[i - 1]! < target && mag[i]! >= target) {
      low = refineCorner(sys, probe, refNode, target, freq[i - 1]!, freq[i]!);
      break;
    }
  }
  let high: number | null = null;
  for (let i = peak; i < mag.length - 1; i++) {
    if (mag[i + 1]! < target && mag[i]! >= target) {
      high = refineCorner(sys, probe, refNode, target, freq[i]!, freq[i + 1]!);
      break;
    }
  }
  return {
    freq,
    db,
    deg,
    re,
    im,
    midbandDb: 20 * Math.log10(mid),
    lowCornerHz: low,
    highCornerHz: high,
    operatingPoint: bias.op,
  };
}
