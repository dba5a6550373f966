/**
 * The interface between the MNA assembly and a nonlinear device. Each device gets its matrix and
 * right-hand-side positions once, when the system is built, and then only adds numbers.
 */

/** A terminal current of a device at a solution: the node's unknown index and the current into the device, A. */
export interface TerminalCurrent {
  /** Unknown index of the node (the system's ground index for ground). */
  node: number;
  /** Current flowing from the node into the device terminal, A. */
  current: number;
}

/** What a device reports at a converged solution. */
export interface DeviceReport<Op> {
  /** The operating quantities shown to the user. */
  op: Op;
  /** Currents into the external terminals, in the element's terminal order. */
  terminals: TerminalCurrent[];
}

/** The small-signal conductance between two unknowns of the system, or a VCCS (see linearize). */
export interface LinearPart {
  /** Label of the part, e.g. `gm`, `rpi`. */
  label: string;
  /** `g`: conductance between nodes[0] and nodes[1]; `vccs`: current gain·V(nodes[2],nodes[3]) from nodes[0] to nodes[1]. */
  kind: 'g' | 'vccs';
  /** Unknown indices (ground index for ground). */
  nodes: number[];
  /** Conductance or transconductance, S. */
  value: number;
}

/** A controlling voltage of a device, between two unknowns, with the voltage scale of its nonlinearity. */
export interface ControlPort {
  /** `D` diode junction, `BE`/`BC` BJT junctions, `GS` MOSFET gate-source. */
  label: 'D' | 'BE' | 'BC' | 'GS';
  /** Unknown indices (intrinsic nodes): the port voltage is x[p] − x[m] (times the polarity for BJT/MOSFET). */
  p: number;
  m: number;
  /** +1, or −1 for PNP and PMOS. */
  polarity: 1 | -1;
  /** N·VT of a junction, V; 0 for a MOSFET gate (its scale is the overdrive at Q). */
  nvt: number;
}

export interface DeviceStamp<Op = unknown> {
  /** Lowercase element name. */
  readonly name: string;
  /** The device's controlling ports (junctions, gate). */
  readonly ports: ControlPort[];
  /** Resets the limiting memory: from the junction voltages in x, or to SPICE's initial guesses when x is null. */
  seed(x: Float64Array | null): void;
  /** Adds the linearization at x to (a, b). Returns true when a junction or gate step was limited. */
  load(x: Float64Array, a: Float64Array, b: Float64Array, gmin: number): boolean;
  /** Operating quantities and terminal currents at the solution x (no limiting). */
  report(x: Float64Array, gmin: number): DeviceReport<Op>;
  /**
   * The operating quantities of {@link report}; instead of returning the terminal currents, adds
   * each to `kcl[node]`, in terminal order (no arrays for the result builder to allocate).
   */
  reportInto(x: Float64Array, gmin: number, kcl: Float64Array): Op;
  /** The device's small-signal equivalent at the solution x. */
  linearize(x: Float64Array, gmin: number): LinearPart[];
}

/** Matrix offsets of the four entries a two-terminal conductance touches. */
export function pairOffsets(
  p: number,
  m: number,
  stride: number,
): [number, number, number, number] {
  return [p * stride + p, p * stride + m, m * stride + p, m * stride + m];
}

/** Minimum forward diffusion current for a junction to count as conducting when naming regions, A per unit area. */
export const JUNCTION_ON_CURRENT = 1e-9;

/**
 * Junction voltage above which the junction's diffusion current exceeds {@link JUNCTION_ON_CURRENT}
 * (per unit area) — the boundary the engine uses between "off" and "forward"/"active".
 */
export function conductionVoltage(nvt: number, isat: number, area: number): number {
  return nvt * Math.log1p((JUNCTION_ON_CURRENT * area) / isat);
}
