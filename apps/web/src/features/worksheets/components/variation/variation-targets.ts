import type { DraftCircuit, Element, SolvedWorksheet } from '@biasproof/calc';
import { elementSummary } from '@/features/worksheets/components/editor/element-summary.ts';
import { parametersFor } from '@/features/worksheets/components/editor/model-parameters.ts';

/** What can vary, what can be rated and which result paths exist, for the forms' choices. */

export interface TargetGroup {
  label: string;
  options: { value: string; label: string }[];
}

const valued = new Set<Element['kind']>(['R', 'C', 'L', 'V', 'I', 'E', 'G']);

/** Element values and model parameters, grouped as the target select offers them. */
export function variedTargets(circuit: DraftCircuit): TargetGroup[] {
  const elements = circuit.elements
    .filter((el) => valued.has(el.kind))
    .map((el) => ({ value: el.name, label: `${el.name} (${elementSummary(el)})` }));
  const models = circuit.models.map((m) => ({
    label: `Model ${m.name}`,
    options: parametersFor(m.kind).map((p) => {
      const set = m.params[p.name];
      return {
        value: `${m.name}.${p.name}`,
        label: `${m.name}.${p.name} — ${p.meaning}${set === undefined ? '' : ` (${set})`}`,
      };
    }),
  }));
  return [{ label: 'Element values', options: elements }, ...models];
}

/** Resistors, diodes and transistors: the parts whose stress is checked. */
export function ratableParts(circuit: DraftCircuit): string[] {
  return circuit.elements
    .filter((el) => el.kind === 'R' || el.kind === 'D' || el.kind === 'Q' || el.kind === 'M')
    .map((el) => el.name);
}

const deviceUnits: Record<string, string> = {
  id: 'A',
  ic: 'A',
  ib: 'A',
  ie: 'A',
  vd: 'V',
  vbe: 'V',
  vce: 'V',
  vbc: 'V',
  vgs: 'V',
  vds: 'V',
  vbs: 'V',
  vth: 'V',
  vj: 'V',
  power: 'W',
  rd: 'Ω',
  rs: 'Ω',
  rpi: 'Ω',
  ro: 'Ω',
  gm: 'S',
  gmb: 'S',
};

/** The unit a result path's number is in ('' for ratios and unknown paths). */
export function unitOfPath(path: string): string {
  const parts = path.trim().split('.');
  const [head] = parts;
  const last = parts.at(-1) ?? '';
  if (head === 'nodes') return 'V';
  if (head === 'sources') return 'A';
  if (head === 'supplyPower') return 'W';
  if (head === 'elements') return last === 'power' ? 'W' : 'A';
  if (head === 'devices') return deviceUnits[last] ?? '';
  if (head === 'gain') return last === 'db' ? 'dB' : last === 'deg' ? '°' : '';
  if (head === 'zin' || head === 'zout') return last === 'ohm' ? 'Ω' : '°';
  return '';
}

/** Every result path the solved worksheet can follow, for the path fields' suggestions. */
export function knownResultPaths(results: SolvedWorksheet): string[] {
  const { bias } = results;
  const paths = [
    ...Object.keys(bias.nodes).map((n) => `nodes.${n}`),
    ...Object.keys(bias.sources).map((s) => `sources.${s}`),
  ];
  for (const [name, device] of Object.entries(bias.devices)) {
    for (const [quantity, value] of Object.entries(device))
      if (typeof value === 'number') paths.push(`devices.${name}.${quantity}`);
  }
  for (const name of Object.keys(bias.elements))
    paths.push(`elements.${name}.current`, `elements.${name}.power`);
  paths.push('supplyPower');
  if (results.smallSignal.ok)
    paths.push('gain.vv', 'gain.db', 'gain.deg', 'zin.ohm', 'zin.deg', 'zout.ohm', 'zout.deg');
  return paths;
}
