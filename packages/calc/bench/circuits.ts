/**
 * The benchmark's circuits, as SPICE decks so that the engine and ngspice read the very same
 * text. Model values are example values, not vendor parts.
 */

/** Five nodes, three diodes: a small nonlinear network. */
export const diodeNetwork = `Five-node diode network
V1 in 0 DC 5
R1 in a 1k
D1 a b DB
R2 b 0 2.2k
D2 b c DB
R3 c 0 4.7k
R4 a d 3.3k
D3 d 0 DB
.model DB D (IS=1e-14 N=1.05 RS=0.5)
.op
.end
`;

/** Ten devices: a DC-coupled two-stage NPN amplifier. */
export const bjtAmplifier = `Two-stage NPN amplifier, ten devices
VCC vcc 0 DC 12
R1 vcc b1 82k
R2 b1 0 15k
RC1 vcc c1 10k
RE1 e1 0 1.5k
Q1 c1 b1 e1 QA
Q2 c2 c1 e2 QA
RC2 vcc c2 2.2k
RE2 e2 0 3.3k
RL c2 0 22k
.model QA NPN (IS=2e-15 BF=180 BR=4 VAF=90 VAR=25)
.op
.end
`;

/** Fifty devices: a source feeding a ladder of 24 series resistors and 24 shunt diodes, and a load. */
export function ladder(): string {
  const lines = ['Fifty-device resistor and diode ladder', 'V1 n0 0 DC 20'];
  for (let i = 1; i <= 24; i += 1) lines.push(`R${i} n${i - 1} n${i} 220`, `D${i} n${i} 0 DL`);
  lines.push('RL n24 0 1k', '.model DL D (IS=1e-14 N=1.5 RS=2)', '.op', '.end', '');
  return lines.join('\n');
}

/** A common-emitter amplifier with coupling, bypass and load capacitors for the 200-point AC sweep. */
export const acAmplifier = `Common-emitter amplifier, AC sweep
VCC vcc 0 DC 12
VS src 0 DC 0 AC 1
RS src s 600
C1 s b 10u
R1 vcc b 56k
R2 b 0 12k
RC vcc c 3.9k
RE e 0 1k
CE e 0 47u
C2 c out 10u
RL out 0 10k
CL out 0 470p
Q1 c b e QN
.model QN NPN (IS=2e-15 BF=180 BR=4 VAF=90 VAR=25)
.ac lin 200 10 10meg
.end
`;

/** The Monte Carlo benchmark's common-emitter stage: four resistors (±1 %) and one BJT (BF ±30 %). */
export const ceStage = `Common-emitter stage for Monte Carlo
VCC vcc 0 DC 12
R1 vcc b 56k
R2 b 0 12k
RC vcc c 3.9k
RE e 0 1k
Q1 c b e QN
.model QN NPN (IS=2e-15 BF=180 BR=4 VAF=90 VAR=25)
.op
.end
`;
