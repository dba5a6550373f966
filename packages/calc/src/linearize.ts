import type { SolvedBias } from './dc.ts';
import type { DeviceOp } from './operating-point.ts';

/**
 * The small-signal equivalent of a solved circuit as plain data: independent sources zeroed
 * (a V source becomes a short that may carry an AC stimulus, an I source an open unless it
 * carries one), every device replaced by its conductances and controlled sources at Q.
 * The AC solver runs on exactly this list, so what the UI shows is what was solved.
 */

/** An AC stimulus phasor: magnitude (V or A) and phase (degrees). */
export interface Stimulus {
  mag: number;
  phase: number;
}

export interface LinearElement {
  /** R, C, L: passive; V: 0 V source (short) with optional stimulus; I: stimulus current; G: VCCS; E: VCVS. */
  kind: 'R' | 'C' | 'L' | 'V' | 'I' | 'G' | 'E';
  /** Lowercase name; device parts are named `device.part` (e.g. `q1.rpi`). */
  name: string;
  /** Node names; internal nodes of a device are `device:terminal`. G and E list [out+, out−, ctrl+, ctrl−]. */
  nodes: string[];
  /** Ω (R), F (C), H (L), S (G), V/V (E). */
  value: number;
  /** AC stimulus of a V or I element (absent: zero). */
  ac?: Stimulus;
  /** The circuit element this part comes from. */
  origin: string;
}

/** Small-signal parameters of one device at its Q-point. */
export type DeviceSmallSignal =
  | { kind: 'D'; /** Ω */ rd: number; /** Ω */ rs: number }
  | {
      kind: 'Q';
      /** S */ gm: number;
      /** Ω */ rpi: number;
      /** Ω, Infinity without Early effect */ ro: number;
      betaAc: number;
    }
  | {
      kind: 'M';
      /** S */ gm: number;
      /** S */ gmb: number;
      /** Ω, Infinity when gds = 0 */ ro: number;
    };

export function deviceSmallSignal(op: DeviceOp): DeviceSmallSignal {
  if (op.kind === 'D') return { kind: 'D', rd: op.rd, rs: op.rs };
  if (op.kind === 'Q') return { kind: 'Q', gm: op.gm, rpi: op.rpi, ro: op.ro, betaAc: op.betaAc };
  return { kind: 'M', gm: op.gm, gmb: op.gmb, ro: op.ro };
}

/**
 * Which independent sources carry a stimulus: `circuit` keeps each source's own `ac` field;
 * `{ source }` drives only that source with 1∠0° and zeroes every other; `none` zeroes all.
 */
export type StimulusChoice = 'circuit' | 'none' | { source: string };

export function linearizeSolved(
  bias: SolvedBias,
  choice: StimulusChoice = 'circuit',
): LinearElement[] {
  const { system: sys, x } = bias;
  const gmin = bias.options.gmin;
  const name = (i: number): string => (i === sys.ground ? '0' : sys.unknownNames[i]!);
  const stimulusOf = (el: {
    name: string;
    ac?: { mag: number; phase: number } | undefined;
  }): Stimulus | undefined => {
    if (choice === 'none') return undefined;
    if (choice === 'circuit')
      return el.ac && el.ac.mag !== 0 ? { mag: el.ac.mag, phase: el.ac.phase } : undefined;
    return el.name === choice.source ? { mag: 1, phase: 0 } : undefined;
  };
  const out: LinearElement[] = [];
  for (const ce of sys.elements) {
    const { el } = ce;
    const nodes = el.nodes;
    switch (el.kind) {
      case 'R':
      case 'C':
      case 'L':
        out.push({
          kind: el.kind,
          name: el.name,
          nodes: [...nodes],
          value: el.value,
          origin: el.name,
        });
        break;
      case 'E':
      case 'G':
        out.push({
          kind: el.kind,
          name: el.name,
          nodes: [...nodes],
          value: el.gain,
          origin: el.name,
        });
        break;
      case 'V': {
        const ac = stimulusOf(el);
        out.push({
          kind: 'V',
          name: el.name,
          nodes: [...nodes],
          value: 0,
          ...(ac ? { ac } : {}),
          origin: el.name,
        });
        break;
      }
      case 'I': {
        const ac = stimulusOf(el);
        if (ac)
          out.push({ kind: 'I', name: el.name, nodes: [...nodes], value: 0, ac, origin: el.name });
        break;
      }
      default: {
        for (const s of ce.series) {
          out.push({
            kind: 'R',
            name: `${el.name}.${s.label}`,
            nodes: s.nodes.map(name),
            value: s.value,
            origin: el.name,
          });
        }
        for (const part of ce.device!.linearize(x, gmin)) {
          if (part.kind === 'vccs') {
            out.push({
              kind: 'G',
              name: `${el.name}.${part.label}`,
              nodes: part.nodes.map(name),
              value: part.value,
              origin: el.name,
            });
          } else if (part.value !== 0) {
            out.push({
              kind: 'R',
              name: `${el.name}.${part.label}`,
              nodes: part.nodes.map(name),
              value: 1 / part.value,
              origin: el.name,
            });
          }
        }
      }
    }
  }
  return out;
}
