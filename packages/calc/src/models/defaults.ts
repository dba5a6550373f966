import type { DeviceModel, ModelKind } from '../circuit.ts';

/**
 * SPICE's model-card defaults for the parameters the engine evaluates at DC. A value of 0 for
 * VAF, VAR, IKF and IKR means "infinite", as in SPICE.
 */
export const MODEL_DEFAULTS: Record<'D' | 'BJT' | 'MOS', Readonly<Record<string, number>>> = {
  D: { IS: 1e-14, N: 1, RS: 0, XTI: 3, EG: 1.11 },
  BJT: {
    IS: 1e-16,
    BF: 100,
    BR: 1,
    NF: 1,
    NR: 1,
    VAF: 0,
    VAR: 0,
    IKF: 0,
    IKR: 0,
    ISE: 0,
    NE: 1.5,
    ISC: 0,
    NC: 2,
    RB: 0,
    RC: 0,
    RE: 0,
    EG: 1.11,
    XTI: 3,
    XTB: 0,
  },
  MOS: { VTO: 0, KP: 2e-5, GAMMA: 0, PHI: 0.6, LAMBDA: 0, LD: 0, RD: 0, RS: 0, IS: 1e-14 },
};

/**
 * Parameters accepted on a model card that do not change the bias point or the small-signal
 * conductances the engine computes (charge storage, noise, breakdown). They are ignored quietly;
 * any other unknown parameter is listed in the result's warnings.
 */
const IGNORED_QUIETLY = new Set([
  'CJO',
  'CJ0',
  'VJ',
  'M',
  'TT',
  'FC',
  'BV',
  'IBV',
  'KF',
  'AF',
  'CJE',
  'VJE',
  'MJE',
  'CJC',
  'VJC',
  'MJC',
  'XCJC',
  'TF',
  'TR',
  'XTF',
  'VTF',
  'ITF',
  'PTF',
  'CJS',
  'VJS',
  'MJS',
  'CGSO',
  'CGDO',
  'CGBO',
  'CBD',
  'CBS',
  'PB',
  'MJ',
  'CJSW',
  'MJSW',
  'PBSW',
  'LEVEL',
  'VERSION',
  'IAVE',
  'VPK',
  'MFG',
  'TYPE',
  'IRB',
  'RBM',
  'TNOM',
]);

/** Which default table a model kind uses. */
export function defaultFamily(kind: ModelKind): 'D' | 'BJT' | 'MOS' {
  if (kind === 'D') return 'D';
  if (kind === 'NPN' || kind === 'PNP') return 'BJT';
  return 'MOS';
}

/** A model card with every evaluated parameter present (card value or SPICE default). */
export function resolveModelParams(model: DeviceModel): Record<string, number> {
  // Object.assign and for…in: a spread followed by new keys costs several times more here.
  const out: Record<string, number> = Object.assign({}, MODEL_DEFAULTS[defaultFamily(model.kind)]);
  const params = model.params;
  for (const k in params) out[k.toUpperCase()] = params[k]!;
  // RBM defaults to RB in SPICE: the base resistance is then bias-independent.
  if (out.RBM === undefined && out.RB !== undefined) out.RBM = out.RB;
  return out;
}

/** Parameter names on the card that the engine neither evaluates nor knows to be DC-irrelevant. */
export function unsupportedParams(model: DeviceModel): string[] {
  const base = MODEL_DEFAULTS[defaultFamily(model.kind)];
  const out: string[] = [];
  for (const key in model.params) {
    const k = key.toUpperCase();
    if (!(k in base) && !IGNORED_QUIETLY.has(k)) out.push(k);
  }
  return out;
}
