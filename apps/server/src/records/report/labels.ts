import type { Element } from '@biasproof/calc';
import type { WorksheetState } from '@biasproof/shared';
import { fmt } from '../format.ts';

/** The words a record uses for states and parts; the same text on every report. */

export const stateLabels: Record<WorksheetState, string> = {
  draft: 'Draft',
  in_check: 'In check',
  checked: 'Checked',
  signed_off: 'Signed off',
  returned: 'Returned',
  withdrawn: 'Withdrawn',
  superseded: 'Superseded',
};

export const kindLabels: Record<Element['kind'], string> = {
  R: 'Resistor',
  C: 'Capacitor',
  L: 'Inductor',
  V: 'Voltage source',
  I: 'Current source',
  D: 'Diode',
  Q: 'Bipolar transistor',
  M: 'MOSFET',
  E: 'VCVS',
  G: 'VCCS',
};

const terminals: Record<Element['kind'], string[]> = {
  R: ['+', '−'],
  C: ['+', '−'],
  L: ['+', '−'],
  V: ['+', '−'],
  I: ['+', '−'],
  D: ['A', 'K'],
  Q: ['C', 'B', 'E'],
  M: ['D', 'G', 'S', 'B'],
  E: ['out+', 'out−', 'in+', 'in−'],
  G: ['out+', 'out−', 'in+', 'in−'],
};

/** `C=out B=b E=e` */
export function nodesText(el: Element): string {
  const names = terminals[el.kind];
  return el.nodes.map((n, i) => `${names[i] ?? i + 1}=${n}`).join('  ');
}

const stimulus = (ac: { mag: number; phase: number } | undefined, unit: string) =>
  ac && ac.mag !== 0 ? `, AC ${fmt(ac.mag, unit)} at ${fmt(ac.phase, '°', 3)}` : '';

/** The element's value as an engineer reads it: `4.7 kΩ`, `DC 12 V, AC 1 V at 0°`, `QN, area 1`. */
export function valueText(el: Element): string {
  switch (el.kind) {
    case 'R':
      return fmt(el.value, 'Ω');
    case 'C':
      return fmt(el.value, 'F');
    case 'L':
      return fmt(el.value, 'H');
    case 'V':
      return `DC ${fmt(el.dc, 'V')}${stimulus(el.ac, 'V')}`;
    case 'I':
      return `DC ${fmt(el.dc, 'A')}${stimulus(el.ac, 'A')}`;
    case 'D':
    case 'Q':
      return `model ${el.model}, area ${fmt(el.area, '')}`;
    case 'M':
      return `model ${el.model}, W ${fmt(el.w, 'm')}, L ${fmt(el.l, 'm')}`;
    case 'E':
      return `gain ${fmt(el.gain, 'V/V')}`;
    case 'G':
      return `transconductance ${fmt(el.gain, 'S')}`;
  }
}

/** `signalSize` → `Signal size`: a key of the results or settings as a label. */
export function humanize(key: string): string {
  const spaced = key.replace(/([a-z0-9])([A-Z])/g, '$1 $2').replace(/[-_]/g, ' ');
  return spaced.charAt(0).toUpperCase() + spaced.slice(1).toLowerCase();
}
