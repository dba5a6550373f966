import { EngineError } from './errors.ts';
import { buildSystem, type MnaSystem } from './mna.ts';
import type { DiodeOp } from './models/diode.ts';
import type { DeviceStamp } from './models/stamp.ts';
import { createWork } from './newton.ts';
import { solveNonlinear } from './solve-nonlinear.ts';
import { buildOperatingPoint, type OperatingPoint } from './operating-point.ts';
import type { ResolvedOperatingPointOptions } from './options.ts';
import { checkVoltageLoops, type ValidatedCircuit } from './topology.ts';

/**
 * The simplified diode laws (ideal, constant-drop, piecewise-linear) by assumed-state iteration,
 * the way a hand analysis proceeds: assume each diode on or off, solve the now piecewise-linear
 * circuit, check every assumption (an "on" diode must carry forward current, an "off" diode must
 * not be driven past its knee), revise, repeat. The fast strategy revises every wrong assumption
 * at once; if that meets a state already tried, or a state where conducting fixed-drop diodes
 * close a loop with voltage sources, it restarts revising one diode at a time (the most
 * wrongly-assumed first). A repeated state then means no consistent assignment exists.
 */

/** A diode on an "on" assumption may carry this much reverse current before the assumption counts as wrong, A. */
const CURRENT_SLACK = 1e-12;
/** An "off" diode may exceed its knee by this much (relative to the circuit's largest voltage) before it counts as wrong. */
const VOLTAGE_SLACK = 1e-9;
/** Cap on the number of states tried. */
const MAX_STATES = 500;

interface SwitchDiode extends DeviceStamp<DiodeOp> {
  on: boolean;
  anode: number;
  cathode: number;
  branch: number;
}

function makeSwitchDiode(
  name: string,
  anode: number,
  cathode: number,
  branch: number,
  stride: number,
  knee: number,
  slope: number,
): SwitchDiode {
  const at = (r: number, c: number): number => r * stride + c;
  /** Operating quantities at the solution x. */
  const operatingPoint = (x: Float64Array, gmin: number): DiodeOp => {
    const vd = x[anode]! - x[cathode]!;
    const id = d.on ? x[branch]! : gmin * vd;
    const region = d.on ? 'forward' : vd < 0 ? 'reverse' : 'off';
    return {
      kind: 'D',
      region,
      id,
      vd,
      vj: vd,
      rd: d.on ? slope : Infinity,
      rs: 0,
      power: vd * id,
    };
  };
  const d: SwitchDiode = {
    name,
    on: false,
    anode,
    cathode,
    branch,
    ports: [{ label: 'D', p: anode, m: cathode, polarity: 1, nvt: 0 }],
    seed() {},
    load(_x, a, b, gmin) {
      a[at(anode, branch)]! += 1;
      a[at(cathode, branch)]! -= 1;
      if (d.on) {
        a[at(branch, anode)]! += 1;
        a[at(branch, cathode)]! -= 1;
        a[at(branch, branch)]! -= slope;
        b[branch]! += knee;
      } else {
        // Off: no branch current; gmin keeps nodes reached only through off diodes determined.
        a[at(branch, branch)]! += 1;
        a[at(anode, anode)]! += gmin;
        a[at(anode, cathode)]! -= gmin;
        a[at(cathode, anode)]! -= gmin;
        a[at(cathode, cathode)]! += gmin;
      }
      return false;
    },
    report(x, gmin) {
      const op = operatingPoint(x, gmin);
      return {
        op,
        terminals: [
          { node: anode, current: op.id },
          { node: cathode, current: -op.id },
        ],
      };
    },
    reportInto(x, gmin, kcl) {
      const op = operatingPoint(x, gmin);
      kcl[anode]! += op.id;
      kcl[cathode]! += -op.id;
      return op;
    },
    linearize(_x, gmin) {
      return [
        {
          label: 'rd',
          kind: 'g',
          nodes: [anode, cathode],
          value: d.on ? (slope > 0 ? 1 / slope : Infinity) : gmin,
        },
      ];
    },
  };
  return d;
}

/** The knee and slope of a simplified law. */
function lawShape(o: ResolvedOperatingPointOptions): { knee: number; slope: number } {
  if (o.diodeLaw === 'ideal') return { knee: 0, slope: 0 };
  if (o.diodeLaw === 'constant-drop') return { knee: o.constantDropVoltage, slope: 0 };
  return { knee: o.pwlKnee, slope: o.pwlResistance };
}

