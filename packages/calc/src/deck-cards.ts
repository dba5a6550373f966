import type { DeckCard, DeckToken } from './deck-lines.ts';
import { EngineError, isEngineError } from './errors.ts';
import { parseValue } from './values.ts';

/**
 * Helpers shared by the readers of element and dot cards: splitting a card into positional
 * tokens and `key=value` parameters, reading values, and raising errors and warnings that point
 * at the offending token.
 */

export interface DeckWarning {
  /** 1-based physical line the warning is about. */
  line: number;
  /** What was ignored or assumed, and why. */
  message: string;
  /** That line as written (trimmed). */
  text: string;
}

export interface CardParam {
  key: DeckToken;
  value: DeckToken;
}

export interface CardParts {
  /** Tokens before the first `key=value` pair, without the card's name; parentheses dropped. */
  positional: DeckToken[];
  /** `key=value` pairs in order of appearance. */
  params: CardParam[];
}

/** Reports a warning at a deck line; supplied by the deck reader. */
export type Warn = (line: number, message: string) => void;

export function syntaxError(token: DeckToken, message: string): EngineError {
  return new EngineError('deck-syntax', `line ${token.line}: ${message}`, {
    line: token.line,
    token: token.text,
  });
}

/** The card's first token (its name or dot keyword); every card has at least one. */
export function cardHead(card: DeckCard): DeckToken {
  const head = card.tokens[0];
  if (!head)
    throw new EngineError('deck-syntax', `line ${card.line}: empty card`, { line: card.line });
  return head;
}

/**
 * Splits a card after its head into positional tokens and `key=value` pairs. A pair may be
 * written `W=10u` or `W = 10u`; once pairs start, a bare token is an error, as in SPICE.
 */
export function splitCard(card: DeckCard): CardParts {
  const rest = card.tokens.slice(1).filter((t) => t.text !== '(' && t.text !== ')');
  const positional: DeckToken[] = [];
  const params: CardParam[] = [];
  for (let i = 0; i < rest.length; i += 1) {
    const token = rest[i];
    if (!token) break;
    const next = rest[i + 1];
    if (next?.text === '=') {
      const value = rest[i + 2];
      if (!value || value.text === '=')
        throw syntaxError(next, `parameter ${token.text} has no value after '='`);
      params.push({ key: token, value });
      i += 2;
    } else if (token.text === '=') {
      throw syntaxError(token, "'=' without a parameter name before it");
    } else if (params.length > 0) {
      throw syntaxError(
        token,
        `unexpected '${token.text}' after the parameters; write parameters as NAME=value`,
      );
    } else {
      positional.push(token);
    }
  }
  return { positional, params };
}

/** Reads a value token, turning a bad value into a `deck-syntax` error at that token. */
export function readValue(token: DeckToken, what: string): number {
  try {
    return parseValue(token.text);
  } catch (error) {
    if (isEngineError(error)) throw syntaxError(token, `${what}: ${error.message}`);
    throw error;
  }
}

/** True when the token reads as a value (`5`, `4.7k`, `-1m`), for optional positional values. */
export function looksLikeValue(token: DeckToken | undefined): boolean {
  if (!token) return false;
  try {
    parseValue(token.text);
    return true;
  } catch {
    return false;
  }
}

/** Throws unless the card has at least `count` positional tokens; `usage` shows the expected form. */
export function requirePositional(
  head: DeckToken,
  parts: CardParts,
  count: number,
  usage: string,
): void {
  if (parts.positional.length >= count) return;
  const last = parts.positional.at(-1) ?? head;
  throw syntaxError(last, `${head.text} is incomplete; expected ${usage}`);
}

/** Rejects positional tokens past those the element uses. */
export function rejectExtra(head: DeckToken, extra: DeckToken[]): void {
  const first = extra[0];
  if (first) throw syntaxError(first, `unexpected '${first.text}' on ${head.text}`);
}

/** Applies `key=value` parameters: the accepted ones through their setter, `M` only when 1, others warned. */
export function applyParams(
  head: DeckToken,
  params: CardParam[],
  accepted: Record<string, (v: number) => void>,
  warn: Warn,
): void {
  for (const { key, value } of params) {
    const name = key.text.toUpperCase();
    const set = accepted[name];
    if (set) {
      set(readValue(value, `${key.text} of ${head.text}`));
    } else if (name === 'M') {
      // A multiplier changes every current; ignoring it would give wrong numbers, not just fewer.
      if (readValue(value, `M of ${head.text}`) !== 1) {
        throw syntaxError(
          value,
          `${head.text}: the multiplier M is not supported; scale the part instead (area, W)`,
        );
      }
    } else {
      warn(
        key.line,
        `parameter ${key.text} of ${head.text} is not modelled by the engine; ignored`,
      );
    }
  }
}
