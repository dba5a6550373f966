import type { Element } from './circuit.ts';
import type { Warn } from './deck-cards.ts';
import {
  applyParams,
  cardHead,
  readValue,
  rejectExtra,
  requirePositional,
  splitCard,
  syntaxError,
} from './deck-cards.ts';
import type { ElementContext } from './deck-devices.ts';
import { nodeOf, readBjt, readDiode, readMosfet } from './deck-devices.ts';
import type { DeckCard } from './deck-lines.ts';
import { readSourceCard } from './deck-sources.ts';

export type { ElementContext } from './deck-devices.ts';

/**
 * Element cards: R C L V I D Q M E G in SPICE syntax. Letters SPICE has but the engine does
 * not (X subcircuits, F/H current-controlled sources, switches, lines…) are skipped with a
 * warning rather than guessed at.
 */

function readPassive(card: DeckCard, kind: 'R' | 'C' | 'L', warn: Warn): Element {
  const head = cardHead(card);
  const parts = splitCard(card);
  const what = { R: 'resistance', C: 'capacitance', L: 'inductance' }[kind];
  let value: number | undefined;
  const setValue = (v: number): void => {
    value = v;
  };
  applyParams(head, parts.params, { [kind]: setValue, [what.toUpperCase()]: setValue }, warn);
  requirePositional(head, parts, value === undefined ? 3 : 2, `${head.text} n1 n2 ${what}`);
  const [a, b, valueToken, ...extra] = parts.positional;
  if (!a || !b) throw syntaxError(head, `${head.text} needs two nodes`);
  rejectExtra(head, extra);
  if (valueToken) value = readValue(valueToken, `${what} of ${head.text}`);
  return { kind, name: head.text, nodes: [nodeOf(a), nodeOf(b)], value: value ?? Number.NaN };
}

function readControlled(card: DeckCard, kind: 'E' | 'G'): Element {
  const head = cardHead(card);
  const parts = splitCard(card);
  const nonlinear =
    parts.positional.find((t) => /^(POLY|VALUE|TABLE|LAPLACE|VOL|CUR)$/i.test(t.text)) ??
    parts.params[0]?.key;
  if (nonlinear) {
    throw syntaxError(
      nonlinear,
      `${head.text}: only the linear form ${kind}<name> out+ out- ctrl+ ctrl- gain is supported`,
    );
  }
  requirePositional(head, parts, 5, `${head.text} out+ out- ctrl+ ctrl- gain`);
  const [op, om, cp, cm, gain, ...extra] = parts.positional;
  if (!op || !om || !cp || !cm || !gain) throw syntaxError(head, `${head.text} is incomplete`);
  rejectExtra(head, extra);
  const nodes: [string, string, string, string] = [nodeOf(op), nodeOf(om), nodeOf(cp), nodeOf(cm)];
  return { kind, name: head.text, nodes, gain: readValue(gain, `gain of ${head.text}`) };
}

/** Reads one element card; returns undefined (after a warning) for element letters the engine lacks. */
export function readElementCard(card: DeckCard, ctx: ElementContext): Element | undefined {
  const head = cardHead(card);
  const letter = head.text[0]?.toUpperCase();
  switch (letter) {
    case 'R':
    case 'C':
    case 'L':
      return readPassive(card, letter, ctx.warn);
    case 'V':
    case 'I':
      return readSourceCard(card, ctx.warn);
    case 'D':
      return readDiode(card, ctx);
    case 'Q':
      return readBjt(card, ctx);
    case 'M':
      return readMosfet(card, ctx);
    case 'E':
    case 'G':
      return readControlled(card, letter);
    default:
      ctx.warn(
        card.line,
        `element ${head.text} (letter ${letter ?? '?'}) is not supported by the engine; ignored`,
      );
      return undefined;
  }
}
