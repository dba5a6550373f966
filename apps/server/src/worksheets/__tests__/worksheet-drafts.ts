// Circuits the worksheet tests save: built the way the web editor sends them (engine schema).
import { analysisSettingsSchema, parseDeck } from '@biasproof/calc';
import { dividerDraft } from '../../test-support/fixtures.ts';

export { dividerDraft };

/** The divider with R2 changed to `ohms`. */
export function dividerWithR2(ohms: number) {
  const draft = dividerDraft();
  return {
    ...draft.circuit,
    elements: draft.circuit.elements.map((el) => (el.name === 'R2' ? { ...el, value: ohms } : el)),
  };
}

/** An NMOS stage in saturation with LAMBDA = 0: the engine reports ro = Infinity. */
export function idealMosDraft() {
  const { circuit } = parseDeck(
    [
      'ideal NMOS stage',
      'VDD vdd 0 DC 5',
      'VG g 0 DC 2 AC 1',
      'RD vdd d 1k',
      'M1 d g 0 0 NM W=10u L=1u',
      '.model NM NMOS (VTO=1 KP=100u)',
      '.end',
    ].join('\n'),
  );
  return {
    circuit,
    settings: analysisSettingsSchema.parse({ inputSource: 'VG', outputNode: 'd' }),
  };
}
