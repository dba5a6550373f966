import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { z } from 'zod';
import { thermalVoltage } from '../constants.ts';
import { EngineError } from '../errors.ts';
import { parseInput } from './spec.ts';

/**
 * Fits a diode's IS, N and RS to measured forward I–V points by Levenberg-Marquardt
 * (ml-levenberg-marquardt) on log current, so that every decade of current weighs alike. The
 * model is the Shockley diode with series resistance, solved for I in closed form:
 * I = (N·VT/RS)·ω(ln(IS·RS/(N·VT)) + (V + IS·RS)/(N·VT)) − IS, with ω the Wright omega function
 * (ω = W0(eˣ), so the exponential never overflows) — T. C. Banwell, A. Jayakumar, "Exact
 * analytical solution for current flow through diode with series resistance", Electronics
 * Letters 36(4), 2000. The Jacobian is analytic, from the implicit equation
 * V = I·RS + N·VT·ln(I/IS + 1).
 */

export const MIN_FIT_POINTS = 5;

const pointSchema = z.object({
  /** Terminal voltage, V. */
  v: z.number().finite(),
  /** Forward current, A. */
  i: z.number().finite(),
});
const fitSchema = z.object({
  points: z.array(pointSchema).max(10_000),
  /** Temperature of the measurement, °C. Default 27. */
  temperature: z.number().finite().gt(-273.15).default(27),
  maxIterations: z.number().int().min(1).max(10_000).default(300),
});
export type DiodeFitInput = z.input<typeof fitSchema>;

export interface DiodeFitResidual {
  v: number;
  /** Measured current, A. */
  i: number;
  /** The fitted model's current at v, A. */
  model: number;
  /** ln(i/model). */
  logResidual: number;
  /** (i − model)/model, %. */
  percent: number;
}

export interface DiodeFitResult {
  /** Saturation current, A. */
  is: number;
  /** Emission coefficient. */
  n: number;
  /** Series resistance, Ω. */
  rs: number;
  /** RMS of ln(measured/model): about the RMS relative error of the current. */
  rmsLogError: number;
  residuals: DiodeFitResidual[];
  iterations: number;
  /** °C */
  temperature: number;
}

/** ω(z): the w > 0 with w + ln w = z (Halley's iteration, as for W0 in Corless et al. 1996). */
export function wrightOmega(z: number): number {
  if (z < -700) return Math.exp(z);
  let w = z > 1 ? z - Math.log(z) : Math.exp(z);
  for (let k = 0; k < 60; k++) {
    const g = w + Math.log(w) - z;
    const g1 = 1 + 1 / w;
    const next = w - (2 * g * g1) / (2 * g1 * g1 + g / (w * w));
    if (Math.abs(next - w) <= 1e-15 * Math.abs(next)) return next;
    w = next > 0 ? next : w / 2;
  }
  return w;
}

/** Diode current at terminal voltage v, A. */
export function diodeCurrent(v: number, is: number, n: number, rs: number, vt: number): number {
  const nvt = n * vt;
  if (!(rs > 0)) return is * Math.expm1(v / nvt);
  return (nvt / rs) * wrightOmega(Math.log((is * rs) / nvt) + (v + is * rs) / nvt) - is;
}

const describe = (p: { v: number; i: number }, k: number): string =>
  `point ${k + 1} (${p.v} V, ${p.i} A)`;

function checkPoints(points: readonly { v: number; i: number }[]): { v: number; i: number }[] {
  if (points.length < MIN_FIT_POINTS)
    throw new EngineError(
      'bad-value',
      `a diode fit needs at least ${MIN_FIT_POINTS} measured points; got ${points.length}`,
    );
  points.forEach((p, k) => {
    if (!(p.i > 0))
      throw new EngineError(
        'bad-value',
        `${describe(p, k)} has a current that is not positive: the fit works on log current and needs forward currents > 0 A`,
      );
  });
  const sorted = points.slice().sort((a, b) => a.v - b.v);
  for (let k = 1; k < sorted.length; k++) {
    const a = sorted[k - 1]!;
    const b = sorted[k]!;
    if (!(b.v > a.v && b.i > a.i))
      throw new EngineError(
        'bad-value',
        `the data are not monotonic: the current must rise with the voltage, but at ${b.v} V it is ${b.i} A against ${a.i} A at ${a.v} V`,
      );
  }
  return sorted;
}

/** Start values: N and IS from a line through the lower half (ln I against V), RS from the top points' excess voltage. */
function initialGuess(points: { v: number; i: number }[], vt: number): [number, number, number] {
  const low = points.slice(0, Math.max(3, Math.ceil(points.length / 2)));
  const mx = low.reduce((s, p) => s + p.v, 0) / low.length;
  const my = low.reduce((s, p) => s + Math.log(p.i), 0) / low.length;
  let sxy = 0;
  let sxx = 0;
  for (const p of low) {
    sxy += (p.v - mx) * (Math.log(p.i) - my);
    sxx += (p.v - mx) ** 2;
  }
  const slope = sxy / sxx;
  const n = Math.min(5, Math.max(0.5, 1 / (slope * vt)));
  const lnIs = my - mx / (n * vt);
  const top = points.slice(-3);
  const excess = top.map((p) => (p.v - n * vt * Math.log1p(p.i / Math.exp(lnIs))) / p.i);
  const rs = Math.max(0, excess.reduce((s, r) => s + r, 0) / excess.length);
  return [lnIs, n, rs];
}

/** IS, N and RS of the diode that best explains the measured points (least squares on ln I). */
export function fitDiode(input: DiodeFitInput): DiodeFitResult {
  const o = parseInput(fitSchema, input, 'diode fit');
  const points = checkPoints(o.points);
  const vt = thermalVoltage(o.temperature);
  const model =
    ([lnIs, n, rs]: number[]) =>
    (v: number) =>
      Math.log(Math.max(diodeCurrent(v, Math.exp(lnIs!), n!, rs!, vt), Number.MIN_VALUE));
  const jacobian =
    ([lnIs, n, rs]: number[]) =>
    (v: number) => {
      const is = Math.exp(lnIs!);
      const i = Math.max(diodeCurrent(v, is, n!, rs!, vt), Number.MIN_VALUE);
      const g = rs! + (n! * vt) / (i + is);
      return [(n! * vt) / ((i + is) * g), -(vt * Math.log1p(i / is)) / (g * i), -1 / g];
    };
  const fit = levenbergMarquardt(
    { x: points.map((p) => p.v), y: points.map((p) => Math.log(p.i)) },
    model,
    {
      initialValues: initialGuess(points, vt),
      jacobianFunction: jacobian,
      minValues: [-200, 0.1, 0],
      maxValues: [0, 20, 1e6],
      maxIterations: o.maxIterations,
      errorTolerance: 1e-12,
    },
  );
  const [lnIs, n, rs] = fit.parameterValues as [number, number, number];
  const is = Math.exp(lnIs);
  const residuals = points.map((p) => {
    const m = diodeCurrent(p.v, is, n, rs, vt);
    return {
      v: p.v,
      i: p.i,
      model: m,
      logResidual: Math.log(p.i / m),
      percent: ((p.i - m) / m) * 100,
    };
  });
  const rmsLogError = Math.sqrt(
    residuals.reduce((s, r) => s + r.logResidual ** 2, 0) / residuals.length,
  );
  return {
    is,
    n,
    rs,
    rmsLogError,
    residuals,
    iterations: fit.iterations,
    temperature: o.temperature,
  };
}
