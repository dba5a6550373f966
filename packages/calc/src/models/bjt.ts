import { BOLTZMANN_OVER_CHARGE } from '../constants.ts';
import { junctionCurrent, junctionOut } from './junction.ts';
import { criticalVoltage, limitJunction } from './limiting.ts';
import { conductionVoltage, type DeviceStamp, type LinearPart } from './stamp.ts';
import { saturationCurrentFactor } from './temperature.ts';

/** Operating quantities of a bipolar transistor. Voltages are terminal voltages (negative for a PNP in active region). */
export interface BjtOp {
  kind: 'Q';
  polarity: 'NPN' | 'PNP';
  /** Region from which junctions conduct (≥ 1 nA per unit area): BE only → active, both → saturation, BC only → reverse-active. */
  region: 'cut-off' | 'active' | 'saturation' | 'reverse-active';
  /** Current into the collector, A (positive for an active NPN, negative for a PNP). */
  ic: number;
  /** Current into the base, A. */
  ib: number;
  /** Current into the emitter, A. */
  ie: number;
  /** V(base) − V(emitter), V. */
  vbe: number;
  /** V(collector) − V(emitter), V. */
  vce: number;
  /** V(base) − V(collector), V. */
  vbc: number;
  /** Transconductance ∂IC/∂VBE at constant VCE less the output conductance, as SPICE defines gm, S. */
  gm: number;
  /** Input resistance rπ = 1/gπ, Ω. */
  rpi: number;
  /** Output resistance ro = 1/go, Ω; without Early effect (VAF = 0) only the BC junction's transport term remains, so ro is huge (Infinity if go is exactly 0). */
  ro: number;
  /** IC/IB. */
  betaDc: number;
  /** Small-signal current gain β₀ = gm·rπ. */
  betaAc: number;
  /** Power absorbed, W. */
  power: number;
}

/** A Gummel-Poon card evaluated at the circuit temperature, with area applied. */
export interface BjtAtTemperature {
  /** +1 NPN, −1 PNP. */
  type: 1 | -1;
  csat: number;
  bf: number;
  br: number;
  nf: number;
  nr: number;
  c2: number;
  ne: number;
  c4: number;
  nc: number;
  invVaf: number;
  invVar: number;
  oik: number;
  oikr: number;
  /** Minimum base resistance RBM/area and the bias-dependent part (RB − RBM)/area, Ω. */
  rbpr: number;
  rbpi: number;
  /** RC/area and RE/area, Ω (0: no internal node). */
  rc: number;
  re: number;
  vt: number;
  vcrit: number;
  /** Conduction thresholds of the BE and BC junctions, V. */
  vonBe: number;
  vonBc: number;
}

const inv = (v: number): number => (v === 0 ? 0 : 1 / v);

/** SPICE's BJT temperature update (IS with EG/VT and XTI, betas with XTB) and area scaling. */
export function bjtAtTemperature(
  p: Record<string, number>,
  type: 1 | -1,
  area: number,
  tempK: number,
  tnomK: number,
): BjtAtTemperature {
  const vt = BOLTZMANN_OVER_CHARGE * tempK;
  const factor = saturationCurrentFactor(tempK, tnomK, p.EG!, p.XTI!, 1);
  const factlog = Math.log(factor);
  const bfactor = Math.exp(Math.log(tempK / tnomK) * p.XTB!);
  const csat = p.IS! * factor * area;
  const rbm = p.RBM ?? p.RB!;
  return {
    type,
    csat,
    bf: p.BF! * bfactor,
    br: p.BR! * bfactor,
    nf: p.NF!,
    nr: p.NR!,
    c2: ((p.ISE! * Math.exp(factlog / p.NE!)) / bfactor) * area,
    ne: p.NE!,
    c4: ((p.ISC! * Math.exp(factlog / p.NC!)) / bfactor) * area,
    nc: p.NC!,
    invVaf: inv(p.VAF!),
    invVar: inv(p.VAR!),
    oik: inv(p.IKF!) / area,
    oikr: inv(p.IKR!) / area,
    rbpr: rbm / area,
    rbpi: Math.max(0, p.RB! - rbm) / area,
    rc: p.RC! / area,
    re: p.RE! / area,
    vt,
    vcrit: criticalVoltage(vt, csat),
    vonBe: conductionVoltage(p.NF! * vt, csat, area),
    vonBc: conductionVoltage(p.NR! * vt, csat, area),
  };
}

/** Gummel-Poon results at one bias: [cc, cb, gpi, gmu, gm, go, gx] (gx 0 unless RB is bias-dependent). Reused scratch. */
const gp = new Float64Array(7);

