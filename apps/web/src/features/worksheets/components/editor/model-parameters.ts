import type { ModelKind } from '@biasproof/calc';

/**
 * SPICE model-card parameters the engine evaluates at DC, offered as suggestions in the model
 * form (any other name is accepted and reported by the engine if it does not use it).
 */
export const modelParameters: Record<
  'D' | 'BJT' | 'MOS',
  readonly { name: string; meaning: string }[]
> = {
  D: [
    { name: 'IS', meaning: 'saturation current, A' },
    { name: 'N', meaning: 'emission coefficient' },
    { name: 'RS', meaning: 'series resistance, Ω' },
    { name: 'XTI', meaning: 'IS temperature exponent' },
    { name: 'EG', meaning: 'band-gap energy, eV' },
  ],
  BJT: [
    { name: 'IS', meaning: 'transport saturation current, A' },
    { name: 'BF', meaning: 'ideal forward β' },
    { name: 'BR', meaning: 'ideal reverse β' },
    { name: 'NF', meaning: 'forward emission coefficient' },
    { name: 'NR', meaning: 'reverse emission coefficient' },
    { name: 'VAF', meaning: 'forward Early voltage, V' },
    { name: 'VAR', meaning: 'reverse Early voltage, V' },
    { name: 'IKF', meaning: 'forward β roll-off knee current, A' },
    { name: 'IKR', meaning: 'reverse β roll-off knee current, A' },
    { name: 'ISE', meaning: 'B-E leakage saturation current, A' },
    { name: 'NE', meaning: 'B-E leakage emission coefficient' },
    { name: 'ISC', meaning: 'B-C leakage saturation current, A' },
    { name: 'NC', meaning: 'B-C leakage emission coefficient' },
    { name: 'RB', meaning: 'base resistance, Ω' },
    { name: 'RC', meaning: 'collector resistance, Ω' },
    { name: 'RE', meaning: 'emitter resistance, Ω' },
    { name: 'EG', meaning: 'band-gap energy, eV' },
    { name: 'XTI', meaning: 'IS temperature exponent' },
    { name: 'XTB', meaning: 'β temperature exponent' },
  ],
  MOS: [
    { name: 'VTO', meaning: 'zero-bias threshold voltage, V' },
    { name: 'KP', meaning: 'transconductance parameter, A/V²' },
    { name: 'LAMBDA', meaning: 'channel-length modulation, 1/V' },
    { name: 'GAMMA', meaning: 'body-effect coefficient, √V' },
    { name: 'PHI', meaning: 'surface potential, V' },
    { name: 'LD', meaning: 'lateral diffusion, m' },
    { name: 'RD', meaning: 'drain resistance, Ω' },
    { name: 'RS', meaning: 'source resistance, Ω' },
    { name: 'IS', meaning: 'bulk junction saturation current, A' },
  ],
};

export function parametersFor(kind: ModelKind) {
  if (kind === 'D') return modelParameters.D;
  if (kind === 'NPN' || kind === 'PNP') return modelParameters.BJT;
  return modelParameters.MOS;
}

export const modelKindLabels: Record<ModelKind, string> = {
  D: 'Diode (D)',
  NPN: 'NPN transistor',
  PNP: 'PNP transistor',
  NMOS: 'N-channel MOSFET',
  PMOS: 'P-channel MOSFET',
};
