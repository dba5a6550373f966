/**
 * Newton step limiting for junctions and MOS gates, after the SPICE2/SPICE3 routines: an
 * exponential junction may not be moved by more than a few VT per iteration above its critical
 * voltage, otherwise the linearization overflows and Newton oscillates.
 */

/** Limits a junction voltage step (pnjlim). `vt` is the junction's N·VT, `vcrit` its critical voltage. */
export function limitJunction(vnew: number, vold: number, vt: number, vcrit: number): number {
  if (vnew > vcrit && Math.abs(vnew - vold) > vt + vt) {
    if (vold > 0) {
      const arg = 1 + (vnew - vold) / vt;
      return arg > 0 ? vold + vt * Math.log(arg) : vcrit;
    }
    return vt * Math.log(vnew / vt);
  }
  if (vnew < 0) {
    const floor = vold > 0 ? -vold - 1 : 2 * vold - 1;
    if (vnew < floor) return floor;
  }
  return vnew;
}

/** Critical voltage of a junction: where its I–V curve has the smallest radius of curvature. */
export function criticalVoltage(vt: number, isat: number): number {
  return vt * Math.log(vt / (Math.SQRT2 * isat));
}

/** Limits a MOS gate-source (or gate-drain) step around the threshold `vto` (fetlim). */
export function limitGate(vnew: number, vold: number, vto: number): number {
  const vtsthi = Math.abs(2 * (vold - vto)) + 2;
  const vtstlo = vtsthi / 2 + 2;
  const vtox = vto + 3.5;
  const delv = vnew - vold;
  if (vold >= vto) {
    if (vold >= vtox) {
      if (delv <= 0) {
        if (vnew >= vtox) return -delv > vtstlo ? vold - vtstlo : vnew;
        return Math.max(vnew, vto + 2);
      }
      return delv >= vtsthi ? vold + vtsthi : vnew;
    }
    return delv <= 0 ? Math.max(vnew, vto - 0.5) : Math.min(vnew, vto + 4);
  }
  if (delv <= 0) return -delv > vtsthi ? vold - vtsthi : vnew;
  const vtemp = vto + 0.5;
  if (vnew <= vtemp) return delv > vtstlo ? vold + vtstlo : vnew;
  return vtemp;
}

/** Limits a MOS drain-source step (limvds). */
export function limitDrainSource(vnew: number, vold: number): number {
  if (vold >= 3.5) {
    if (vnew > vold) return Math.min(vnew, 3 * vold + 2);
    return vnew < 3.5 ? Math.max(vnew, 2) : vnew;
  }
  return vnew > vold ? Math.min(vnew, 4) : Math.max(vnew, -0.5);
}
