import { limitDrainSource, limitGate, limitJunction } from './limiting.ts';
import { shichmanHodges, type MosfetAtTemperature, type MosfetOp } from './mosfet.ts';
import type { DeviceStamp, LinearPart } from './stamp.ts';

/** Unknown indices of a MOSFET: external terminals and the intrinsic drain/source behind RD/RS. */
export interface MosfetNodes {
  d: number;
  g: number;
  s: number;
  b: number;
  di: number;
  si: number;
}

/** Bulk junction current and conductance with SPICE's level-1 form: [c, g]. */
const bulk = new Float64Array(2);
function bulkJunction(v: number, isat: number, vt: number, gmin: number): void {
  if (v <= -3 * vt) {
    bulk[1] = gmin;
    bulk[0] = gmin * v - isat;
  } else {
    const e = Math.exp(Math.min(709, v / vt));
    bulk[1] = (isat * e) / vt + gmin;
    bulk[0] = isat * (e - 1) + gmin * v;
  }
}

/** The level-1 MOSFET between its intrinsic nodes; RD and RS are linear and stamped by the caller. */
export function makeMosfetStamp(
  name: string,
  nd: MosfetNodes,
  m: MosfetAtTemperature,
  stride: number,
): DeviceStamp<MosfetOp> {
  const { g, b, di, si } = nd;
  const t = m.type;
  // Limiting memory of the last load, [vgs, vds, vbs, von], in a typed array: a double held in a
  // closure variable is boxed anew on every store.
  const old = new Float64Array([0, 0, 0, m.vto]);
  let pendingSeed = true;

  /** Stamps a conductance-controlled channel from `p` to `q` with control columns. */
  const channel = (
    a: Float64Array,
    p: number,
    q: number,
    gm: number,
    gds: number,
    gmbs: number,
  ): void => {
    const rp = p * stride,
      rq = q * stride;
    a[rp + g]! += gm;
    a[rp + p]! += gds;
    a[rp + b]! += gmbs;
    a[rp + q]! -= gm + gds + gmbs;
    a[rq + g]! -= gm;
    a[rq + p]! -= gds;
    a[rq + b]! -= gmbs;
    a[rq + q]! += gm + gds + gmbs;
  };
  const conductance = (a: Float64Array, p: number, q: number, gv: number): void => {
    a[p * stride + p]! += gv;
    a[p * stride + q]! -= gv;
    a[q * stride + p]! -= gv;
    a[q * stride + q]! += gv;
  };

  /** Source and bulk currents of the last operatingPoint, A: [is, ib]. */
  const currents = new Float64Array(2);
  /** Operating quantities at the solution x (no limiting). */
  const operatingPoint = (x: Float64Array, gmin: number): MosfetOp => {
    const vgs = t * (x[g]! - x[si]!);
    const vds = t * (x[di]! - x[si]!);
    const vbs = t * (x[b]! - x[si]!);
    const vbd = vbs - vds;
    const mode = vds >= 0 ? 1 : -1;
    const r =
      mode === 1 ? shichmanHodges(m, vgs, vds, vbs) : shichmanHodges(m, vgs - vds, -vds, vbd);
    const cdrain = r[0]!,
      gm = r[1]!,
      gds = r[2]!,
      gmbs = r[3]!,
      von = r[4]!;
    const vgst = (mode === 1 ? vgs : vgs - vds) - von;
    bulkJunction(vbs, m.isat, m.vt, gmin);
    const cbs = bulk[0]!;
    bulkJunction(vbd, m.isat, m.vt, gmin);
    const cbd = bulk[0]!;
    const id = t * (mode * cdrain - cbd);
    const is = t * (-mode * cdrain - cbs);
    const ib = t * (cbd + cbs);
    const region = vgst <= 0 ? 'cut-off' : vgst <= vds * mode ? 'saturation' : 'triode';
    currents[0] = is;
    currents[1] = ib;
    return {
      kind: 'M',
      polarity: t === 1 ? 'NMOS' : 'PMOS',
      region,
      id,
      vgs: x[g]! - x[nd.s]!,
      vds: x[nd.d]! - x[nd.s]!,
      vbs: x[b]! - x[nd.s]!,
      vth: t * von,
      gm,
      gmb: gmbs,
      ro: gds === 0 ? Infinity : 1 / gds,
      power: id * x[nd.d]! + is * x[nd.s]! + ib * x[b]!,
    };
  };
  return {
    name,
    ports: [{ label: 'GS', p: g, m: si, polarity: t, nvt: 0 }],
    seed(x) {
      pendingSeed = x === null;
      if (x) {
        old[0] = t * (x[g]! - x[si]!);
        old[1] = t * (x[di]! - x[si]!);
        old[2] = t * (x[b]! - x[si]!);
      }
      old[3] = m.vto;
    },
    load(x, a, rhs, gmin) {
      let vgs = t * (x[g]! - x[si]!);
      let vds = t * (x[di]! - x[si]!);
      let vbs = t * (x[b]! - x[si]!);
      let limited = false;
      if (pendingSeed) {
        vbs = -1;
        vgs = m.vto;
        vds = 0;
        pendingSeed = false;
        limited = true;
      } else {
        const vgsOld = old[0]!,
          vdsOld = old[1]!,
          vbsOld = old[2]!,
          vonOld = old[3]!;
        let ngs = vgs,
          nds = vds,
          nbs = vbs;
        const vgd = vgs - vds;
        if (vdsOld >= 0) {
          ngs = limitGate(vgs, vgsOld, vonOld);
          const nds0 = ngs - vgd;
          nds = limitDrainSource(nds0, vdsOld);
          limited = ngs !== vgs || nds !== nds0;
        } else {
          const ngd = limitGate(vgd, vgsOld - vdsOld, vonOld);
          const nds0 = vgs - ngd;
          nds = -limitDrainSource(-nds0, -vdsOld);
          ngs = ngd + nds;
          limited = ngd !== vgd || nds !== nds0;
        }
        if (nds >= 0) {
          nbs = limitJunction(vbs, vbsOld, m.vt, m.vcrit);
          limited ||= nbs !== vbs;
        } else {
          const vbd = vbs - nds;
          const nbd = limitJunction(vbd, vbsOld - vdsOld, m.vt, m.vcrit);
          limited ||= nbd !== vbd;
          nbs = nbd + nds;
        }
        if (limited) {
          vgs = ngs;
          vds = nds;
          vbs = nbs;
        }
      }
      old[0] = vgs;
      old[1] = vds;
      old[2] = vbs;
      const vbd = vbs - vds;
      const forward = vds >= 0;
      const r = forward
        ? shichmanHodges(m, vgs, vds, vbs)
        : shichmanHodges(m, vgs - vds, -vds, vbd);
      const cdrain = r[0]!,
        gm = r[1]!,
        gds = r[2]!,
        gmbs = r[3]!;
      old[3] = r[4]!;
      const de = forward ? di : si;
      const se = forward ? si : di;
      const vgsE = forward ? vgs : vgs - vds;
      const vdsE = forward ? vds : -vds;
      const vbsE = forward ? vbs : vbd;
      channel(a, de, se, gm, gds, gmbs);
      const ieq = cdrain - gm * vgsE - gds * vdsE - gmbs * vbsE;
      rhs[de]! -= t * ieq;
      rhs[se]! += t * ieq;
      bulkJunction(vbs, m.isat, m.vt, gmin);
      conductance(a, b, si, bulk[1]!);
      let beq = bulk[0]! - bulk[1]! * vbs;
      rhs[b]! -= t * beq;
      rhs[si]! += t * beq;
      bulkJunction(vbd, m.isat, m.vt, gmin);
      conductance(a, b, di, bulk[1]!);
      beq = bulk[0]! - bulk[1]! * vbd;
      rhs[b]! -= t * beq;
      rhs[di]! += t * beq;
      return limited;
    },
    report(x, gmin) {
      const op = operatingPoint(x, gmin);
      return {
        op,
        terminals: [
          { node: nd.d, current: op.id },
          { node: g, current: 0 },
          { node: nd.s, current: currents[0]! },
          { node: b, current: currents[1]! },
        ],
      };
    },
    reportInto(x, gmin, kcl) {
      const op = operatingPoint(x, gmin);
      kcl[nd.d]! += op.id;
      kcl[g]! += 0;
      kcl[nd.s]! += currents[0]!;
      kcl[b]! += currents[1]!;
      return op;
    },
    linearize(x, gmin): LinearPart[] {
      const vgs = t * (x[g]! - x[si]!);
      const vds = t * (x[di]! - x[si]!);
      const vbs = t * (x[b]! - x[si]!);
      const vbd = vbs - vds;
      const forward = vds >= 0;
      const r = forward
        ? shichmanHodges(m, vgs, vds, vbs)
        : shichmanHodges(m, vgs - vds, -vds, vbd);
      const [de, se] = forward ? [di, si] : [si, di];
      const parts: LinearPart[] = [];
      if (r[1]! !== 0)
        parts.push({ label: 'gm', kind: 'vccs', nodes: [de, se, g, se], value: r[1]! });
      if (r[3]! !== 0)
        parts.push({ label: 'gmb', kind: 'vccs', nodes: [de, se, b, se], value: r[3]! });
      if (r[2]! !== 0) parts.push({ label: 'ro', kind: 'g', nodes: [de, se], value: r[2]! });
      bulkJunction(vbd, m.isat, m.vt, gmin);
      parts.push({ label: 'gbd', kind: 'g', nodes: [b, di], value: bulk[1]! });
      bulkJunction(vbs, m.isat, m.vt, gmin);
      parts.push({ label: 'gbs', kind: 'g', nodes: [b, si], value: bulk[1]! });
      return parts;
    },
  };
}
