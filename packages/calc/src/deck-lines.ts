import { EngineError } from './errors.ts';

/**
 * The first stage of reading a SPICE deck: physical lines to cards. A card is one statement
 * after `+` continuation lines are joined and comments dropped; every token remembers its
 * physical line so that an error can point at the line the author has to fix.
 */

export interface DeckToken {
  /** The token as written (case kept). */
  text: string;
  /** 1-based physical line the token sits on. */
  line: number;
}

export interface DeckCard {
  /** Tokens in order; `(`, `)` and `=` are tokens of their own, commas are separators. */
  tokens: DeckToken[];
  /** 1-based physical line where the card starts. */
  line: number;
}

export interface DeckLines {
  /** The deck's first line, which SPICE always reads as the title. */
  title: string;
  cards: DeckCard[];
  /** The physical lines as written, for quoting them back in warnings (index = line − 1). */
  physical: string[];
}

/** Drops `;` comments anywhere and `$` comments that stand apart from a word, as ngspice does. */
function stripInlineComment(line: string): string {
  let cut = line.indexOf(';');
  const dollar = /(^|\s)\$(\s|$)/.exec(line);
  if (dollar && (cut < 0 || dollar.index < cut)) cut = dollar.index;
  return cut < 0 ? line : line.slice(0, cut);
}

function tokenize(text: string, line: number): DeckToken[] {
  const tokens: DeckToken[] = [];
  for (const match of text.matchAll(/[()=]|[^\s,()=]+/g)) tokens.push({ text: match[0], line });
  return tokens;
}

/** Splits a deck into its title and cards. Throws `deck-syntax` for a `+` line with nothing before it. */
export function splitDeckLines(text: string): DeckLines {
  // A byte-order mark from a Windows editor is not part of the title.
  const physical = text.replace(/^\uFEFF/, '').split(/\r\n|\r|\n/);
  const cards: DeckCard[] = [];
  physical.forEach((raw, index) => {
    const line = index + 1;
    if (line === 1) return;
    const content = stripInlineComment(raw).trim();
    if (content === '' || content.startsWith('*')) return;
    if (content.startsWith('+')) {
      const previous = cards.at(-1);
      if (!previous) {
        throw new EngineError(
          'deck-syntax',
          `line ${line}: continuation line '+' has no card before it to continue`,
          {
            line,
            token: '+',
          },
        );
      }
      previous.tokens.push(...tokenize(content.slice(1), line));
      return;
    }
    cards.push({ tokens: tokenize(content, line), line });
  });
  return { title: (physical[0] ?? '').trim(), cards, physical };
}

/** The physical line text (trimmed) for quoting in a warning. */
export function lineText(lines: DeckLines, line: number): string {
  return (lines.physical[line - 1] ?? '').trim();
}
