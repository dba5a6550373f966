import type { VoltageSource, CurrentSource } from './circuit.ts';
import type { Warn } from './deck-cards.ts';
import { cardHead, looksLikeValue, readValue, syntaxError } from './deck-cards.ts';
import type { DeckCard, DeckToken } from './deck-lines.ts';

/**
 * Independent sources: `V1 in 0 5`, `V1 in 0 DC 5 AC 1 0`, `I1 0 b AC 1`. Transient waveforms
 * (`SIN(…)`, `PULSE(…)`…) have no meaning for a bias point or an AC sweep, so they are skipped
 * with a warning and the DC value stays as written (0 when none).
 */

const transientFunctions = new Set([
  'SIN',
  'PULSE',
  'EXP',
  'PWL',
  'SFFM',
  'AM',
  'TRNOISE',
  'TRRANDOM',
]);
const distortionKeywords = new Set(['DISTOF1', 'DISTOF2']);

/** Index after a waveform's arguments: a parenthesised group, or the bare values that follow. */
function skipArguments(tokens: DeckToken[], start: number): number {
  let i = start;
  if (tokens[i]?.text === '(') {
    let depth = 0;
    for (; i < tokens.length; i += 1) {
      const text = tokens[i]?.text;
      if (text === '(') depth += 1;
      if (text === ')') depth -= 1;
      if (depth === 0) return i + 1;
    }
    const open = tokens[start];
    if (open) throw syntaxError(open, "'(' is never closed");
    return i;
  }
  while (i < tokens.length && looksLikeValue(tokens[i])) i += 1;
  return i;
}

export function readSourceCard(card: DeckCard, warn: Warn): VoltageSource | CurrentSource {
  const head = cardHead(card);
  const tokens = card.tokens.slice(1);
  const [plus, minus] = tokens;
  if (!plus || !minus || [plus, minus].some((t) => /^[()=]$/.test(t.text))) {
    throw syntaxError(
      minus ?? plus ?? head,
      `${head.text} needs two nodes: ${head.text} n+ n- [DC] value [AC mag [phase]]`,
    );
  }
  let dc: number | undefined;
  let ac: { mag: number; phase: number } | undefined;
  let i = 2;
  while (i < tokens.length) {
    const token = tokens[i];
    if (!token) break;
    const word = token.text.toUpperCase();
    if (word === 'DC') {
      const value = tokens[i + 1];
      if (!value || !looksLikeValue(value))
        throw syntaxError(value ?? token, `${head.text}: DC needs a value after it`);
      dc = readValue(value, `DC value of ${head.text}`);
      i += 2;
    } else if (word === 'AC') {
      // SPICE reads a bare `AC` as magnitude 1, phase 0.
      const mag = tokens[i + 1];
      const phase = tokens[i + 2];
      const hasMag = looksLikeValue(mag);
      const hasPhase = hasMag && looksLikeValue(phase);
      ac = {
        mag: hasMag && mag ? readValue(mag, `AC magnitude of ${head.text}`) : 1,
        phase: hasPhase && phase ? readValue(phase, `AC phase of ${head.text}`) : 0,
      };
      i += 1 + (hasMag ? 1 : 0) + (hasPhase ? 1 : 0);
    } else if (transientFunctions.has(word) || distortionKeywords.has(word)) {
      warn(
        token.line,
        `${head.text}: ${token.text} is a transient or distortion stimulus, not used by a bias point or AC sweep; ignored`,
      );
      i = skipArguments(tokens, i + 1);
    } else if (dc === undefined && looksLikeValue(token)) {
      dc = readValue(token, `DC value of ${head.text}`);
      i += 1;
    } else {
      throw syntaxError(
        token,
        `unexpected '${token.text}' on ${head.text}; expected [DC] value [AC mag [phase]]`,
      );
    }
  }
  const nodes: [string, string] = [plus.text.toLowerCase(), minus.text.toLowerCase()];
  const body = { name: head.text, nodes, dc: dc ?? 0, ...(ac ? { ac } : {}) };
  return head.text[0]?.toUpperCase() === 'V' ? { kind: 'V', ...body } : { kind: 'I', ...body };
}
