import type { CompiledElement } from './mna.ts';

/**
 * The linear part of the MNA system (g0, b0): resistors, sources, controlled sources and the
 * devices' series resistances. It is stamped from the compiled elements alone, so a prepared
 * circuit whose element value changes re-stamps it here without compiling anything again. A
 * re-stamp (restampLinear) sums only the entries the changed elements write, each from 0 over
 * all its terms in stampLinear's order and arithmetic, so it gives the very bits of a full stamp
 * (IEEE addition is not associative, so the order is what matters).
 */

function addConductance(g0: Float64Array, stride: number, p: number, m: number, g: number): void {
  g0[p * stride + p]! += g;
  g0[p * stride + m]! -= g;
  g0[m * stride + p]! -= g;
  g0[m * stride + m]! += g;
}

function addBranch(g0: Float64Array, stride: number, p: number, m: number, k: number): void {
  g0[p * stride + k]! += 1;
  g0[m * stride + k]! -= 1;
  g0[k * stride + p]! += 1;
  g0[k * stride + m]! -= 1;
}

/** Clears g0 and b0 and stamps every element's linear part into them. */
export function stampLinear(
  elements: readonly CompiledElement[],
  stride: number,
  g0: Float64Array,
  b0: Float64Array,
): void {
  g0.fill(0);
  b0.fill(0);
  for (const { el, terms, branch, series } of elements) {
    const p = terms[0]!;
    const m = terms[1]!;
    switch (el.kind) {
      case 'R':
        addConductance(g0, stride, p, m, 1 / el.value);
        break;
      case 'L':
        addBranch(g0, stride, p, m, branch);
        break;
      case 'V':
        addBranch(g0, stride, p, m, branch);
        b0[branch] = el.dc;
        break;
      case 'I':
        b0[p]! -= el.dc;
        b0[m]! += el.dc;
        break;
      case 'E': {
        addBranch(g0, stride, p, m, branch);
        g0[branch * stride + terms[2]!]! -= el.gain;
        g0[branch * stride + terms[3]!]! += el.gain;
        break;
      }
      case 'G': {
        const cp = terms[2]!;
        const cm = terms[3]!;
        g0[p * stride + cp]! += el.gain;
        g0[p * stride + cm]! -= el.gain;
        g0[m * stride + cp]! -= el.gain;
        g0[m * stride + cm]! += el.gain;
        break;
      }
      default:
        // C is open at DC; D, Q and M are stamped by their device on every iteration.
        break;
    }
    for (const s of series) addConductance(g0, stride, s.nodes[0], s.nodes[1], 1 / s.value);
  }
}

/**
 * Where the linear stamps land, for re-stamping only what an altered element touches. An entry
 * is a g0 offset, or stride² + i for b0[i]. Structural (unknown indices and element kinds only),
 * so every variant of a prepared circuit shares the plan of its compiled system.
 */
export interface LinearPlan {
  /** The distinct entries each element writes. */
  entries: Int32Array[];
  /**
   * Per entry, the updates stampLinear makes to it, in its order: triples of element index,
   * operation (see `apply`) and series-resistance index; undefined for entries nobody writes.
   */
  updates: (Int32Array | undefined)[];
}

// The updates stampLinear makes, by what they add (or assign).
const ADD_G = 0;
const SUB_G = 1;
const ADD_ONE = 2;
const SUB_ONE = 3;
const SET_DC = 4;
const ADD_DC = 5;
const SUB_DC = 6;
const ADD_GAIN = 7;
const SUB_GAIN = 8;
const ADD_SERIES_G = 9;
const SUB_SERIES_G = 10;

type RecordUpdate = (entry: number, op: number, seriesIndex: number) => void;

function pairUpdates(
  record: RecordUpdate,
  stride: number,
  p: number,
  m: number,
  add: number,
  sub: number,
  s: number,
): void {
  record(p * stride + p, add, s);
  record(p * stride + m, sub, s);
  record(m * stride + p, sub, s);
  record(m * stride + m, add, s);
}

function branchUpdates(
  record: RecordUpdate,
  stride: number,
  p: number,
  m: number,
  k: number,
): void {
  record(p * stride + k, ADD_ONE, 0);
  record(m * stride + k, SUB_ONE, 0);
  record(k * stride + p, ADD_ONE, 0);
  record(k * stride + m, SUB_ONE, 0);
}

