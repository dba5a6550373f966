import type { DeviceOp, OperatingPoint } from './dc.ts';

/**
 * The JSON shape `biasproof op` prints: a stable, documented subset of the operating point that
 * scripts outside the engine can rely on. Names are lowercased here as well, so that the shape
 * holds whatever the solver keys by.
 */

/** One device as printed: its letter, its region and the quantities listed for its kind. */
export type DeviceReport = { kind: DeviceOp['kind']; region: string } & Record<
  string,
  number | string
>;

export interface OpReport {
  /** Node voltages in V. */
  nodes: Record<string, number>;
  /** Voltage-source currents in A, positive into the + terminal. */
  sources: Record<string, number>;
  devices: Record<string, DeviceReport>;
}

/** Quantities printed per device: diode id vd rd; BJT ic ib vbe vce gm rpi ro; MOSFET id vgs vds gm gmb ro. */
function deviceReport(d: DeviceOp): DeviceReport {
  switch (d.kind) {
    case 'D':
      return { kind: d.kind, region: d.region, id: d.id, vd: d.vd, rd: d.rd };
    case 'Q':
      return {
        kind: d.kind,
        region: d.region,
        ic: d.ic,
        ib: d.ib,
        vbe: d.vbe,
        vce: d.vce,
        gm: d.gm,
        rpi: d.rpi,
        ro: d.ro,
      };
    case 'M':
      return {
        kind: d.kind,
        region: d.region,
        id: d.id,
        vgs: d.vgs,
        vds: d.vds,
        gm: d.gm,
        gmb: d.gmb,
        ro: d.ro,
      };
  }
}

const lowercaseKeys = <T>(record: Record<string, T>): Record<string, T> =>
  Object.fromEntries(Object.entries(record).map(([k, v]) => [k.toLowerCase(), v]));

export function opReport(op: OperatingPoint): OpReport {
  const devices = Object.fromEntries(
    Object.entries(op.devices).map(([name, d]) => [name.toLowerCase(), deviceReport(d)]),
  );
  return { nodes: lowercaseKeys(op.nodes), sources: lowercaseKeys(op.sources), devices };
}