/** Evaluates the Gummel-Poon transport model (SPICE's equations) at normalized vbe, vbc. */
export function gummelPoon(
  q: BjtAtTemperature,
  vbe: number,
  vbc: number,
  gmin: number,
): Float64Array {
  junctionCurrent(vbe, q.csat, q.nf * q.vt);
  const cbe = junctionOut[0]!;
  const gbe = junctionOut[1]!;
  let cben = 0;
  let gben = 0;
  if (q.c2 !== 0) {
    junctionCurrent(vbe, q.c2, q.ne * q.vt);
    cben = junctionOut[0]!;
    gben = junctionOut[1]!;
  }
  cben += gmin * vbe;
  gben += gmin;
  junctionCurrent(vbc, q.csat, q.nr * q.vt);
  const cbc = junctionOut[0]!;
  const gbc = junctionOut[1]!;
  let cbcn = 0;
  let gbcn = 0;
  if (q.c4 !== 0) {
    junctionCurrent(vbc, q.c4, q.nc * q.vt);
    cbcn = junctionOut[0]!;
    gbcn = junctionOut[1]!;
  }
  cbcn += gmin * vbc;
  gbcn += gmin;
  // Base charge qb: Early effect (q1) and high injection (q2).
  const q1 = 1 / (1 - q.invVaf * vbc - q.invVar * vbe);
  let qb: number;
  let dqbdve: number;
  let dqbdvc: number;
  if (q.oik === 0 && q.oikr === 0) {
    qb = q1;
    dqbdve = q1 * qb * q.invVar;
    dqbdvc = q1 * qb * q.invVaf;
  } else {
    const q2 = q.oik * cbe + q.oikr * cbc;
    const arg = Math.max(0, 1 + 4 * q2);
    const sqarg = arg !== 0 ? Math.sqrt(arg) : 1;
    qb = (q1 * (1 + sqarg)) / 2;
    dqbdve = q1 * (qb * q.invVar + (q.oik * gbe) / sqarg);
    dqbdvc = q1 * (qb * q.invVaf + (q.oikr * gbc) / sqarg);
  }
  const go = (gbc + ((cbe - cbc) * dqbdvc) / qb) / qb;
  const cbcBr = cbc / q.br;
  gp[0] = (cbe - cbc) / qb - cbcBr - cbcn;
  gp[1] = cbe / q.bf + cben + cbcBr + cbcn;
  gp[2] = gbe / q.bf + gben;
  gp[3] = gbc / q.br + gbcn;
  gp[4] = (gbe - ((cbe - cbc) * dqbdve) / qb) / qb - go;
  gp[5] = go;
  // gx is read only when RB depends on the bias (RBM < RB); the division is skipped otherwise.
  if (q.rbpi > 0) {
    const rbx = q.rbpr + q.rbpi / qb;
    gp[6] = rbx > 0 ? 1 / rbx : 0;
  } else {
    gp[6] = 0;
  }
  return gp;
}

/** Unknown indices of a BJT: external terminals and the intrinsic nodes behind RC, RB, RE. */
export interface BjtNodes {
  c: number;
  b: number;
  e: number;
  ci: number;
  bi: number;
  ei: number;
}

/**
 * The BJT between its intrinsic nodes. RC and RE (and RB when RBM = RB) are linear and stamped
 * by the caller; a bias-dependent RB (RBM < RB) is stamped here because it depends on qb.
 */
