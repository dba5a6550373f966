import type { AcSweep, Circuit, CircuitInput, DeviceModel, Element } from './circuit.ts';
import type { DeckDirectives } from './deck-parse.ts';
import { validateCircuit } from './deck-validate.ts';
import { parseValue } from './values.ts';

/**
 * Writes a circuit as a SPICE deck that ngspice (and other SPICE-class simulators) run as is and
 * that parseDeck reads back to the same circuit. Numbers carry SPICE scale factors where that is
 * exact (`4.7k`, `10u`) and full precision otherwise; RKM codes and the ambiguous `M` are never
 * written (`meg` for mega).
 */

/** SPICE scale factors by decimal exponent, as a SPICE reader expects them. */
const spiceSuffix: Record<number, string> = {
  [-15]: 'f',
  [-12]: 'p',
  [-9]: 'n',
  [-6]: 'u',
  [-3]: 'm',
  0: '',
  3: 'k',
  6: 'meg',
  9: 'g',
  12: 't',
};

/** Shortest text SPICE reads back as exactly `x`: `4700` → `4.7k`, `1e-14` → `10f`, `0.7` → `0.7`. */
export function formatSpiceNumber(x: number): string {
  // Plain decimals read best in the usual range (0.7, 12, 470); String(x) is exact.
  if (x === 0 || !Number.isFinite(x) || (Math.abs(x) >= 0.1 && Math.abs(x) < 1000))
    return String(x);
  const exponent = Math.min(12, Math.max(-15, Math.floor(Math.log10(Math.abs(x)) / 3) * 3));
  const suffix = spiceSuffix[exponent] ?? '';
  for (let digits = 1; digits <= 17; digits += 1) {
    const mantissa = String(Number((x / 10 ** exponent).toPrecision(digits)));
    if (/e/i.test(mantissa)) break;
    const text = `${mantissa}${suffix}`;
    if (parseValue(text) === x) return text;
  }
  return String(x);
}

const n = formatSpiceNumber;

function elementLine(e: Element): string {
  // SPICE tells element kinds apart by the first letter only.
  const name = e.name[0]?.toUpperCase() === e.kind ? e.name : `${e.kind}${e.name}`;
  const nodes = e.nodes.join(' ');
  switch (e.kind) {
    case 'R':
    case 'C':
    case 'L':
      return `${name} ${nodes} ${n(e.value)}`;
    case 'V':
    case 'I':
      return `${name} ${nodes} DC ${n(e.dc)}${e.ac ? ` AC ${n(e.ac.mag)} ${n(e.ac.phase)}` : ''}`;
    case 'D':
    case 'Q':
      return `${name} ${nodes} ${e.model}${e.area === 1 ? '' : ` ${n(e.area)}`}`;
    case 'M':
      return `${name} ${nodes} ${e.model} W=${n(e.w)} L=${n(e.l)}`;
    case 'E':
    case 'G':
      return `${name} ${nodes} ${n(e.gain)}`;
  }
}

function modelLine(m: DeviceModel): string {
  // Level 1 is the square-law model the engine solves; say so for simulators whose default differs.
  const level = m.kind === 'NMOS' || m.kind === 'PMOS' ? ['LEVEL=1'] : [];
  const params = [...level, ...Object.entries(m.params).map(([k, v]) => `${k}=${n(v)}`)];
  return `.model ${m.name} ${m.kind} (${params.join(' ')})`;
}

function acLine(ac: AcSweep): string {
  return `.ac ${ac.type} ${ac.points} ${n(ac.fstart)} ${n(ac.fstop)}`;
}

/**
 * Writes `circuit` as a SPICE deck. `directives` default to `{ op: true }` (an `.op` card and no
 * `.temp` or `.ac`). Throws EngineError `invalid-circuit` naming the element when the circuit is invalid.
 */
export function exportDeck(
  input: CircuitInput | Circuit,
  directives: Partial<DeckDirectives> = { op: true },
): string {
  const circuit = validateCircuit(input);
  const title = circuit.title.replace(/\s+/g, ' ').trim();
  const lines = [title, ...circuit.elements.map(elementLine), ...circuit.models.map(modelLine)];
  if (directives.temperature !== undefined) lines.push(`.temp ${n(directives.temperature)}`);
  if (directives.op) lines.push('.op');
  if (directives.ac) lines.push(acLine(directives.ac));
  lines.push('.end');
  return `${lines.join('\n')}\n`;
}
