import { defaultAnalysisSettings, type WorksheetDraft } from '@biasproof/calc';

/**
 * The example a scratch worksheet opens with: a diode biased from a 5 V rail through 1 kΩ.
 * Example values only.
 */
export function starterDraft(): WorksheetDraft {
  return {
    circuit: {
      title: 'Diode bias network',
      elements: [
        { kind: 'V', name: 'V1', nodes: ['in', '0'], dc: 5 },
        { kind: 'R', name: 'R1', nodes: ['in', 'out'], value: 1000 },
        { kind: 'D', name: 'D1', nodes: ['out', '0'], model: 'DSIG', area: 1 },
      ],
      models: [{ name: 'DSIG', kind: 'D', params: { IS: 1e-14, N: 1 } }],
    },
    settings: { ...defaultAnalysisSettings(), inputSource: 'V1', outputNode: 'out' },
  };
}
