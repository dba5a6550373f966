import { describe, expect, it } from 'vitest';
import { parseDeck } from '../src/deck-parse.ts';
import { solveOperatingPoint } from '../src/dc.ts';
import { EngineError } from '../src/errors.ts';
import { defaultDeratingPolicy } from '../src/variation/derating-policy.ts';
import { handCalcChecks } from '../src/variation/hand-checks.ts';
import { checkLimits, worstCornerCheck } from '../src/variation/limits.ts';
import { partStress } from '../src/variation/stress.ts';

// Known answers by hand arithmetic: margin = distance to the nearer bound (positive inside),
// deviation = (actual − expected)/|expected|, allowed stress = factor × rating.

describe('limits: pass/fail with margins', () => {
  const values = { 'nodes.out': 5, 'devices.q1.ic': 1.2e-3 };
  it('inside both bounds: passes with the margin to the nearer one (min), 0.1 V = 2.04 % of 4.9 V', () => {
    const [c] = checkLimits(values, [{ path: 'nodes.out', min: 4.9, max: 5.2, unit: 'V' }]);
    expect(c).toEqual({
      path: 'nodes.out',
      unit: 'V',
      min: 4.9,
      max: 5.2,
      value: 5,
      pass: true,
      margin: expect.closeTo(0.1, 12),
      marginPercent: expect.closeTo((0.1 / 4.9) * 100, 10),
      bound: 'min',
    });
  });
  it('above the max: fails with a negative margin of −50 mV (−1.01 % of 4.95 V)', () => {
    const [c] = checkLimits(values, [{ path: 'nodes.out', max: 4.95 }]);
    expect(c).toMatchObject({
      pass: false,
      bound: 'max',
      margin: expect.closeTo(-0.05, 12),
      marginPercent: expect.closeTo((-0.05 / 4.95) * 100, 10),
    });
  });
  it('a min alone: the margin is to the min', () => {
    const [c] = checkLimits(values, [{ path: 'devices.q1.ic', min: 1e-3, unit: 'A' }]);
    expect(c).toMatchObject({ pass: true, bound: 'min', margin: expect.closeTo(0.2e-3, 15) });
  });
  it('a path without a value fails with no margin', () => {
    const [c] = checkLimits(values, [{ path: 'nodes.nowhere', max: 1 }]);
    expect(c).toMatchObject({ value: null, pass: false, margin: null });
  });
  it('a bound of 0: no % margin', () => {
    expect(checkLimits(values, [{ path: 'nodes.out', min: 0 }])[0]?.marginPercent).toBeNull();
  });
  it('worst corner: the corner value with the smaller margin decides', () => {
    const limit = { path: 'nodes.out', min: 4.8, max: 5.1, unit: 'V' };
    expect(worstCornerCheck(limit, { min: 4.85, max: 5.12 })).toMatchObject({
      at: 'max',
      pass: false,
      margin: expect.closeTo(-0.02, 12),
    });
    expect(worstCornerCheck(limit, { min: 4.81, max: 5.0 })).toMatchObject({
      at: 'min',
      pass: true,
      margin: expect.closeTo(0.01, 12),
    });
  });
  it('when a limit has neither min nor max, then bad-option says it needs one', () => {
    expect(() => checkLimits(values, [{ path: 'nodes.out' }])).toThrow(
      new EngineError('bad-option', 'limits 0: a limit needs a min, a max or both'),
    );
  });
  it('when min is above max, then bad-option says so', () => {
    expect(() => checkLimits(values, [{ path: 'nodes.out', min: 2, max: 1 }])).toThrow(
      'limits 0: the limit min is above its max',
    );
  });
});

describe('hand-calc checks', () => {
  const values = { 'nodes.out': 5 };
  it('5 V against a hand value of 5.1 V ± 5 %: −1.96 %, pass', () => {
    expect(handCalcChecks(values, [{ path: 'nodes.out', expected: 5.1, note: 'divider' }])).toEqual(
      [
        {
          path: 'nodes.out',
          expected: 5.1,
          actual: 5,
          deviationPercent: expect.closeTo((-0.1 / 5.1) * 100, 10),
          tolerancePercent: 5,
          pass: true,
          note: 'divider',
        },
      ],
    );
  });
  it('5 V against 4.5 V ± 5 %: +11.1 %, fail', () => {
    expect(handCalcChecks(values, [{ path: 'nodes.out', expected: 4.5 }])[0]).toMatchObject({
      deviationPercent: expect.closeTo((0.5 / 4.5) * 100, 10),
      pass: false,
    });
  });
  it('a negative expected value: the deviation is taken against its magnitude', () => {
    expect(
      handCalcChecks({ 'sources.v1': -0.01 }, [
        { path: 'sources.v1', expected: -0.0102, tolerancePercent: 3 },
      ])[0],
    ).toMatchObject({
      deviationPercent: expect.closeTo((0.0002 / 0.0102) * 100, 10),
      pass: true,
    });
  });
  it('when the expected value is 0, then bad-option explains that it has no % deviation', () => {
    expect(() => handCalcChecks(values, [{ path: 'nodes.out', expected: 0 }])).toThrow(
      'hand checks 0.expected: an expected value of 0 has no % deviation',
    );
  });
});

