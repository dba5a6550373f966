import { BOLTZMANN_OVER_CHARGE } from '../constants.ts';
import { junctionCurrent, junctionOut } from './junction.ts';
import { criticalVoltage, limitJunction } from './limiting.ts';
import { conductionVoltage, pairOffsets, type DeviceStamp, type LinearPart } from './stamp.ts';
import { saturationCurrentFactor } from './temperature.ts';

/** Operating quantities of a diode. */
export interface DiodeOp {
  kind: 'D';
  /** `forward`: conducts at least 1 nA per unit area; `reverse`: reverse-biased; `off` otherwise. */
  region: 'off' | 'forward' | 'reverse';
  /** Current into the anode, A (includes the gmin leakage, as SPICE reports it). */
  id: number;
  /** Terminal voltage V(anode) − V(cathode), V (includes the drop across RS). */
  vd: number;
  /** Intrinsic junction voltage (terminal voltage less ID·RS), V. */
  vj: number;
  /** Small-signal junction resistance at Q, Ω (≈ N·VT/ID; Infinity for the simplified laws when off). */
  rd: number;
  /** Series resistance RS/area, Ω (0 for the simplified laws). */
  rs: number;
  /** Power absorbed, W. */
  power: number;
}

/** A diode model card evaluated at the circuit temperature. */
export interface DiodeAtTemperature {
  /** IS(T)·area, A. */
  isat: number;
  /** Emission coefficient N. */
  n: number;
  /** N·VT(T), V. */
  nvt: number;
  /** Critical voltage for step limiting, V. */
  vcrit: number;
  /** RS/area, Ω (0: no internal node). */
  rs: number;
  /** Junction voltage at which the region becomes "forward", V. */
  von: number;
}

/** Applies SPICE's temperature and area scaling to a diode card (params already defaulted). */
export function diodeAtTemperature(
  p: Record<string, number>,
  area: number,
  tempK: number,
  tnomK: number,
): DiodeAtTemperature {
  const n = p.N!;
  const nvt = n * BOLTZMANN_OVER_CHARGE * tempK;
  const isat = p.IS! * area * saturationCurrentFactor(tempK, tnomK, p.EG!, p.XTI!, n);
  return {
    isat,
    n,
    nvt,
    vcrit: criticalVoltage(nvt, isat),
    rs: p.RS! > 0 ? p.RS! / area : 0,
    von: conductionVoltage(nvt, isat, area),
  };
}

/**
 * The exponential (Shockley) diode between `anode` (the internal node when RS > 0; RS itself
 * is stamped as a linear resistor by the caller) and `cathode`. `terminalAnode` is the external
 * anode, used only for reporting.
 */
export function makeDiodeStamp(
  name: string,
  terminalAnode: number,
  anode: number,
  cathode: number,
  d: DiodeAtTemperature,
  stride: number,
): DeviceStamp<DiodeOp> {
  const [aa, ak, ka, kk] = pairOffsets(anode, cathode, stride);
  // Junction voltage of the last load (limiting memory), in a typed array: a double held in a
  // closure variable is boxed anew on every store.
  const vOld = new Float64Array(1);
  let pendingSeed = true;
  const evaluate = (vd: number, gmin: number): void => {
    junctionCurrent(vd, d.isat, d.nvt);
    junctionOut[0]! += gmin * vd;
    junctionOut[1]! += gmin;
  };
  /** Operating quantities at the solution x (no limiting). */
  const operatingPoint = (x: Float64Array, gmin: number): DiodeOp => {
    const vj = x[anode]! - x[cathode]!;
    const vd = x[terminalAnode]! - x[cathode]!;
    evaluate(vj, gmin);
    const id = junctionOut[0]!;
    const region = vj < 0 ? 'reverse' : vj >= d.von ? 'forward' : 'off';
    return { kind: 'D', region, id, vd, vj, rd: 1 / junctionOut[1]!, rs: d.rs, power: vd * id };
  };
  return {
    name,
    ports: [{ label: 'D', p: anode, m: cathode, polarity: 1, nvt: d.nvt }],
    seed(x) {
      pendingSeed = x === null;
      if (x) vOld[0] = x[anode]! - x[cathode]!;
    },
    load(x, a, b, gmin) {
      const raw = x[anode]! - x[cathode]!;
      let vd: number;
      let limited: boolean;
      if (pendingSeed) {
        vd = d.vcrit;
        pendingSeed = false;
        limited = true;
      } else {
        vd = limitJunction(raw, vOld[0]!, d.nvt, d.vcrit);
        limited = vd !== raw;
      }
      vOld[0] = vd;
      evaluate(vd, gmin);
      const id = junctionOut[0]!;
      const gd = junctionOut[1]!;
      const ieq = id - gd * vd;
      a[aa]! += gd;
      a[ak]! -= gd;
      a[ka]! -= gd;
      a[kk]! += gd;
      b[anode]! -= ieq;
      b[cathode]! += ieq;
      return limited;
    },
    report(x, gmin) {
      const op = operatingPoint(x, gmin);
      return {
        op,
        terminals: [
          { node: terminalAnode, current: op.id },
          { node: cathode, current: -op.id },
        ],
      };
    },
    reportInto(x, gmin, kcl) {
      const op = operatingPoint(x, gmin);
      kcl[terminalAnode]! += op.id;
      kcl[cathode]! += -op.id;
      return op;
    },
    linearize(x, gmin): LinearPart[] {
      evaluate(x[anode]! - x[cathode]!, gmin);
      return [{ label: 'rd', kind: 'g', nodes: [anode, cathode], value: junctionOut[1]! }];
    },
  };
}
