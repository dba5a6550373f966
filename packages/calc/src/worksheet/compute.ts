import { runAcSweep } from '../ac.ts';
import type { Element } from '../circuit.ts';
import { compareDiodeLaws } from '../compare.ts';
import { solveOperatingPoint, type OperatingPointOptions } from '../dc.ts';
import { isEngineError } from '../errors.ts';

import { loadLine } from '../load-line.ts';
import { checkSignalSize } from '../signal-size.ts';
import { linearizeCircuit, smallSignalAt } from '../small-signal.ts';
import { computeVariation } from '../variation/worksheet-variation.ts';
import type {
  ComputeError,
  Missing,
  Outcome,
  SignalSizeFigures,
  SmallSignalFigures,
  SolvedWorksheet,
  SweepFigures,
  WorksheetResults,
} from './compute-types.ts';
import { sameName, type DraftCircuit, type WorksheetDraft } from './draft.ts';
import type { AnalysisSettings } from './settings.ts';

/**
 * Runs every analysis a worksheet shows, for one draft. Pure and synchronous: the browser runs
 * it in a worker for the preview, the server runs the same function for the stored results, so
 * the two agree by construction. A failing bias point fails the whole computation (nothing
 * else has a Q-point to work from); a later analysis that fails reports its own error beside
 * the others.
 */
export function computeWorksheet(draft: WorksheetDraft): WorksheetResults {
  const { circuit, settings } = draft;
  if (circuit.elements.length === 0) return { status: 'empty' };
  const temperature = settings.temperature;
  const lawOptions: Omit<OperatingPointOptions, 'diodeLaw'> = {
    temperature,
    constantDrop: { vOn: settings.constantDrop.vOn },
    piecewiseLinear: { v0: settings.piecewiseLinear.v0, rd: settings.piecewiseLinear.rd },
  };

  const bias = attempt(() =>
    solveOperatingPoint(circuit, { ...lawOptions, diodeLaw: settings.diodeLaw }),
  );
  if (!bias.ok) return { status: 'failed', error: bias.error };

  const hasDiodes = circuit.elements.some((el) => el.kind === 'D');
  const comparison = hasDiodes ? attempt(() => compareDiodeLaws(circuit, lawOptions)) : null;
  const devices = attempt(() => linearizeCircuit(circuit, { temperature }).devices);

  const input = circuit.elements.find(
    (el) => (el.kind === 'V' || el.kind === 'I') && sameName(el.name, settings.inputSource),
  );
  const signal =
    input && settings.outputNode !== ''
      ? signalAnalyses(circuit, settings, input)
      : missingSignal(
          input
            ? 'Choose the output node in the analysis settings.'
            : 'Choose the input source in the analysis settings.',
        );

  const loadLines = circuit.elements
    .filter((el) => el.kind === 'D' || el.kind === 'Q')
    .map((el) => ({
      device: el.name.toLowerCase(),
      result: attempt(() => loadLine(circuit, { device: el.name, temperature })),
    }));

  const solved: SolvedWorksheet = {
    status: 'solved',
    bias: bias.value,
    comparison,
    devices,
    ...signal,
    loadLines,
  };
  // Only with a variation section, so that every other worksheet keeps its results (and hash).
  if (settings.variation) {
    const smallSignal = signal.smallSignal.ok ? signal.smallSignal.value : undefined;
    solved.variation = computeVariation({
      circuit,
      settings,
      variation: settings.variation,
      source: { bias: bias.value, smallSignal },
    });
  }
  return solved;
}

export function toComputeError(e: unknown): ComputeError {
  if (isEngineError(e)) {
    return {
      code: e.code,
      message: e.message,
      ...(e.details.element ? { element: e.details.element } : {}),
      ...(e.details.node ? { node: e.details.node } : {}),
    };
  }
  return { code: 'internal', message: e instanceof Error ? e.message : String(e) };
}

function attempt<T>(run: () => T): Outcome<T> {
  try {
    return { ok: true, value: run() };
  } catch (e) {
    return { ok: false, error: toComputeError(e) };
  }
}

/** The circuit with only the input source carrying a 1 V (or 1 A) AC stimulus. */
function drivenBy(circuit: DraftCircuit, input: string): DraftCircuit {
  const elements = circuit.elements.map((el): Element => {
    if (el.kind !== 'V' && el.kind !== 'I') return el;
    const { ac: _ac, ...rest } = el;
    return sameName(el.name, input) ? { ...rest, ac: { mag: 1, phase: 0 } } : rest;
  });
  return { ...circuit, elements };
}

type SignalAnalyses = Pick<SolvedWorksheet, 'smallSignal' | 'sweep' | 'signalSize'>;

function missingSignal(text: string): SignalAnalyses {
  const missing: Missing = { ok: false, missing: text };
  return { smallSignal: missing, sweep: missing, signalSize: missing };
}

/** Gain and impedances at the chosen frequency, the Bode sweep and the signal-size check. */
function signalAnalyses(
  circuit: DraftCircuit,
  settings: AnalysisSettings,
  input: Element,
): SignalAnalyses {
  const { temperature, outputNode: output } = settings;
  const smallSignal = attempt((): SmallSignalFigures => {
    const r = smallSignalAt(circuit, {
      input: input.name,
      output,
      frequency: settings.frequency,
      temperature,
    });
    const gainUnit = input.kind === 'I' ? 'Ω' : 'V/V';
    return { frequency: r.frequency, gain: r.gain, zin: r.zin, zout: r.zout, gainUnit };
  });
  const sweep = attempt((): SweepFigures => {
    const r = runAcSweep(drivenBy(circuit, input.name), {
      sweep: settings.sweep,
      probe: output,
      temperature,
    });
    const { freq, db, deg, midbandDb, lowCornerHz, highCornerHz } = r;
    return { freq, db, deg, midbandDb, lowCornerHz, highCornerHz };
  });
  const signalSize = attempt((): SignalSizeFigures => {
    const { operatingPoint: _op, ...figures } = checkSignalSize(circuit, {
      input: input.name,
      output,
      amplitude: settings.amplitude,
      errorLimit: settings.errorLimit,
      temperature,
    });
    return figures;
  });
  return { smallSignal, sweep, signalSize };
}
