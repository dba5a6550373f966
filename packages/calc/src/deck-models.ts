import type { DeviceModel, ModelKind } from './circuit.ts';
import { modelKinds } from './circuit.ts';
import type { Warn } from './deck-cards.ts';
import { cardHead, readValue, splitCard, syntaxError } from './deck-cards.ts';
import type { DeckCard } from './deck-lines.ts';
import { MODEL_DEFAULTS, defaultFamily } from './models/defaults.ts';

/**
 * `.model` cards. Parameters the engine models are kept under their SPICE names; parameters
 * SPICE knows but the engine does not model (junction capacitances, noise, breakdown…) are
 * dropped with a warning, so an author sees exactly which part of a vendor model was not used.
 */

/** Parameters the engine models for a model kind: those it has SPICE defaults for. */
export function modelledParams(kind: ModelKind): readonly string[] {
  return Object.keys(MODEL_DEFAULTS[defaultFamily(kind)]);
}

/** Other names SPICE simulators accept for the same parameter. */
const aliases: Record<string, string> = { VA: 'VAF', VB: 'VAR', IK: 'IKF', VT0: 'VTO', CJ0: 'CJO' };

/** Model types SPICE has that the engine does not (switches, JFETs, MESFETs, passive models…). */
const unsupportedTypes = new Set([
  'R',
  'C',
  'L',
  'SW',
  'CSW',
  'NJF',
  'PJF',
  'NMF',
  'PMF',
  'URC',
  'LTRA',
  'TXL',
  'CPL',
]);

export interface ModelCard {
  model: DeviceModel;
  /** Line of the `.model` card, for errors about devices that use it. */
  line: number;
}

/**
 * Reads one `.model NAME TYPE (P=v …)` card. Returns undefined (with a warning) for model types
 * the engine has no device for; throws `deck-syntax` for a malformed card.
 */
export function readModelCard(card: DeckCard, warn: Warn): ModelCard | undefined {
  const head = cardHead(card);
  const { positional, params } = splitCard(card);
  const [nameToken, typeToken, ...extra] = positional;
  if (!nameToken || !typeToken) {
    throw syntaxError(
      nameToken ?? head,
      '.model needs a name and a type: .model NAME D|NPN|PNP|NMOS|PMOS (P=value …)',
    );
  }
  if (!/^[A-Za-z][A-Za-z0-9_.-]*$/.test(nameToken.text)) {
    throw syntaxError(nameToken, `model name '${nameToken.text}' must start with a letter`);
  }
  const type = typeToken.text.toUpperCase();
  const kind = modelKinds.find((k) => k === type);
  if (!kind) {
    if (unsupportedTypes.has(type)) {
      warn(
        card.line,
        `model ${nameToken.text} of type ${typeToken.text} is not supported by the engine; ignored`,
      );
      return undefined;
    }
    throw syntaxError(
      typeToken,
      `unknown model type '${typeToken.text}'; expected D, NPN, PNP, NMOS or PMOS`,
    );
  }
  const stray = extra[0];
  if (stray)
    throw syntaxError(
      stray,
      `unexpected '${stray.text}' in .model ${nameToken.text}; write parameters as NAME=value`,
    );

  const kept: Record<string, number> = {};
  for (const { key, value } of params) {
    const raw = key.text.toUpperCase();
    const name = aliases[raw] ?? raw;
    const number = readValue(value, `parameter ${key.text} of model ${nameToken.text}`);
    if (name === 'LEVEL') {
      if (number !== 1)
        throw syntaxError(
          value,
          `model ${nameToken.text}: only LEVEL=1 is supported, not LEVEL=${value.text}`,
        );
      continue;
    }
    if (!/^[A-Z][A-Z0-9]*$/.test(name))
      throw syntaxError(key, `'${key.text}' is not a model parameter name`);
    if (!modelledParams(kind).includes(name)) {
      warn(
        key.line,
        `parameter ${key.text} of model ${nameToken.text} is not modelled by the engine; ignored`,
      );
      continue;
    }
    if (name in kept)
      warn(
        key.line,
        `parameter ${key.text} of model ${nameToken.text} is given twice; the last value is used`,
      );
    kept[name] = number;
  }
  return { model: { name: nameToken.text, kind, params: kept }, line: card.line };
}
