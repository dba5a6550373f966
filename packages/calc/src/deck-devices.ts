import type { Element, ModelKind } from './circuit.ts';
import type { Warn } from './deck-cards.ts';
import {
  applyParams,
  cardHead,
  looksLikeValue,
  readValue,
  rejectExtra,
  requirePositional,
  splitCard,
  syntaxError,
} from './deck-cards.ts';
import type { DeckCard, DeckToken } from './deck-lines.ts';
import type { ModelCard } from './deck-models.ts';
import { EngineError } from './errors.ts';

/**
 * Semiconductor element cards — D, Q and M — which name a `.model` card: the model must exist
 * and be of the device's kind, and optional positional fields (area, substrate, OFF) are told
 * apart the way SPICE does.
 */

export interface ElementContext {
  /** `.model` cards by lowercase name. */
  models: ReadonlyMap<string, ModelCard>;
  warn: Warn;
}

/** Node names are case-insensitive in SPICE; the circuit stores them lowercase. */
export const nodeOf = (t: DeckToken): string => t.text.toLowerCase();

/** Warns about an `OFF` flag (an initial-guess hint for the solver) and reports whether it was there. */
function skipOff(head: DeckToken, token: DeckToken | undefined, warn: Warn): boolean {
  if (token?.text.toUpperCase() !== 'OFF') return false;
  warn(token.line, `${head.text}: OFF is an initial-guess hint the engine does not need; ignored`);
  return true;
}

function findModel(
  head: DeckToken,
  token: DeckToken,
  ctx: ElementContext,
  kinds: readonly ModelKind[],
): string {
  const found = ctx.models.get(token.text.toLowerCase());
  if (!found) {
    throw new EngineError(
      'unknown-model',
      `line ${token.line}: ${head.text} uses model '${token.text}', which no .model card defines`,
      {
        line: token.line,
        token: token.text,
        element: head.text.toLowerCase(),
      },
    );
  }
  if (!kinds.includes(found.model.kind)) {
    throw syntaxError(
      token,
      `${head.text} needs a ${kinds.join(' or ')} model, but ${found.model.name} is ${found.model.kind}`,
    );
  }
  return found.model.name;
}

export function readDiode(card: DeckCard, ctx: ElementContext): Element {
  const head = cardHead(card);
  const parts = splitCard(card);
  requirePositional(head, parts, 3, `${head.text} anode cathode model [area]`);
  const [anode, cathode, model, ...rest] = parts.positional;
  if (!anode || !cathode || !model) throw syntaxError(head, `${head.text} is incomplete`);
  const areaToken = looksLikeValue(rest[0]) ? rest.shift() : undefined;
  let area = areaToken ? readValue(areaToken, `area of ${head.text}`) : 1;
  if (skipOff(head, rest[0], ctx.warn)) rest.shift();
  rejectExtra(head, rest);
  applyParams(head, parts.params, { AREA: (v) => (area = v) }, ctx.warn);
  return {
    kind: 'D',
    name: head.text,
    nodes: [nodeOf(anode), nodeOf(cathode)],
    model: findModel(head, model, ctx, ['D']),
    area,
  };
}

export function readBjt(card: DeckCard, ctx: ElementContext): Element {
  const head = cardHead(card);
  const parts = splitCard(card);
  requirePositional(head, parts, 4, `${head.text} collector base emitter [substrate] model [area]`);
  const p = parts.positional;
  const isModel = (t: DeckToken | undefined): boolean =>
    t !== undefined && ctx.models.has(t.text.toLowerCase());
  // The optional substrate node sits before the model name; the defined models tell them apart.
  const modelIndex = isModel(p[3])
    ? 3
    : isModel(p[4])
      ? 4
      : looksLikeValue(p[4]) || !p[4] || p[4].text.toUpperCase() === 'OFF'
        ? 3
        : 4;
  const [c, b, e] = p;
  const model = p[modelIndex];
  if (!c || !b || !e || !model) throw syntaxError(head, `${head.text} is incomplete`);
  if (modelIndex === 4 && p[3]) {
    ctx.warn(
      p[3].line,
      `${head.text}: substrate node ${p[3].text} is not modelled by the engine; ignored`,
    );
  }
  const modelName = findModel(head, model, ctx, ['NPN', 'PNP']);
  const rest = p.slice(modelIndex + 1);
  const areaToken = looksLikeValue(rest[0]) ? rest.shift() : undefined;
  let area = areaToken ? readValue(areaToken, `area of ${head.text}`) : 1;
  if (skipOff(head, rest[0], ctx.warn)) rest.shift();
  rejectExtra(head, rest);
  applyParams(head, parts.params, { AREA: (v) => (area = v) }, ctx.warn);
  return {
    kind: 'Q',
    name: head.text,
    nodes: [nodeOf(c), nodeOf(b), nodeOf(e)],
    model: modelName,
    area,
  };
}

export function readMosfet(card: DeckCard, ctx: ElementContext): Element {
  const head = cardHead(card);
  const parts = splitCard(card);
  requirePositional(head, parts, 5, `${head.text} drain gate source bulk model [W=…] [L=…]`);
  const [d, g, s, b, model, ...rest] = parts.positional;
  if (!d || !g || !s || !b || !model) throw syntaxError(head, `${head.text} is incomplete`);
  const modelName = findModel(head, model, ctx, ['NMOS', 'PMOS']);
  if (skipOff(head, rest[0], ctx.warn)) rest.shift();
  rejectExtra(head, rest);
  // SPICE's DEFW and DEFL, 100 µm each, as the circuit schema defaults.
  let w = 100e-6;
  let l = 100e-6;
  applyParams(head, parts.params, { W: (v) => (w = v), L: (v) => (l = v) }, ctx.warn);
  return {
    kind: 'M',
    name: head.text,
    nodes: [nodeOf(d), nodeOf(g), nodeOf(s), nodeOf(b)],
    model: modelName,
    w,
    l,
  };
}
