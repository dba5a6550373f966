import type { DeviceOp, OperatingPoint } from './dc.ts';
import type { CornersResult } from './variation/corners.ts';
import type { MonteCarloResult } from './variation/monte-carlo.ts';

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

/** What `biasproof mc` prints: the sample count, the failures and the statistics of one probe. */
export interface McReport {
  samples: number;
  failed: number;
  mean: number;
  sigma: number;
  min: number;
  max: number;
  p00135: number;
  p50: number;
  p99865: number;
}

export function mcReport(result: MonteCarloResult, probe: string): McReport {
  const s = result.probes[probe]!.statistics;
  return {
    samples: result.samples,
    failed: result.failed,
    mean: s.mean,
    sigma: s.sigma,
    min: s.min,
    max: s.max,
    p00135: s.p00135,
    p50: s.p50,
    p99865: s.p99865,
  };
}

/** What `biasproof corners` prints: the extremes of one probe and the parameter values at each. */
export interface CornersReport {
  min: number | null;
  max: number | null;
  minAt: Record<string, number>;
  maxAt: Record<string, number>;
}

export function cornersReport(result: CornersResult, probe: string): CornersReport {
  const p = result.probes[probe]!;
  return { min: p.min, max: p.max, minAt: p.minAt, maxAt: p.maxAt };
}
