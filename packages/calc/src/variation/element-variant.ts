import type { Element } from '../circuit.ts';
import { withElementValue, type PreparedCircuit } from '../prepared.ts';

/**
 * withElementValue for several elements at once: one copy of the element lists for the lot
 * instead of one per element, which a Monte Carlo sample of four resistors notices. A value the
 * element cannot take goes through withElementValue itself, so the error is the engine's own.
 */

function acceptable(el: Element, value: number): boolean {
  if (!Number.isFinite(value)) return false;
  return !(el.kind === 'R' || el.kind === 'C' || el.kind === 'L') || value > 0;
}

function withValue(el: Element, value: number): Element {
  switch (el.kind) {
    case 'R':
    case 'C':
    case 'L':
      return { ...el, value };
    case 'V':
    case 'I':
      return { ...el, dc: value };
    case 'E':
    case 'G':
      return { ...el, gain: value };
    default:
      return el;
  }
}

/** The prepared circuit with each named element (lowercase) at its new value; the original is unchanged. */
export function withElementValues(
  prepared: PreparedCircuit,
  changes: ReadonlyMap<string, number>,
): PreparedCircuit {
  if (changes.size === 0) return prepared;
  const elements = prepared.circuit.elements.slice();
  const c = prepared.compiled;
  const compiled = c ? c.system.elements.slice() : undefined;
  for (let k = 0; k < elements.length; k++) {
    const el = elements[k]!;
    const value = changes.get(el.name);
    if (value === undefined) continue;
    if (!acceptable(el, value) || el.kind === 'D' || el.kind === 'Q' || el.kind === 'M')
      return withElementValue(prepared, el.name, value);
    const next = withValue(el, value);
    elements[k] = next;
    if (compiled) compiled[k] = { ...compiled[k]!, el: next };
  }
  return {
    circuit: { ...prepared.circuit, elements },
    nodes: prepared.nodes,
    models: prepared.models,
    cards: prepared.cards,
    warnings: prepared.warnings,
    compiled: c && compiled ? { ...c, system: { ...c.system, elements: compiled } } : undefined,
  };
}
