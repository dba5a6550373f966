import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { CircuitInput, Element } from '../src/circuit.ts';
import { solveOperatingPoint } from '../src/dc.ts';

/**
 * Random valid networks of resistors, sources and diodes: every node has a resistor to an
 * earlier node or ground (a DC path) and a resistor to ground (two terminals at least);
 * each voltage source drives its own node from ground (no loop). Extra resistors, diodes in
 * either direction and current sources are sprinkled between random nodes.
 */
const network = fc
  .integer({ min: 1, max: 7 })
  .chain((nodeCount) => {
    const node = fc.integer({ min: 0, max: nodeCount }).map((i) => (i === 0 ? '0' : `n${i}`));
    const ohms = fc.double({ min: 10, max: 1e6, noNaN: true });
    const extra = fc.oneof(
      fc.record({ kind: fc.constant('R' as const), a: node, b: node, value: ohms }),
      fc.record({
        kind: fc.constant('D' as const),
        a: node,
        b: node,
        value: fc.integer({ min: 0, max: 2 }),
      }),
      fc.record({
        kind: fc.constant('I' as const),
        a: node,
        b: node,
        value: fc.double({ min: -5e-3, max: 5e-3, noNaN: true }),
      }),
    );
    return fc.record({
      nodeCount: fc.constant(nodeCount),
      tree: fc.array(fc.tuple(fc.nat(), ohms, ohms), {
        minLength: nodeCount,
        maxLength: nodeCount,
      }),
      sources: fc.array(
        fc.tuple(
          fc.integer({ min: 1, max: nodeCount }),
          fc.double({ min: -20, max: 20, noNaN: true }),
        ),
        { maxLength: 3 },
      ),
      extras: fc.array(extra, { maxLength: 10 }),
    });
  })
  .map(({ nodeCount, tree, sources, extras }): CircuitInput => {
    const elements: Element[] = [];
    for (let i = 1; i <= nodeCount; i++) {
      const [pick, r1, r2] = tree[i - 1]!;
      const parent = pick % i === 0 ? '0' : `n${pick % i}`;
      elements.push({ kind: 'R', name: `RT${i}`, nodes: [`n${i}`, parent], value: r1 });
      elements.push({ kind: 'R', name: `RG${i}`, nodes: [`n${i}`, '0'], value: r2 });
    }
    const driven = new Set<number>();
    sources.forEach(([n, v], k) => {
      if (driven.has(n)) return;
      driven.add(n);
      elements.push({ kind: 'V', name: `V${k}`, nodes: [`n${n}`, '0'], dc: v });
    });
    extras.forEach((x, k) => {
      if (x.a === x.b) return;
      if (x.kind === 'R')
        elements.push({ kind: 'R', name: `RX${k}`, nodes: [x.a, x.b], value: x.value });
      if (x.kind === 'I')
        elements.push({ kind: 'I', name: `IX${k}`, nodes: [x.a, x.b], dc: x.value });
      if (x.kind === 'D')
        elements.push({
          kind: 'D',
          name: `DX${k}`,
          nodes: [x.a, x.b],
          model: `d${x.value}`,
          area: 1,
        });
    });
    const models: CircuitInput['models'] = [
      // Every card has some RS: a bare junction forced to many volts has no finite current in double precision.
      { name: 'd0', kind: 'D', params: { IS: 1e-14, RS: 0.1 } },
      { name: 'd1', kind: 'D', params: { IS: 2.5e-9, N: 1.75, RS: 0.5 } },
      { name: 'd2', kind: 'D', params: { IS: 1e-12, N: 1.2, RS: 10 } },
    ];
    return { elements, models };
  });

describe('property: random resistor-source-diode networks (KCL, fast-check)', () => {
  it('converge and satisfy KCL at every node to 1e-9 relative', () => {
    fc.assert(
      fc.property(network, (circuit) => {
        const op = solveOperatingPoint(circuit);
        const sum = new Map<string, number>();
        const scale = new Map<string, number>();
        for (const el of circuit.elements) {
          const i = op.elements[el.name.toLowerCase()]!.current;
          expect(Number.isFinite(i)).toBe(true);
          const [a, b] = el.nodes;
          for (const [n, s] of [
            [a, 1],
            [b, -1],
          ] as const) {
            sum.set(n, (sum.get(n) ?? 0) + s * i);
            scale.set(n, (scale.get(n) ?? 0) + Math.abs(i));
          }
        }
        for (const [n, s] of sum) {
          if (n === '0') continue;
          expect(Math.abs(s)).toBeLessThanOrEqual(1e-9 * scale.get(n)! + 1e-15);
        }
        for (const v of Object.values(op.nodes)) expect(Number.isFinite(v)).toBe(true);
      }),
      { numRuns: 300, seed: 20241201 },
    );
  });
});
