import type { AcSweep, Circuit, DeviceModel, Element } from './circuit.ts';
import { acSweepSchema } from './circuit.ts';
import type { DeckWarning, Warn } from './deck-cards.ts';
import { cardHead, readValue, splitCard, syntaxError } from './deck-cards.ts';
import { readElementCard } from './deck-elements.ts';
import type { DeckCard } from './deck-lines.ts';
import { lineText, splitDeckLines } from './deck-lines.ts';
import type { ModelCard } from './deck-models.ts';
import { readModelCard } from './deck-models.ts';
import { validateCircuit } from './deck-validate.ts';

export type { DeckWarning } from './deck-cards.ts';

/** The analyses a deck asks for, as far as the engine runs them. */
export interface DeckDirectives {
  /** Circuit temperature from `.temp`, in °C; absent when the deck has no `.temp` (the engine then uses 27 °C). */
  temperature?: number;
  /** True when the deck has an `.op` card. */
  op: boolean;
  /** The sweep of the deck's `.ac` card; absent when it has none. */
  ac?: AcSweep;
}

export interface ParsedDeck {
  /** The circuit, validated by circuitSchema (defaults filled, node names lowercase). */
  circuit: Circuit;
  directives: DeckDirectives;
  /** Everything that was ignored or assumed, in deck order; empty when the deck was read in full. */
  warnings: DeckWarning[];
}

const optionCards = new Set(['.options', '.option', '.opt', '.opts']);
/** Blocks skipped as a whole: their inner lines are not circuit cards. */
const blockEnds: Record<string, string> = { '.control': '.endc', '.subckt': '.ends' };

interface SortedCards {
  models: DeckCard[];
  elements: DeckCard[];
  directives: DeckDirectives;
}

function readDirective(card: DeckCard, directives: DeckDirectives, warn: Warn): void {
  const head = cardHead(card);
  const keyword = head.text.toLowerCase();
  const { positional } = splitCard(card);
  if (keyword === '.op') {
    directives.op = true;
  } else if (keyword === '.temp') {
    const [first, ...more] = positional;
    if (!first) throw syntaxError(head, '.temp needs a temperature in °C');
    const t = readValue(first, 'temperature of .temp');
    if (t <= -273.15) throw syntaxError(first, `.temp ${first.text} °C is below absolute zero`);
    if (directives.temperature !== undefined || more.length > 0) {
      warn(card.line, 'the engine runs one temperature per deck; the first .temp value is used');
    }
    directives.temperature ??= t;
  } else if (keyword === '.ac') {
    directives.ac = readAcCard(card);
  } else if (optionCards.has(keyword)) {
    warn(card.line, `${head.text}: simulator options do not apply to the engine; ignored`);
  } else {
    warn(card.line, `${head.text} is not supported by the engine; ignored`);
  }
}

function readAcCard(card: DeckCard): AcSweep {
  const head = cardHead(card);
  const { positional } = splitCard(card);
  const [type, points, fstart, fstop, ...extra] = positional;
  if (!type || !points || !fstart || !fstop)
    throw syntaxError(
      positional.at(-1) ?? head,
      '.ac needs dec|oct|lin, a point count, a start and a stop frequency',
    );
  if (extra[0]) throw syntaxError(extra[0], `unexpected '${extra[0].text}' on .ac`);
  const sweep = {
    type: type.text.toLowerCase(),
    points: readValue(points, 'point count of .ac'),
    fstart: readValue(fstart, 'start frequency of .ac'),
    fstop: readValue(fstop, 'stop frequency of .ac'),
  };
  const parsed = acSweepSchema.safeParse(sweep);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  const field = String(issue?.path[0] ?? 'type');
  const token = { type, points, fstart, fstop }[field] ?? type;
  throw syntaxError(
    token,
    `.ac ${field}: ${issue?.message ?? 'invalid'}${field === 'type' ? ' (expected dec, oct or lin)' : ''}`,
  );
}

/** Sorts cards into models and elements, applies directives, and skips blocks and what follows `.end`. */
function sortCards(cards: DeckCard[], warn: Warn): SortedCards {
  const sorted: SortedCards = { models: [], elements: [], directives: { op: false } };
  let blockEnd: string | undefined;
  for (const [index, card] of cards.entries()) {
    const keyword = cardHead(card).text.toLowerCase();
    if (blockEnd) {
      if (keyword === blockEnd) blockEnd = undefined;
      continue;
    }
    if (keyword === '.end') {
      if (index < cards.length - 1)
        warn(cards[index + 1]?.line ?? card.line, 'cards after .end are ignored');
      break;
    }
    const end = blockEnds[keyword];
    if (end) {
      warn(
        card.line,
        `${cardHead(card).text} … ${end} block is not supported by the engine; ignored`,
      );
      blockEnd = end;
    } else if (keyword === '.model') {
      sorted.models.push(card);
    } else if (keyword.startsWith('.')) {
      readDirective(card, sorted.directives, warn);
    } else {
      sorted.elements.push(card);
    }
  }
  return sorted;
}

function readModels(cards: DeckCard[], warn: Warn): Map<string, ModelCard> {
  const models = new Map<string, ModelCard>();
  for (const card of cards) {
    const read = readModelCard(card, warn);
    if (!read) continue;
    const key = read.model.name.toLowerCase();
    const earlier = models.get(key);
    if (earlier) {
      const token = card.tokens[1] ?? cardHead(card);
      throw syntaxError(
        token,
        `model ${read.model.name} is defined twice (first on line ${earlier.line})`,
      );
    }
    models.set(key, read);
  }
  return models;
}

/**
 * Reads a SPICE deck (the subset the engine runs) into a validated circuit and its directives.
 * Throws EngineError `deck-syntax` (with `details.line` and `details.token`), `unknown-model`
 * or `invalid-circuit`; everything skipped is listed in `warnings`.
 */
export function parseDeck(text: string): ParsedDeck {
  const lines = splitDeckLines(text);
  const warnings: DeckWarning[] = [];
  const warn: Warn = (line, message) =>
    warnings.push({ line, message, text: lineText(lines, line) });

  const sorted = sortCards(lines.cards, warn);
  const models = readModels(sorted.models, warn);
  const elements: Element[] = [];
  const elementLines: number[] = [];
  const seen = new Map<string, number>();
  for (const card of sorted.elements) {
    const element = readElementCard(card, { models, warn });
    if (!element) continue;
    const key = element.name.toLowerCase();
    const first = seen.get(key);
    if (first !== undefined)
      throw syntaxError(
        cardHead(card),
        `${element.name} is defined twice (first on line ${first})`,
      );
    seen.set(key, card.line);
    elements.push(element);
    elementLines.push(card.line);
  }
  const modelList: DeviceModel[] = [...models.values()].map((m) => m.model);
  const modelLines = [...models.values()].map((m) => m.line);
  const circuit = validateCircuit(
    { title: lines.title, elements, models: modelList },
    { elements: elementLines, models: modelLines },
  );
  warnings.sort((a, b) => a.line - b.line);
  return { circuit, directives: sorted.directives, warnings };
}
