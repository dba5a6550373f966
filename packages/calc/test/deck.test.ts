import { describe, expect, it } from 'vitest';
import { parseDeck } from '../src/index.ts';

// Deck syntax as SPICE-class simulators read it (the ngspice manual's chapters on the input
// format, element cards and .model cards): first line title, `*` comment lines, `;` and `$ `
// inline comments, `+` continuation, case-insensitive keywords and node names.

const amplifier = `Common-emitter stage with divider bias
* supply and input
VCC vcc 0 DC 12
Vin In 0 DC 0 AC 1 0
V2 aux 0 5
V3 x3 0 AC
R1 vcc b 47k ; top of the divider
R2 b 0 10k $ bottom of the divider
RC vcc c 4k7
RE e 0 1k
CE e 0 100u
Cin in b 10u
L1 c lx 1m
RL lx 0 10meg
Q1 c b e QNPN
+ 2
D1 aux k DSIG
Rk k 0 1k
M1 d g 0 0 nch W=10u
* a comment between a card and its continuation
+ L=1u
Rd vcc d 10k
Vg g 0 DC 1.5
E1 ex 0 c 0 -2.5
Rex ex 0 1k
G1 0 gy c 0 1m
Rgy gy 0 1k
I1 vcc ib 10u
Rib ib 0 1k
.model QNPN NPN (IS=1e-15 BF=200 VA=100)
.model dsig d is=2.5n
+ n=1.8 rs=0.5
.MODEL NCH NMOS LEVEL=1 VTO=0.7 KP=100u LAMBDA=0.01 GAMMA=0.4 PHI=0.65
.temp 75
.op
.ac dec 10 10 1meg
.end
`;

describe('parseDeck: what it reads', () => {
  const { circuit, directives, warnings } = parseDeck(amplifier);
  const byName = (name: string) => circuit.elements.find((e) => e.name === name);

  it('takes the first line as the title and reads every element card', () => {
    expect(circuit.title).toBe('Common-emitter stage with divider bias');
    expect(circuit.elements.map((e) => e.name)).toEqual([
      'VCC',
      'Vin',
      'V2',
      'V3',
      'R1',
      'R2',
      'RC',
      'RE',
      'CE',
      'Cin',
      'L1',
      'RL',
      'Q1',
      'D1',
      'Rk',
      'M1',
      'Rd',
      'Vg',
      'E1',
      'Rex',
      'G1',
      'Rgy',
      'I1',
      'Rib',
    ]);
    expect(warnings).toEqual([]);
  });

  it('reads source forms: DC keyword, bare value, AC magnitude and phase, bare AC as 1∠0°', () => {
    expect(byName('VCC')).toEqual({ kind: 'V', name: 'VCC', nodes: ['vcc', '0'], dc: 12 });
    expect(byName('Vin')).toEqual({
      kind: 'V',
      name: 'Vin',
      nodes: ['in', '0'],
      dc: 0,
      ac: { mag: 1, phase: 0 },
    });
    expect(byName('V2')).toMatchObject({ dc: 5 });
    expect(byName('V3')).toMatchObject({ dc: 0, ac: { mag: 1, phase: 0 } });
    expect(byName('I1')).toEqual({ kind: 'I', name: 'I1', nodes: ['vcc', 'ib'], dc: 10e-6 });
  });

  it('reads values with SPICE scale factors and RKM codes, with inline comments dropped', () => {
    expect(byName('R1')).toEqual({ kind: 'R', name: 'R1', nodes: ['vcc', 'b'], value: 47e3 });
    expect(byName('R2')).toMatchObject({ value: 10e3 });
    expect(byName('RC')).toMatchObject({ value: 4700 });
    expect(byName('CE')).toMatchObject({ kind: 'C', value: 100e-6 });
    expect(byName('L1')).toMatchObject({ kind: 'L', value: 1e-3 });
    expect(byName('RL')).toMatchObject({ value: 10e6 });
  });

  it('joins + continuation lines, also across a comment line', () => {
    expect(byName('Q1')).toEqual({
      kind: 'Q',
      name: 'Q1',
      nodes: ['c', 'b', 'e'],
      model: 'QNPN',
      area: 2,
    });
    expect(byName('M1')).toEqual({
      kind: 'M',
      name: 'M1',
      nodes: ['d', 'g', '0', '0'],
      model: 'NCH',
      w: 10e-6,
      l: 1e-6,
    });
  });

  it('resolves model names case-insensitively to the name of the .model card', () => {
    expect(byName('D1')).toEqual({
      kind: 'D',
      name: 'D1',
      nodes: ['aux', 'k'],
      model: 'dsig',
      area: 1,
    });
  });

  it('reads linear controlled sources', () => {
    expect(byName('E1')).toEqual({
      kind: 'E',
      name: 'E1',
      nodes: ['ex', '0', 'c', '0'],
      gain: -2.5,
    });
    expect(byName('G1')).toEqual({
      kind: 'G',
      name: 'G1',
      nodes: ['0', 'gy', 'c', '0'],
      gain: 1e-3,
    });
  });

  it('reads .model cards with or without parentheses, continued, LEVEL=1 accepted, aliases mapped', () => {
    expect(circuit.models).toEqual([
      // VA is another name of VAF in SPICE simulators; it is stored under the model-card name.
      { name: 'QNPN', kind: 'NPN', params: { IS: 1e-15, BF: 200, VAF: 100 } },
      { name: 'dsig', kind: 'D', params: { IS: 2.5e-9, N: 1.8, RS: 0.5 } },
      {
        name: 'NCH',
        kind: 'NMOS',
        params: { VTO: 0.7, KP: 100e-6, LAMBDA: 0.01, GAMMA: 0.4, PHI: 0.65 },
      },
    ]);
  });

  it('reads .temp, .op and .ac', () => {
    expect(directives).toEqual({
      temperature: 75,
      op: true,
      ac: { type: 'dec', points: 10, fstart: 10, fstop: 1e6 },
    });
  });

  it('defaults: no .op, no .temp, no .ac; W and L 100 µm; area 1', () => {
    const deck = parseDeck('t\nM1 d g 0 0 n\nRd d 0 1k\nVg g 0 1\n.model n nmos\n');
    expect(deck.directives).toEqual({ op: false });
    expect(deck.circuit.elements[0]).toMatchObject({ w: 100e-6, l: 100e-6 });
    expect(parseDeck('t\nD1 a 0 d\nV1 a 0 1\n.model d d\n').circuit.elements[0]).toMatchObject({
      area: 1,
    });
  });

  it('always reads the first line as the title, even when it looks like a card; CRLF and a BOM are fine', () => {
    const deck = parseDeck('\uFEFFR1 a 0 1k\r\nV1 a 0 1\r\nR2 a 0 2k\r\n.end\r\n');
    expect(deck.circuit.title).toBe('R1 a 0 1k');
    expect(deck.circuit.elements.map((e) => e.name)).toEqual(['V1', 'R2']);
  });

  it('reads a BJT with a substrate node by telling it from the model name', () => {
    const deck = parseDeck(
      't\nQ1 c b e sub qp 3\nV1 c 0 1\nV2 b 0 1\nV3 e 0 0\nV4 sub 0 0\n.model qp pnp\n',
    );
    expect(deck.circuit.elements[0]).toEqual({
      kind: 'Q',
      name: 'Q1',
      nodes: ['c', 'b', 'e'],
      model: 'qp',
      area: 3,
    });
    expect(deck.warnings.map((w) => w.message)).toEqual([
      'Q1: substrate node sub is not modelled by the engine; ignored',
    ]);
  });
});

