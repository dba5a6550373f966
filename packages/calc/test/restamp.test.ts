import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseDeck } from '../src/deck-parse.ts';
import { linearPlan, restampLinear, stampLinear } from '../src/mna-linear.ts';
import { prepareOperatingPoint, withElementValue, type PreparedCircuit } from '../src/prepared.ts';

// withElementValue's solve re-stamps only the matrix entries the altered elements write
// (restampLinear). Those entries must hold the very bits a full stampLinear gives, −0 included.

const deckDir = join(import.meta.dirname, 'decks');
const decks = readdirSync(deckDir).filter((f) => f.endsWith('.cir'));

function alterable(prepared: PreparedCircuit): { name: string; value: number }[] {
  const out: { name: string; value: number }[] = [];
  for (const el of prepared.circuit.elements) {
    if (el.kind === 'R' || el.kind === 'C' || el.kind === 'L')
      out.push({ name: el.name, value: el.value });
    if (el.kind === 'V' || el.kind === 'I') out.push({ name: el.name, value: el.dc });
    if (el.kind === 'E' || el.kind === 'G') out.push({ name: el.name, value: el.gain });
  }
  return out;
}

function sameBits(a: Float64Array, b: Float64Array): boolean {
  return a.every((v, i) => Object.is(v, b[i]));
}

describe('restampLinear', () => {
  it.each(decks)('gives the bits of a full stamp after every alter (%s)', (file) => {
    const prepared = prepareOperatingPoint(
      parseDeck(readFileSync(join(deckDir, file), 'utf8')).circuit,
    );
    const base = prepared.compiled!.system;
    const plan = linearPlan(base.elements, base.stride);
    const g0 = base.g0.slice();
    const b0 = base.b0.slice();
    let previous = base.elements;
    let chain = prepared;
    for (const { name, value } of alterable(prepared)) {
      for (const v of [value * 0.5, value * 3, value === 0 ? 1 : -value, 0, -0]) {
        let variant: PreparedCircuit;
        try {
          variant = withElementValue(chain, name, v);
        } catch {
          continue; // a value the element cannot take
        }
        chain = variant;
        const elements = variant.compiled!.system.elements;
        restampLinear(previous, elements, plan, base.stride, g0, b0);
        previous = elements;
        const fullG = new Float64Array(g0.length);
        const fullB = new Float64Array(b0.length);
        stampLinear(elements, base.stride, fullG, fullB);
        expect(sameBits(g0, fullG) && sameBits(b0, fullB), `${name} = ${v}`).toBe(true);
      }
    }
  });
});