/** The updates stampLinear makes for one element, in its order. */
function elementUpdates(ce: CompiledElement, stride: number, record: RecordUpdate): void {
  const { el, terms, branch, series } = ce;
  const p = terms[0]!;
  const m = terms[1]!;
  const bBase = stride * stride;
  switch (el.kind) {
    case 'R':
      pairUpdates(record, stride, p, m, ADD_G, SUB_G, 0);
      break;
    case 'L':
      branchUpdates(record, stride, p, m, branch);
      break;
    case 'V':
      branchUpdates(record, stride, p, m, branch);
      record(bBase + branch, SET_DC, 0);
      break;
    case 'I':
      record(bBase + p, SUB_DC, 0);
      record(bBase + m, ADD_DC, 0);
      break;
    case 'E':
      branchUpdates(record, stride, p, m, branch);
      record(branch * stride + terms[2]!, SUB_GAIN, 0);
      record(branch * stride + terms[3]!, ADD_GAIN, 0);
      break;
    case 'G':
      record(p * stride + terms[2]!, ADD_GAIN, 0);
      record(p * stride + terms[3]!, SUB_GAIN, 0);
      record(m * stride + terms[2]!, SUB_GAIN, 0);
      record(m * stride + terms[3]!, ADD_GAIN, 0);
      break;
    default:
      break;
  }
  for (let s = 0; s < series.length; s++) {
    const [a, b] = series[s]!.nodes;
    pairUpdates(record, stride, a, b, ADD_SERIES_G, SUB_SERIES_G, s);
  }
}

/** The plan of a compiled system's linear stamps. */
export function linearPlan(elements: readonly CompiledElement[], stride: number): LinearPlan {
  const entries: Int32Array[] = [];
  const updates: number[][] = [];
  for (let k = 0; k < elements.length; k++) {
    const mine = new Set<number>();
    elementUpdates(elements[k]!, stride, (entry, op, s) => {
      mine.add(entry);
      (updates[entry] ??= []).push(k, op, s);
    });
    entries.push(Int32Array.from(mine));
  }
  const size = stride * stride + stride;
  const out = new Array<Int32Array | undefined>(size);
  for (let e = 0; e < size; e++) {
    const u = updates[e];
    out[e] = u ? Int32Array.from(u) : undefined;
  }
  return { entries, updates: out };
}

/** One update of stampLinear applied to acc, with the element's current values. */
function apply(acc: number, op: number, ce: CompiledElement, s: number): number {
  const el = ce.el;
  switch (op) {
    case ADD_G:
      return acc + 1 / (el as { value: number }).value;
    case SUB_G:
      return acc - 1 / (el as { value: number }).value;
    case ADD_ONE:
      return acc + 1;
    case SUB_ONE:
      return acc - 1;
    case SET_DC:
      return (el as { dc: number }).dc;
    case ADD_DC:
      return acc + (el as { dc: number }).dc;
    case SUB_DC:
      return acc - (el as { dc: number }).dc;
    case ADD_GAIN:
      return acc + (el as { gain: number }).gain;
    case SUB_GAIN:
      return acc - (el as { gain: number }).gain;
    case ADD_SERIES_G:
      return acc + 1 / ce.series[s]!.value;
    default:
      return acc - 1 / ce.series[s]!.value;
  }
}

/**
 * Brings g0/b0, stamped from `previous`, to what stampLinear would give for `elements` (the same
 * topology, some elements replaced): only the entries the replaced elements write are summed
 * again, each from 0 with all its updates in stampLinear's order and arithmetic, so every bit is
 * as a full re-stamp's.
 */
export function restampLinear(
  previous: readonly CompiledElement[],
  elements: readonly CompiledElement[],
  plan: LinearPlan,
  stride: number,
  g0: Float64Array,
  b0: Float64Array,
): void {
  const bBase = stride * stride;
  for (let k = 0; k < elements.length; k++) {
    if (elements[k] === previous[k]) continue;
    const entries = plan.entries[k]!;
    for (let i = 0; i < entries.length; i++) {
      const entry = entries[i]!;
      const u = plan.updates[entry]!;
      let acc = 0;
      for (let j = 0; j < u.length; j += 3)
        acc = apply(acc, u[j + 1]!, elements[u[j]!]!, u[j + 2]!);
      if (entry < bBase) g0[entry] = acc;
      else b0[entry - bBase] = acc;
    }
  }
}
