import type { CompiledElement } from './mna.ts';

/**
 * The linear part of the MNA system (g0, b0): resistors, sources, controlled sources and the
 * devices' series resistances. It is stamped from the compiled elements alone, so a prepared
 * circuit whose element value changes re-stamps it here without compiling anything again; the
 * stamps are added in element order, the same order for a first build and for a re-stamp, so
 * both give the very same bits.
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
