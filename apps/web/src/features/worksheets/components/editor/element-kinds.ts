import type { ElementKind } from '@biasproof/calc';

/** What the editor knows about each kind of element: its words, terminals and typed fields. */

export interface ValueFieldSpec {
  /** Key in the element form's `values`. */
  key: 'value' | 'dc' | 'acMag' | 'acPhase' | 'area' | 'w' | 'l' | 'gain';
  label: string;
  /** Unit the text is checked against (`10uF` in a resistor is refused); none: trailing letters ignored. */
  unit?: string;
  /** Unit shown in the table. */
  displayUnit: string;
  /** May be left empty. */
  optional?: boolean;
  /** Must be > 0. */
  positive?: boolean;
  placeholder: string;
}

export interface KindSpec {
  kind: ElementKind;
  label: string;
  nodeLabels: readonly string[];
  usesModel: boolean;
  fields: readonly ValueFieldSpec[];
  hint?: string;
}

const value = (label: string, unit: string, placeholder: string): ValueFieldSpec => ({
  key: 'value',
  label,
  unit,
  displayUnit: unit,
  positive: true,
  placeholder,
});
const area: ValueFieldSpec = {
  key: 'area',
  label: 'Area factor',
  displayUnit: '',
  positive: true,
  placeholder: '1',
};
const twoNodes = ['First', 'Second'] as const;
const sourceNodes = ['+', '−'] as const;
const fourNodes = ['Output +', 'Output −', 'Control +', 'Control −'] as const;
const sourceFields = (unit: 'V' | 'A'): ValueFieldSpec[] => [
  {
    key: 'dc',
    label: unit === 'V' ? 'DC voltage' : 'DC current',
    unit,
    displayUnit: unit,
    placeholder: unit === 'V' ? '5' : '1m',
  },
  {
    key: 'acMag',
    label: 'AC magnitude',
    unit,
    displayUnit: unit,
    optional: true,
    placeholder: 'none',
  },
  {
    key: 'acPhase',
    label: 'AC phase',
    unit: '°',
    displayUnit: '°',
    optional: true,
    placeholder: '0',
  },
];

export const kindSpecs: Record<ElementKind, KindSpec> = {
  R: {
    kind: 'R',
    label: 'Resistor',
    nodeLabels: twoNodes,
    usesModel: false,
    fields: [value('Resistance', 'Ω', '4k7')],
  },
  C: {
    kind: 'C',
    label: 'Capacitor',
    nodeLabels: twoNodes,
    usesModel: false,
    fields: [value('Capacitance', 'F', '10u')],
  },
  L: {
    kind: 'L',
    label: 'Inductor',
    nodeLabels: twoNodes,
    usesModel: false,
    fields: [value('Inductance', 'H', '1m')],
  },
  V: {
    kind: 'V',
    label: 'Voltage source',
    nodeLabels: sourceNodes,
    usesModel: false,
    fields: sourceFields('V'),
    hint: 'Holds V(+) − V(−) at the DC value.',
  },
  I: {
    kind: 'I',
    label: 'Current source',
    nodeLabels: sourceNodes,
    usesModel: false,
    fields: sourceFields('A'),
    hint: 'The current flows from the + node through the source to the − node.',
  },
  D: {
    kind: 'D',
    label: 'Diode',
    nodeLabels: ['Anode', 'Cathode'],
    usesModel: true,
    fields: [area],
  },
  Q: {
    kind: 'Q',
    label: 'Bipolar transistor',
    nodeLabels: ['Collector', 'Base', 'Emitter'],
    usesModel: true,
    fields: [area],
  },
  M: {
    kind: 'M',
    label: 'MOSFET',
    nodeLabels: ['Drain', 'Gate', 'Source', 'Bulk'],
    usesModel: true,
    fields: [
      {
        key: 'w',
        label: 'Channel width W',
        unit: 'm',
        displayUnit: 'm',
        positive: true,
        placeholder: '10u',
      },
      {
        key: 'l',
        label: 'Channel length L',
        unit: 'm',
        displayUnit: 'm',
        positive: true,
        placeholder: '1u',
      },
    ],
  },
  E: {
    kind: 'E',
    label: 'Voltage-controlled voltage source',
    nodeLabels: fourNodes,
    usesModel: false,
    fields: [{ key: 'gain', label: 'Gain (V/V)', displayUnit: 'V/V', placeholder: '10' }],
  },
  G: {
    kind: 'G',
    label: 'Voltage-controlled current source',
    nodeLabels: fourNodes,
    usesModel: false,
    fields: [
      { key: 'gain', label: 'Transconductance', unit: 'S', displayUnit: 'S', placeholder: '1m' },
    ],
  },
};

export const elementKinds = Object.keys(kindSpecs) as ElementKind[];