describe('parseDeck: what it warns about, never silently', () => {
  const deck = `warnings
V1 in 0 DC 1 SIN(0 1 1k) AC 1
R1 in out 1k TC1=1m
C1 out 0 1n IC=0
D1 out 0 dm OFF
X1 in out sub
F1 out 0 V1 2
M1 out in 0 0 nm W=2u L=1u AD=1p
.model dm d (is=1e-14 cjo=2p bv=100)
.model nm nmos (vto=1 kp=20u tox=10n vt0=1.2)
.model rmod r (tc1=1m)
.options reltol=1e-6
.tran 1u 1m
.control
run
.endc
.temp 27 50
.end
R9 in 0 1k
`;
  const { circuit, warnings } = parseDeck(deck);

  it('lists each ignored card, element and parameter with its line and text', () => {
    expect(warnings.map((w) => [w.line, w.message])).toEqual([
      [
        2,
        'V1: SIN is a transient or distortion stimulus, not used by a bias point or AC sweep; ignored',
      ],
      [3, 'parameter TC1 of R1 is not modelled by the engine; ignored'],
      [4, 'parameter IC of C1 is not modelled by the engine; ignored'],
      [5, 'D1: OFF is an initial-guess hint the engine does not need; ignored'],
      [6, 'element X1 (letter X) is not supported by the engine; ignored'],
      [7, 'element F1 (letter F) is not supported by the engine; ignored'],
      [8, 'parameter AD of M1 is not modelled by the engine; ignored'],
      [9, 'parameter cjo of model dm is not modelled by the engine; ignored'],
      [9, 'parameter bv of model dm is not modelled by the engine; ignored'],
      [10, 'parameter tox of model nm is not modelled by the engine; ignored'],
      [10, 'parameter vt0 of model nm is given twice; the last value is used'],
      [11, 'model rmod of type r is not supported by the engine; ignored'],
      [12, '.options: simulator options do not apply to the engine; ignored'],
      [13, '.tran is not supported by the engine; ignored'],
      [14, '.control … .endc block is not supported by the engine; ignored'],
      [17, 'the engine runs one temperature per deck; the first .temp value is used'],
      [19, 'cards after .end are ignored'],
    ]);
    expect(warnings[0]?.text).toBe('V1 in 0 DC 1 SIN(0 1 1k) AC 1');
  });

  it('keeps what it could read of the warned cards', () => {
    expect(circuit.elements.map((e) => e.name)).toEqual(['V1', 'R1', 'C1', 'D1', 'M1']);
    expect(circuit.elements[0]).toMatchObject({ dc: 1, ac: { mag: 1, phase: 0 } });
    expect(circuit.models.map((m) => m.params)).toEqual([{ IS: 1e-14 }, { VTO: 1.2, KP: 20e-6 }]);
  });
});