export function makeBjtStamp(
  name: string,
  nd: BjtNodes,
  q: BjtAtTemperature,
  stride: number,
): DeviceStamp<BjtOp> {
  const { ci, bi, ei, b } = nd;
  const t = q.type;
  const at = (r: number, c: number): number => r * stride + c;
  const cc = at(ci, ci),
    cb = at(ci, bi),
    ce = at(ci, ei);
  const bc = at(bi, ci),
    bb = at(bi, bi),
    be = at(bi, ei);
  const ec = at(ei, ci),
    eb = at(ei, bi),
    ee = at(ei, ei);
  const variableRb = q.rbpi > 0;
  const xbb = at(b, b),
    xbbi = at(b, bi),
    xbib = at(bi, b),
    xbibi = at(bi, bi);
  // Junction voltages of the last load (limiting memory), [vbe, vbc], in a typed array: a double
  // held in a closure variable is boxed anew on every store.
  const old = new Float64Array(2);
  let pendingSeed = true;
  /** Operating quantities at the solution x (no limiting). */
  const operatingPoint = (x: Float64Array, gmin: number): BjtOp => {
    const vbeI = t * (x[bi]! - x[ei]!);
    const vbcI = t * (x[bi]! - x[ci]!);
    const r = gummelPoon(q, vbeI, vbcI, gmin);
    const ic = t * r[0]!;
    const ib = t * r[1]!;
    const ie = -ic - ib;
    const vbe = x[nd.b]! - x[nd.e]!;
    const vbc = x[nd.b]! - x[nd.c]!;
    const beOn = vbeI >= q.vonBe;
    const bcOn = vbcI >= q.vonBc;
    const region = beOn ? (bcOn ? 'saturation' : 'active') : bcOn ? 'reverse-active' : 'cut-off';
    const gpi = r[2]!;
    const go = r[5]!;
    const gm = r[4]!;
    return {
      kind: 'Q',
      polarity: t === 1 ? 'NPN' : 'PNP',
      region,
      ic,
      ib,
      ie,
      vbe,
      vce: vbe - vbc,
      vbc,
      gm,
      rpi: 1 / gpi,
      ro: go === 0 ? Infinity : 1 / go,
      betaDc: ic / ib,
      betaAc: gm / gpi,
      power: ic * x[nd.c]! + ib * x[nd.b]! + ie * x[nd.e]!,
    };
  };
  return {
    name,
    ports: [
      { label: 'BE', p: bi, m: ei, polarity: t, nvt: q.nf * q.vt },
      { label: 'BC', p: bi, m: ci, polarity: t, nvt: q.nr * q.vt },
    ],
    seed(x) {
      pendingSeed = x === null;
      if (x) {
        old[0] = t * (x[bi]! - x[ei]!);
        old[1] = t * (x[bi]! - x[ci]!);
      }
    },
    load(x, a, rhs, gmin) {
      const vbeRaw = t * (x[bi]! - x[ei]!);
      const vbcRaw = t * (x[bi]! - x[ci]!);
      let vbe: number;
      let vbc: number;
      let limited: boolean;
      if (pendingSeed) {
        vbe = q.vcrit;
        vbc = 0;
        pendingSeed = false;
        limited = true;
      } else {
        vbe = limitJunction(vbeRaw, old[0]!, q.vt, q.vcrit);
        vbc = limitJunction(vbcRaw, old[1]!, q.vt, q.vcrit);
        limited = vbe !== vbeRaw || vbc !== vbcRaw;
      }
      old[0] = vbe;
      old[1] = vbc;
      const r = gummelPoon(q, vbe, vbc, gmin);
      const icc = r[0]!,
        ib = r[1]!,
        gpi = r[2]!,
        gmu = r[3]!,
        gm = r[4]!,
        go = r[5]!;
      a[cc]! += gmu + go;
      a[cb]! += gm - gmu;
      a[ce]! -= gm + go;
      a[bc]! -= gmu;
      a[bb]! += gpi + gmu;
      a[be]! -= gpi;
      a[ec]! -= go;
      a[eb]! -= gm + gpi;
      a[ee]! += gm + go + gpi;
      const ieqC = icc - (gm + go) * vbe + (go + gmu) * vbc;
      const ieqB = ib - gpi * vbe - gmu * vbc;
      rhs[ci]! -= t * ieqC;
      rhs[bi]! -= t * ieqB;
      rhs[ei]! += t * (ieqC + ieqB);
      if (variableRb) {
        const gx = r[6]!;
        a[xbb]! += gx;
        a[xbbi]! -= gx;
        a[xbib]! -= gx;
        a[xbibi]! += gx;
      }
      return limited;
    },
    report(x, gmin) {
      const op = operatingPoint(x, gmin);
      return {
        op,
        terminals: [
          { node: nd.c, current: op.ic },
          { node: nd.b, current: op.ib },
          { node: nd.e, current: op.ie },
        ],
      };
    },
    reportInto(x, gmin, kcl) {
      const op = operatingPoint(x, gmin);
      kcl[nd.c]! += op.ic;
      kcl[nd.b]! += op.ib;
      kcl[nd.e]! += op.ie;
      return op;
    },
    linearize(x, gmin): LinearPart[] {
      const r = gummelPoon(q, t * (x[bi]! - x[ei]!), t * (x[bi]! - x[ci]!), gmin);
      const parts: LinearPart[] = [
        { label: 'rpi', kind: 'g', nodes: [bi, ei], value: r[2]! },
        { label: 'rmu', kind: 'g', nodes: [bi, ci], value: r[3]! },
        { label: 'gm', kind: 'vccs', nodes: [ci, ei, bi, ei], value: r[4]! },
      ];
      if (r[5]! !== 0) parts.push({ label: 'ro', kind: 'g', nodes: [ci, ei], value: r[5]! });
      if (variableRb) parts.push({ label: 'rb', kind: 'g', nodes: [b, bi], value: r[6]! });
      return parts;
    },
  };
}
