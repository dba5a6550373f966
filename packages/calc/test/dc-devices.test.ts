import { describe, expect, it } from 'vitest';
import { solveOperatingPoint, type BjtOp, type MosfetOp } from '../src/dc.ts';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

// Reference values printed by ngspice-39 (Debian) for the same decks, run with
// `ngspice -b deck.cir` after `.options reltol=1e-7 abstol=1e-16 vntol=1e-10`, `op` and
// `print v(…) @m1[id] @m1[gm] @m1[gds] @m1[gmbs]` under `set numdgt=12`. ngspice reports a
// PMOS drain current and a PNP's terminal currents type-normalized; the engine reports every
// terminal current as flowing into the terminal (SPICE's sign convention for V-source currents).
describe('bias points against ngspice-39', () => {
  it('NMOS level 1 with body effect, LD and LAMBDA at 80 °C (deck: VDD vdd 0 5 / VG g 0 1.6 / RD vdd d 10k / RS s 0 500 / M1 d g s 0 nm W=20u L=2u / VB2 vdd2 0 -2 / M2 d2 g2 vdd2 vdd2 nm W=10u L=1u / R3 vdd d2 20k / R4 vdd g2 100k / R5 g2 0 100k / .model nm NMOS(VTO=0.7 KP=110u LAMBDA=0.04 GAMMA=0.45 PHI=0.7 LD=0.1u) / .temp 80)', () => {
    const nm = {
      name: 'nm',
      kind: 'NMOS' as const,
      params: { VTO: 0.7, KP: 110e-6, LAMBDA: 0.04, GAMMA: 0.45, PHI: 0.7, LD: 0.1e-6 },
    };
    const op = solveOperatingPoint(
      {
        elements: [
          { kind: 'V', name: 'VDD', nodes: ['vdd', '0'], dc: 5 },
          { kind: 'V', name: 'VG', nodes: ['g', '0'], dc: 1.6 },
          { kind: 'R', name: 'RD', nodes: ['vdd', 'd'], value: 10e3 },
          { kind: 'R', name: 'RS', nodes: ['s', '0'], value: 500 },
          { kind: 'M', name: 'M1', nodes: ['d', 'g', 's', '0'], model: 'nm', w: 20e-6, l: 2e-6 },
          { kind: 'V', name: 'VB2', nodes: ['vdd2', '0'], dc: -2 },
          {
            kind: 'M',
            name: 'M2',
            nodes: ['d2', 'g2', 'vdd2', 'vdd2'],
            model: 'nm',
            w: 10e-6,
            l: 1e-6,
          },
          { kind: 'R', name: 'R3', nodes: ['vdd', 'd2'], value: 20e3 },
          { kind: 'R', name: 'R4', nodes: ['vdd', 'g2'], value: 100e3 },
          { kind: 'R', name: 'R5', nodes: ['g2', '0'], value: 100e3 },
        ],
        models: [nm],
      },
      { temperature: 80 },
    );
    expect(rel(op.nodes.d!, 1.912487519383)).toBeLessThan(1e-5);
    expect(rel(op.nodes.s!, 0.1543756124267)).toBeLessThan(1e-5);
    expect(rel(op.nodes.d2!, -1.91649625689)).toBeLessThan(1e-5);
    const m1 = op.devices.m1 as MosfetOp;
    expect(m1.region).toBe('saturation');
    expect(rel(m1.id, 0.0003087512480617)).toBeLessThan(1e-4);
    expect(rel(m1.gm, 0.0007955848769724)).toBeLessThan(1e-4);
    expect(rel(1 / m1.ro, 0.00001153860319637)).toBeLessThan(1e-4);
    expect(rel(m1.gmb, 0.0002065299855539)).toBeLessThan(1e-4);
    const m2 = op.devices.m2 as MosfetOp;
    expect(m2.region).toBe('triode');
    expect(rel(1 / m2.ro, 0.004110082557131)).toBeLessThan(1e-4);
  });

  it('PMOS pair (deck: VDD vdd 0 5 / M1 d g vdd vdd pm W=30u L=1u / VG g 0 3.2 / RD d 0 5k / M2 x x vdd vdd pm W=30u L=1u / R2 x 0 20k / .model pm PMOS(VTO=-0.8 KP=50u LAMBDA=0.05 GAMMA=0.4 PHI=0.65))', () => {
    const op = solveOperatingPoint({
      elements: [
        { kind: 'V', name: 'VDD', nodes: ['vdd', '0'], dc: 5 },
        { kind: 'M', name: 'M1', nodes: ['d', 'g', 'vdd', 'vdd'], model: 'pm', w: 30e-6, l: 1e-6 },
        { kind: 'V', name: 'VG', nodes: ['g', '0'], dc: 3.2 },
        { kind: 'R', name: 'RD', nodes: ['d', '0'], value: 5e3 },
        { kind: 'M', name: 'M2', nodes: ['x', 'x', 'vdd', 'vdd'], model: 'pm', w: 30e-6, l: 1e-6 },
        { kind: 'R', name: 'R2', nodes: ['x', '0'], value: 20e3 },
      ],
      models: [
        {
          name: 'pm',
          kind: 'PMOS',
          params: { VTO: -0.8, KP: 50e-6, LAMBDA: 0.05, GAMMA: 0.4, PHI: 0.65 },
        },
      ],
    });
    expect(rel(op.nodes.d!, 3.947368425527)).toBeLessThan(1e-5);
    expect(rel(op.nodes.x!, 3.717410990663)).toBeLessThan(1e-5);
    const m1 = op.devices.m1 as MosfetOp;
    expect(rel(m1.id, -0.0007894736851054)).toBeLessThan(1e-4); // ngspice prints +7.894736851054e-4
    expect(rel(m1.gm, 0.001578947368085)).toBeLessThan(1e-4);
    expect(m1.vth).toBe(-0.8);
    expect(rel(op.sources.vdd!, -0.000975344234639)).toBeLessThan(1e-4);
  });

  it('PNP stage (deck: VCC vcc 0 10 / R1 vcc b 20k / R2 b 0 47k / RE vcc e 2.2k / RC c 0 3.3k / Q1 c b e qp / .model qp PNP(IS=2e-15 BF=80 VAF=50))', () => {
    const op = solveOperatingPoint({
      elements: [
        { kind: 'V', name: 'VCC', nodes: ['vcc', '0'], dc: 10 },
        { kind: 'R', name: 'R1', nodes: ['vcc', 'b'], value: 20e3 },
        { kind: 'R', name: 'R2', nodes: ['b', '0'], value: 47e3 },
        { kind: 'R', name: 'RE', nodes: ['vcc', 'e'], value: 2.2e3 },
        { kind: 'R', name: 'RC', nodes: ['c', '0'], value: 3.3e3 },
        { kind: 'Q', name: 'Q1', nodes: ['c', 'b', 'e'], model: 'qp' },
      ],
      models: [{ name: 'qp', kind: 'PNP', params: { IS: 2e-15, BF: 80, VAF: 50 } }],
    });
    expect(rel(op.nodes.c!, 3.166714104587)).toBeLessThan(1e-5);
    expect(rel(op.nodes.e!, 7.864424569034)).toBeLessThan(1e-5);
    const q = op.devices.q1 as BjtOp;
    expect(q.polarity).toBe('PNP');
    expect(q.region).toBe('active');
    expect(rel(q.ic, -0.00095961033473)).toBeLessThan(1e-4);
    expect(rel(q.gm, 0.03708307784633)).toBeLessThan(1e-4);
    expect(rel(1 / q.ro, 0.00001776923771815)).toBeLessThan(1e-4);
    expect(q.vbe).toBeLessThan(0);
    // Every terminal current flows into its terminal: they sum to zero.
    expect(Math.abs(q.ic + q.ib + q.ie)).toBeLessThan(1e-18);
  });
});
