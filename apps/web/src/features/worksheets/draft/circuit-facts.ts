import {
  isGround,
  sameName,
  type DeviceModel,
  type DraftCircuit,
  type Element,
  type ModelKind,
} from '@biasproof/calc';

/** Read-only questions the editor asks of a circuit. */

/** Non-ground node names in order of first use, lowercase. */
export function circuitNodes(circuit: DraftCircuit): string[] {
  const seen = new Set<string>();
  for (const el of circuit.elements) {
    for (const node of el.nodes) {
      const n = node.trim().toLowerCase();
      if (n !== '' && !isGround(n)) seen.add(n);
    }
  }
  return [...seen];
}

/** Independent sources, the only elements that can carry the input signal. */
export function independentSources(circuit: DraftCircuit): Element[] {
  return circuit.elements.filter((el) => el.kind === 'V' || el.kind === 'I');
}

export function findElementIndex(circuit: DraftCircuit, name: string): number {
  return circuit.elements.findIndex((el) => sameName(el.name, name));
}

/** First free name with the element's letter: R1, R2… (names are unique case-insensitively). */
export function nextElementName(circuit: DraftCircuit, letter: string): string {
  const taken = new Set(circuit.elements.map((el) => el.name.toLowerCase()));
  for (let i = 1; ; i++) {
    const name = `${letter}${i}`;
    if (!taken.has(name.toLowerCase())) return name;
  }
}

/** Model kinds an element of this kind can use. */
export function modelKindsFor(kind: Element['kind']): readonly ModelKind[] {
  if (kind === 'D') return ['D'];
  if (kind === 'Q') return ['NPN', 'PNP'];
  if (kind === 'M') return ['NMOS', 'PMOS'];
  return [];
}

export function modelsFor(circuit: DraftCircuit, kind: Element['kind']): DeviceModel[] {
  const kinds = modelKindsFor(kind);
  return circuit.models.filter((m) => kinds.includes(m.kind));
}

/** Elements that name this model. */
export function modelUsers(circuit: DraftCircuit, modelName: string): Element[] {
  return circuit.elements.filter((el) => 'model' in el && sameName(el.model, modelName));
}

/** The element's name as the author wrote it, for an engine name (lowercase). */
export function displayName(circuit: DraftCircuit, engineName: string): string {
  return (
    circuit.elements.find((el) => sameName(el.name, engineName))?.name ?? engineName.toUpperCase()
  );
}
