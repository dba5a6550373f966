import { complexLuFactor, complexLuSolve, type Complex } from './complex.ts';
import { EngineError } from './errors.ts';
import type { LinearElement } from './linearize.ts';

/**
 * Complex MNA of a linear(ized) circuit: Y(ω) = G + jω·C, assembled once per element list and
 * re-solved at each frequency. Unknowns: node voltages, then the branch currents of V, E and L.
 */

export interface AcSystem {
  size: number;
  stride: number;
  /** Node name → unknown index (ground → the ground index `size`). */
  nodeIndex: Map<string, number>;
  /** Element name → branch unknown. */
  branchIndex: Map<string, number>;
  /** Real part of Y (ω-independent). */
  g: Float64Array;
  /** Imaginary part of Y per unit ω (capacitances, −inductances on branch rows). */
  c: Float64Array;
  /** Right-hand side (stimuli), real and imaginary. */
  rhsRe: Float64Array;
  rhsIm: Float64Array;
  // Work buffers.
  re: Float64Array;
  im: Float64Array;
  xr: Float64Array;
  xi: Float64Array;
  perm: Int32Array;
}

export function buildAcSystem(elements: LinearElement[]): AcSystem {
  const nodeIndex = new Map<string, number>();
  const nodes: string[] = [];
  for (const el of elements)
    for (const n of el.nodes)
      if (n !== '0' && !nodeIndex.has(n)) nodeIndex.set(n, nodes.push(n) - 1);
  const branchIndex = new Map<string, number>();
  let size = nodes.length;
  for (const el of elements)
    if (el.kind === 'V' || el.kind === 'E' || el.kind === 'L') branchIndex.set(el.name, size++);
  nodeIndex.set('0', size);
  const stride = size + 1;
  const g = new Float64Array(stride * stride);
  const c = new Float64Array(stride * stride);
  const rhsRe = new Float64Array(stride);
  const rhsIm = new Float64Array(stride);
  const at = (r: number, col: number): number => r * stride + col;
  const pair = (m: Float64Array, p: number, q: number, y: number): void => {
    m[at(p, p)]! += y;
    m[at(p, q)]! -= y;
    m[at(q, p)]! -= y;
    m[at(q, q)]! += y;
  };
  for (const el of elements) {
    const [p, q, cp, cq] = el.nodes.map((n) => nodeIndex.get(n)!) as [
      number,
      number,
      number,
      number,
    ];
    const k = branchIndex.get(el.name) ?? -1;
    const phasor = el.ac
      ? {
          re: el.ac.mag * Math.cos((el.ac.phase * Math.PI) / 180),
          im: el.ac.mag * Math.sin((el.ac.phase * Math.PI) / 180),
        }
      : null;
    switch (el.kind) {
      case 'R':
        pair(g, p, q, 1 / el.value);
        break;
      case 'C':
        pair(c, p, q, el.value);
        break;
      case 'G':
        g[at(p, cp)]! += el.value;
        g[at(p, cq)]! -= el.value;
        g[at(q, cp)]! -= el.value;
        g[at(q, cq)]! += el.value;
        break;
      case 'I':
        if (phasor) {
          rhsRe[p]! -= phasor.re;
          rhsIm[p]! -= phasor.im;
          rhsRe[q]! += phasor.re;
          rhsIm[q]! += phasor.im;
        }
        break;
      default:
        g[at(p, k)]! += 1;
        g[at(q, k)]! -= 1;
        g[at(k, p)]! += 1;
        g[at(k, q)]! -= 1;
        if (el.kind === 'L') c[at(k, k)]! -= el.value;
        if (el.kind === 'E') {
          g[at(k, cp)]! -= el.value;
          g[at(k, cq)]! += el.value;
        }
        if (el.kind === 'V' && phasor) {
          rhsRe[k] = phasor.re;
          rhsIm[k] = phasor.im;
        }
    }
  }
  return {
    size,
    stride,
    nodeIndex,
    branchIndex,
    g,
    c,
    rhsRe,
    rhsIm,
    re: new Float64Array(stride * stride),
    im: new Float64Array(stride * stride),
    xr: new Float64Array(stride),
    xi: new Float64Array(stride),
    perm: new Int32Array(stride),
  };
}

/** Solves Y(2πf)·x = rhs; the solution is left in sys.xr / sys.xi (xr[ground] = xi[ground] = 0). */
export function solveAcAt(sys: AcSystem, frequency: number): void {
  const w = 2 * Math.PI * frequency;
  const { re, im, g, c, size, stride } = sys;
  re.set(g);
  for (let i = 0; i < c.length; i++) im[i] = w * c[i]!;
  sys.xr.set(sys.rhsRe);
  sys.xi.set(sys.rhsIm);
  const bad = complexLuFactor(re, im, size, stride, sys.perm);
  if (bad >= 0) {
    const name =
      [...sys.nodeIndex].find(([, i]) => i === bad)?.[0] ??
      [...sys.branchIndex].find(([, i]) => i === bad)?.[0] ??
      '?';
    throw new EngineError(
      'singular-matrix',
      `the small-signal circuit is singular at ${frequency} Hz (around ${name})`,
      { node: name },
    );
  }
  complexLuSolve(re, im, size, stride, sys.perm, sys.xr, sys.xi);
  sys.xr[size] = 0;
  sys.xi[size] = 0;
}

/** V(p) − V(q) of the last solution. */
export function acVoltage(sys: AcSystem, p: string, q = '0'): Complex {
  const i = sys.nodeIndex.get(p)!;
  const j = sys.nodeIndex.get(q)!;
  return { re: sys.xr[i]! - sys.xr[j]!, im: sys.xi[i]! - sys.xi[j]! };
}

/** Branch current of a V, E or L element in the last solution (into its + terminal). */
export function acBranchCurrent(sys: AcSystem, element: string): Complex {
  const k = sys.branchIndex.get(element)!;
  return { re: sys.xr[k]!, im: sys.xi[k]! };
}