describe('part stress with derating factors', () => {
  // 10 V across 100 Ω: 1 W in each of R1, R2, R3. D1 carries (10 − VD)/1 kΩ; D2 blocks 10 V.
  const circuit = parseDeck(
    'stress\nV1 a 0 10\nR1 a 0 100\nR2 a 0 100\nR3 a 0 100\nR4 a k 1k\nD1 k 0 DX\nD2 0 a DX\n.model DX D (IS=1e-14)\n.end\n',
  ).circuit;
  const ratings = [
    { element: 'r1', power: 2, thetaJA: 50, tjMax: 155 },
    { element: 'r2', power: 1.5 },
    { element: 'r3', power: 0.5 },
    { element: 'd1', current: 15e-3 },
    { element: 'd2', reverseVoltage: 20 },
  ];
  const result = partStress({ circuit, ratings });
  const row = (name: string) => result.rows.find((r) => r.element === name)!;
  const check = (name: string, quantity: string) =>
    row(name).checks.find((c) => c.quantity === quantity)!;

  it('R1: 1 W of 2 W with factor 0.6 (1.2 W allowed) passes at 50 % use, its source named', () => {
    expect(check('r1', 'power')).toMatchObject({
      value: expect.closeTo(1, 12),
      rating: 2,
      factor: 0.6,
      allowed: expect.closeTo(1.2, 12),
      usePercent: expect.closeTo(50, 10),
      status: 'pass',
    });
    expect(check('r1', 'power').source).toMatch(/EEE-INST-002/);
  });
  it('R1 body temperature 27 °C + 50 K/W·1 W = 77 °C against 155 − 40 °C: passes', () => {
    expect(check('r1', 'junction-temperature')).toMatchObject({
      value: expect.closeTo(77, 10),
      allowed: 115,
      status: 'pass',
    });
  });
  it('R2: 1 W of 1.5 W is above 0.9 W allowed but within the rating: warns', () => {
    expect(check('r2', 'power').status).toBe('warn');
  });
  it('R3: 1 W of 0.5 W fails, and the row takes its worst status', () => {
    expect([check('r3', 'power').status, row('r3').status]).toEqual(['fail', 'fail']);
  });
  it('D1: forward current against 0.5 × 15 mA; D2: 10 V reverse of 20 V against 0.7 × 20 V passes at 50 %', () => {
    const id = solveOperatingPoint(circuit).devices.d1!;
    expect(check('d1', 'current')).toMatchObject({
      value: id.kind === 'D' ? id.id : NaN,
      allowed: 7.5e-3,
      status: 'warn',
    });
    expect(check('d2', 'reverse-voltage')).toMatchObject({
      value: expect.closeTo(10, 9),
      allowed: expect.closeTo(14, 12),
      usePercent: expect.closeTo(50, 7),
      status: 'pass',
    });
  });
  it('an element without ratings is shown unrated', () => {
    expect(row('r4').status).toBe('unrated');
  });
  it("an organization's policy replaces the factors: resistor power at 0.8 makes R2 pass", () => {
    const policy = {
      ...defaultDeratingPolicy(),
      resistorPower: { factor: 0.8, source: 'house rule' },
    };
    const r = partStress({ circuit, ratings, policy });
    expect(r.rows.find((x) => x.element === 'r2')!.checks[0]).toMatchObject({
      status: 'pass',
      allowed: expect.closeTo(1.2, 12),
      source: 'house rule',
    });
  });
  it('every default factor says where it comes from', () => {
    const p = defaultDeratingPolicy();
    for (const f of [
      p.resistorPower,
      p.diodeForwardCurrent,
      p.diodeReverseVoltage,
      p.diodePower,
      p.transistorPower,
      p.transistorCurrent,
      p.transistorVoltage,
    ])
      expect(f.source).toMatch(/EEE-INST-002|common practice/);
  });
  it('when a rating names an element that is not in the circuit, then bad-option names it', () => {
    expect(() => partStress({ circuit, ratings: [{ element: 'r9', power: 1 }] })).toThrow(
      'rating for r9: no element of that name is in the circuit',
    );
  });
  it('when a rating names a source, then bad-option says only parts carry ratings', () => {
    expect(() => partStress({ circuit, ratings: [{ element: 'v1', power: 1 }] })).toThrow(
      'rating for v1: only resistors, diodes and transistors carry ratings',
    );
  });
  it('when a derating factor is above 1, then bad-option says so', () => {
    expect(() =>
      partStress({ circuit, policy: { resistorPower: { factor: 1.5, source: 'x' } } }),
    ).toThrow('derating policy resistorPower.factor: a derating factor is at most 1');
  });
});

describe('part stress of a transistor', () => {
  it('checks power, |IC| and |VCE| of a BJT against transistor factors', () => {
    const circuit = parseDeck(
      'ce\nVCC vcc 0 12\nR1 vcc b 56k\nR2 b 0 12k\nRC vcc c 3.9k\nRE e 0 1k\nQ1 c b e QN\n.model QN NPN (BF=180)\n.end\n',
    ).circuit;
    const q = solveOperatingPoint(circuit).devices.q1!;
    if (q.kind !== 'Q') throw new Error('q1 is a BJT');
    const r = partStress({
      circuit,
      ratings: [{ element: 'q1', power: 0.625, current: 0.2, voltage: 40 }],
    });
    expect(
      r.rows
        .find((x) => x.element === 'q1')!
        .checks.map((c) => [c.quantity, c.value, c.allowed, c.status]),
    ).toEqual([
      ['power', Math.abs(q.power), expect.closeTo(0.3125, 12), 'pass'],
      ['current', Math.abs(q.ic), expect.closeTo(0.15, 12), 'pass'],
      ['voltage', Math.abs(q.vce), expect.closeTo(30, 12), 'pass'],
    ]);
  });
});
