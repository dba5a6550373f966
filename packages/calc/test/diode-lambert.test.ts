import { describe, expect, it } from 'vitest';
import { thermalVoltage } from '../src/constants.ts';
import { solveOperatingPoint } from '../src/dc.ts';
import { diodeSeriesCurrent } from './support/lambert-w.ts';

// Reference: Banwell and Jayakumar, Electronics Letters 36(4), 2000 — the exact Lambert W
// solution of a diode in series with a resistor. gmin is set to 0 because the closed form has
// no shunt conductance.
const grid: [number, number, number, number][] = [];
for (const is of [1e-16, 1e-14, 1e-12, 1e-9]) {
  for (const n of [1, 1.5, 2]) {
    for (const r of [10, 1e3, 1e5]) {
      for (const v of [0.5, 1, 5, 30]) grid.push([is, n, r, v]);
    }
  }
}

describe('diode + series resistor against the Lambert W closed form (Banwell & Jayakumar 2000)', () => {
  it.each(grid)('IS=%s N=%s R=%s Ω V=%s V: ID within 1e-9 relative', (is, n, r, v) => {
    const op = solveOperatingPoint(
      {
        elements: [
          { kind: 'V', name: 'V1', nodes: ['in', '0'], dc: v },
          { kind: 'R', name: 'R1', nodes: ['in', 'a'], value: r },
          { kind: 'D', name: 'D1', nodes: ['a', '0'], model: 'dx' },
        ],
        models: [{ name: 'dx', kind: 'D', params: { IS: is, N: n } }],
      },
      { gmin: 0 },
    );
    const exact = diodeSeriesCurrent(v, r, is, n, thermalVoltage(27));
    const d1 = op.devices.d1!;
    const id = d1.kind === 'D' ? d1.id : NaN;
    expect(Math.abs(id - exact) / exact).toBeLessThanOrEqual(1e-9);
    // The resistor carries the same current (KCL at the anode), up to the round-off of V − V(a).
    expect(Math.abs(op.elements.r1!.current - exact)).toBeLessThanOrEqual(
      1e-9 * exact + (8 * Number.EPSILON * v) / r,
    );
  });
});
