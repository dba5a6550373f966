import { describe, expect, it } from 'vitest';
import {
  analysisSettingsSchema,
  computeWorksheet,
  solveOperatingPoint,
  worksheetDraftSchema,
  type WorksheetDraft,
} from '../src/index.ts';

// Example values for tests only.
function diodeDraft(): WorksheetDraft {
  return worksheetDraftSchema.parse({
    circuit: {
      title: 'Diode bias network',
      elements: [
        { kind: 'V', name: 'V1', nodes: ['in', '0'], dc: 5 },
        { kind: 'R', name: 'R1', nodes: ['in', 'out'], value: 1000 },
        { kind: 'D', name: 'D1', nodes: ['out', '0'], model: 'DSIG' },
      ],
      models: [{ name: 'DSIG', kind: 'D', params: { IS: 1e-14, N: 1 } }],
    },
    settings: { inputSource: 'V1', outputNode: 'out' },
  });
}

describe('computeWorksheet', () => {
  it('when the draft is solvable, then its bias point is the engine’s own and every view has data', () => {
    const draft = diodeDraft();
    const r = computeWorksheet(draft);
    if (r.status !== 'solved') throw new Error(`expected solved, got ${r.status}`);
    expect(r.bias.nodes).toEqual(solveOperatingPoint(draft.circuit).nodes);
    expect(r.comparison?.ok).toBe(true);
    expect(r.smallSignal.ok).toBe(true);
    expect(r.sweep.ok).toBe(true);
    expect(r.signalSize.ok).toBe(true);
    expect(r.loadLines.map((l) => l.device)).toEqual(['d1']);
  });

  it('when computed twice, then the results are identical (no timings, nothing random)', () => {
    expect(JSON.stringify(computeWorksheet(diodeDraft()))).toBe(
      JSON.stringify(computeWorksheet(diodeDraft())),
    );
  });

  it('when the circuit is empty, then the answer says so', () => {
    expect(
      computeWorksheet({ ...diodeDraft(), circuit: { title: '', elements: [], models: [] } }),
    ).toEqual({
      status: 'empty',
    });
  });

  it('when the bias point cannot be solved, then the error names the element', () => {
    const draft = diodeDraft();
    draft.circuit.models = [];
    const r = computeWorksheet(draft);
    expect(r.status).toBe('failed');
    if (r.status === 'failed')
      expect(r.error).toMatchObject({ code: 'unknown-model', element: 'd1' });
  });

  it('when no input source is chosen, then the signal views say what is missing', () => {
    const draft = diodeDraft();
    draft.settings = analysisSettingsSchema.parse({});
    const r = computeWorksheet(draft);
    if (r.status !== 'solved') throw new Error('expected solved');
    expect(r.smallSignal).toEqual({
      ok: false,
      missing: 'Choose the input source in the analysis settings.',
    });
  });
});
