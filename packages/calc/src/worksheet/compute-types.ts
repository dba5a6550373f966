import type { AcSweepResult } from '../ac.ts';
import type { OperatingPoint } from '../dc.ts';
import type { DiodeLawComparison } from '../compare.ts';
import type { DeviceSmallSignal } from '../linearize.ts';
import type { LoadLineResult } from '../load-line.ts';
import type { SignalSizeResult } from '../signal-size.ts';
import type { Phasor } from '../small-signal.ts';
import type { WorksheetVariationResults } from '../variation/worksheet-variation.ts';

/**
 * What a worksheet computation answers, as plain data: the browser preview shows it and the
 * server stores it with the revision. It holds no timings, so the same inputs always give the
 * same results (the stored content hash depends on that).
 */

/** An engine failure, with what it is about (names lowercase, as the engine reports them). */
export interface ComputeError {
  code: string;
  message: string;
  element?: string;
  node?: string;
}

export type Outcome<T> = { ok: true; value: T } | { ok: false; error: ComputeError };

/** A part of the results that needs a setting the author has not made yet. */
export interface Missing {
  ok: false;
  missing: string;
}

export interface SmallSignalFigures {
  /** Hz */
  frequency: number;
  gain: Phasor & { db: number };
  zin: Phasor;
  zout: Phasor;
  /** `V/V` for a voltage-source input, `Ω` (transimpedance) for a current-source input. */
  gainUnit: 'V/V' | 'Ω';
}

export type SweepFigures = Omit<AcSweepResult, 'operatingPoint' | 're' | 'im'>;
export type SignalSizeFigures = Omit<SignalSizeResult, 'operatingPoint'>;

export interface SolvedWorksheet {
  status: 'solved';
  /** The bias point with the chosen diode law. */
  bias: OperatingPoint;
  /** Every diode law side by side; null when the circuit has no diode. */
  comparison: Outcome<DiodeLawComparison> | null;
  /** Each device's small-signal parameters at the full-model bias point. */
  devices: Outcome<Record<string, DeviceSmallSignal>>;
  smallSignal: Outcome<SmallSignalFigures> | Missing;
  sweep: Outcome<SweepFigures> | Missing;
  signalSize: Outcome<SignalSizeFigures> | Missing;
  /** One picture per diode and per BJT, in circuit order. */
  loadLines: { device: string; result: Outcome<LoadLineResult> }[];
  /** Limits, hand checks, stress, corners, temperatures…; only when the settings have a variation section. */
  variation?: WorksheetVariationResults;
}

export type WorksheetResults =
  { status: 'empty' } | { status: 'failed'; error: ComputeError } | SolvedWorksheet;

export function isMissing(x: Outcome<unknown> | Missing): x is Missing {
  return !x.ok && 'missing' in x;
}
