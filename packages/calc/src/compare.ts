import type { CircuitInput } from './circuit.ts';
import { solveOperatingPoint } from './dc.ts';
import { isEngineError, type EngineErrorCode } from './errors.ts';
import type { DeviceOp, OperatingPoint } from './operating-point.ts';
import { DIODE_LAWS, type DiodeLaw, type OperatingPointOptions } from './options.ts';

/**
 * The same circuit's bias point under every diode law, each compared with the exponential
 * (Shockley) result — the evidence an author gives for using a quick hand-analysis law.
 */

/** Below this magnitude a reference value counts as zero and gets no percentage, V or A. */
const ZERO = 1e-12;

export interface LawComparison {
  law: DiodeLaw;
  /** The law's bias point; null when it could not be solved (see `error`). */
  operatingPoint: OperatingPoint | null;
  /** Why the law could not be solved; null when it was. */
  error: { code: EngineErrorCode; message: string } | null;
  /** (law − exponential)/|exponential|·100 per node, %; null where the exponential value is about 0. */
  nodeDifferencePercent: Record<string, number | null>;
  /** Same for each device's main current (diode id, BJT ic, MOSFET id), %. */
  currentDifferencePercent: Record<string, number | null>;
}

export interface DiodeLawComparison {
  /** The exponential-law bias point every law is compared with. */
  reference: OperatingPoint;
  /** One entry per law, exponential first (its differences are 0). */
  laws: LawComparison[];
}

const mainCurrent = (d: DeviceOp): number => (d.kind === 'Q' ? d.ic : d.id);
const percent = (value: number, ref: number): number | null =>
  Math.abs(ref) < ZERO ? null : ((value - ref) / Math.abs(ref)) * 100;

export function compareDiodeLaws(
  circuit: CircuitInput,
  options: Omit<OperatingPointOptions, 'diodeLaw'> = {},
): DiodeLawComparison {
  const reference = solveOperatingPoint(circuit, { ...options, diodeLaw: 'exponential' });
  const laws = DIODE_LAWS.map((law): LawComparison => {
    let op: OperatingPoint;
    try {
      op =
        law === 'exponential'
          ? reference
          : solveOperatingPoint(circuit, { ...options, diodeLaw: law });
    } catch (e) {
      if (!isEngineError(e)) throw e;
      return {
        law,
        operatingPoint: null,
        error: { code: e.code, message: e.message },
        nodeDifferencePercent: {},
        currentDifferencePercent: {},
      };
    }
    const nodeDifferencePercent: Record<string, number | null> = {};
    for (const [n, v] of Object.entries(reference.nodes))
      nodeDifferencePercent[n] = percent(op.nodes[n]!, v);
    const currentDifferencePercent: Record<string, number | null> = {};
    for (const [name, d] of Object.entries(reference.devices))
      currentDifferencePercent[name] = percent(mainCurrent(op.devices[name]!), mainCurrent(d));
    return {
      law,
      operatingPoint: op,
      error: null,
      nodeDifferencePercent,
      currentDifferencePercent,
    };
  });
  return { reference, laws };
}