/** Solves the circuit with a simplified diode law; BJTs and MOSFETs keep their full models. */
export function solveAssumedState(
  v: ValidatedCircuit,
  o: ResolvedOperatingPointOptions,
): OperatingPoint {
  const { knee, slope } = lawShape(o);
  const diodes: SwitchDiode[] = [];
  const sys: MnaSystem = buildSystem(v, {
    temperature: o.temperature,
    nominalTemperature: o.nominalTemperature,
    diodeFactory: (name, a, k, br, stride) => {
      const d = makeSwitchDiode(name, a, k, br, stride, knee, slope);
      diodes.push(d);
      return d;
    },
  });
  const work = createWork(sys);
  const nodesOf = new Map(
    diodes.map((d) => [
      d.name,
      v.circuit.elements.find((el) => el.name === d.name)!.nodes as [string, string],
    ]),
  );

  let strategy: 'all' | 'one' = 'all';
  const tried = new Set<string>();
  const restartOneByOne = (): void => {
    strategy = 'one';
    tried.clear();
    for (const d of diodes) d.on = false;
  };
  let lastFlipped = diodes[0]!.name;
  for (let count = 1; count <= MAX_STATES; count++) {
    const key = diodes.map((d) => (d.on ? '1' : '0')).join('');
    if (tried.has(key)) {
      if (strategy === 'all') {
        restartOneByOne();
        continue;
      }
      throw new EngineError(
        'state-cycle',
        `the ${o.diodeLaw} diode law has no consistent on/off assignment: ${lastFlipped} keeps flipping (assumed-state iteration cycles); use the exponential law`,
        { element: lastFlipped },
      );
    }
    tried.add(key);
    if (slope === 0) {
      const conducting = diodes
        .filter((d) => d.on)
        .map((d) => ({ name: d.name, nodes: nodesOf.get(d.name)! }));
      try {
        checkVoltageLoops(v.circuit, conducting);
      } catch (e) {
        if (strategy === 'all') {
          restartOneByOne();
          continue;
        }
        const el = (e as EngineError).details.element ?? lastFlipped;
        throw new EngineError(
          'voltage-source-loop',
          `under the ${o.diodeLaw} law ${el} would conduct with a fixed drop inside a loop of voltage sources; use the piecewise-linear or exponential law`,
          { element: el },
        );
      }
    }
    const r = solveNonlinear(sys, work, { maxIterations: o.maxIterations, gmin: o.gmin });
    const x = r.x;
    let vmax = 0;
    for (let i = 0; i < sys.nodeCount; i++) vmax = Math.max(vmax, Math.abs(x[i]!));
    const vSlack = VOLTAGE_SLACK * (1 + vmax);
    // Violation measures: reverse current of "on" diodes, overdrive of "off" diodes.
    const wrongOn = diodes.filter((d) => d.on && x[d.branch]! < -CURRENT_SLACK);
    const overdrive = (d: SwitchDiode): number => x[d.anode]! - x[d.cathode]! - knee;
    const wrongOff = diodes.filter((d) => !d.on && overdrive(d) > vSlack);
    if (wrongOn.length === 0 && wrongOff.length === 0) {
      return buildOperatingPoint(sys, x, {
        iterations: count,
        method: 'assumed-state',
        temperature: o.temperature,
        diodeLaw: o.diodeLaw,
        gmin: o.gmin,
        warnings: v.warnings,
      });
    }
    if (strategy === 'all') {
      for (const d of [...wrongOn, ...wrongOff]) d.on = !d.on;
      lastFlipped = (wrongOn[0] ?? wrongOff[0])!.name;
    } else {
      const pick =
        wrongOn.sort((a, b) => x[a.branch]! - x[b.branch]!)[0] ??
        wrongOff.sort((a, b) => overdrive(b) - overdrive(a))[0]!;
      pick.on = !pick.on;
      lastFlipped = pick.name;
    }
  }
  throw new EngineError(
    'state-cycle',
    `the ${o.diodeLaw} diode law did not settle after ${MAX_STATES} assumed states`,
    { element: lastFlipped },
  );
}
