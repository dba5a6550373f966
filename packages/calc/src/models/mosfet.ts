import { BOLTZMANN_OVER_CHARGE } from '../constants.ts';
import { criticalVoltage } from './limiting.ts';
import { potentialCorrection, siliconBandGap } from './temperature.ts';

/** Operating quantities of a MOSFET. Voltages are terminal voltages (negative for a conducting PMOS). */
export interface MosfetOp {
  kind: 'M';
  polarity: 'NMOS' | 'PMOS';
  /** Square-law region: cut-off (VGS ≤ VTH), saturation (VDS ≥ VGS − VTH) or triode; drain and source swap when VDS reverses. */
  region: 'cut-off' | 'triode' | 'saturation';
  /** Current into the drain, A (includes the drain-bulk junction). */
  id: number;
  /** V(gate) − V(source), V. */
  vgs: number;
  /** V(drain) − V(source), V. */
  vds: number;
  /** V(bulk) − V(source), V. */
  vbs: number;
  /** Threshold voltage with body effect at Q, V (negative for PMOS). */
  vth: number;
  /** Transconductance ∂ID/∂VGS, S. */
  gm: number;
  /** Body transconductance ∂ID/∂VBS, S. */
  gmb: number;
  /** Output resistance 1/gds, Ω (Infinity in saturation with LAMBDA = 0, or in cut-off). */
  ro: number;
  /** Power absorbed, W. */
  power: number;
}

/** A level-1 card at the circuit temperature for one instance (W, L applied). */
export interface MosfetAtTemperature {
  /** +1 NMOS, −1 PMOS. */
  type: 1 | -1;
  /** KP(T)·W/Leff, A/V². */
  beta: number;
  lambda: number;
  gamma: number;
  /** Surface potential 2φF at T, V. */
  phi: number;
  /** Flat-band-like term of SPICE (tVbi), V. */
  vbi: number;
  /** Zero-bias threshold at T, V (type-normalized). */
  vto: number;
  /** Bulk junction saturation current at T, A. */
  isat: number;
  vt: number;
  vcrit: number;
  /** RD, RS in Ω (0: no internal node). */
  rd: number;
  rs: number;
}

/** SPICE level-1 temperature update (KP by T^−1.5, PHI, VBI, VTO and the bulk-junction IS). */
export function mosfetAtTemperature(
  p: Record<string, number>,
  type: 1 | -1,
  w: number,
  l: number,
  tempK: number,
  tnomK: number,
): MosfetAtTemperature {
  const ratio = tempK / tnomK;
  const vt = BOLTZMANN_OVER_CHARGE * tempK;
  const vtnom = BOLTZMANN_OVER_CHARGE * tnomK;
  const egT = siliconBandGap(tempK);
  const egNom = siliconBandGap(tnomK);
  const fact1 = tnomK / 300.15;
  const fact2 = tempK / 300.15;
  const phio = (p.PHI! - potentialCorrection(tnomK)) / fact1;
  const phi = fact2 * phio + potentialCorrection(tempK);
  const gamma = p.GAMMA!;
  const vbi =
    p.VTO! - type * gamma * Math.sqrt(p.PHI!) + 0.5 * (egNom - egT) + type * 0.5 * (phi - p.PHI!);
  const isat = p.IS! * Math.exp(-egT / vt + egNom / vtnom);
  const leff = l - 2 * p.LD!;
  return {
    type,
    beta: ((p.KP! / (ratio * Math.sqrt(ratio))) * w) / leff,
    lambda: p.LAMBDA!,
    gamma,
    phi,
    vbi,
    vto: type * vbi + gamma * Math.sqrt(phi),
    isat,
    vt,
    vcrit: criticalVoltage(vt, isat),
    rd: p.RD!,
    rs: p.RS!,
  };
}

/** Level-1 channel results in the device's own (possibly swapped) frame: [cdrain, gm, gds, gmbs, von, vdsat]. */
const ch = new Float64Array(6);

/** Shichman-Hodges drain current with SPICE's body-effect form, for vds ≥ 0 in the normal frame. */
export function shichmanHodges(
  m: MosfetAtTemperature,
  vgs: number,
  vds: number,
  vbs: number,
): Float64Array {
  let sarg: number;
  if (vbs <= 0) sarg = Math.sqrt(m.phi - vbs);
  else {
    sarg = Math.sqrt(m.phi);
    sarg = Math.max(0, sarg - vbs / (sarg + sarg));
  }
  const von = m.type * m.vbi + m.gamma * sarg;
  const vgst = vgs - von;
  const arg = sarg <= 0 ? 0 : m.gamma / (sarg + sarg);
  ch[4] = von;
  ch[5] = Math.max(vgst, 0);
  if (vgst <= 0) {
    ch[0] = 0;
    ch[1] = 0;
    ch[2] = 0;
    ch[3] = 0;
    return ch;
  }
  const betap = m.beta * (1 + m.lambda * vds);
  if (vgst <= vds) {
    ch[0] = betap * vgst * vgst * 0.5;
    ch[1] = betap * vgst;
    ch[2] = m.lambda * m.beta * vgst * vgst * 0.5;
  } else {
    ch[0] = betap * vds * (vgst - 0.5 * vds);
    ch[1] = betap * vds;
    ch[2] = betap * (vgst - vds) + m.lambda * m.beta * vds * (vgst - 0.5 * vds);
  }
  ch[3] = ch[1] * arg;
  return ch;
}
