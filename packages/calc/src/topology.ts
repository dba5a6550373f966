import type { z } from 'zod';
import {
  circuitSchema,
  isGround,
  type Circuit,
  type CircuitInput,
  type DeviceModel,
  type Element,
} from './circuit.ts';
import { EngineError } from './errors.ts';
import { resolveModelParams, unsupportedParams } from './models/defaults.ts';

/**
 * Validation at the engine's entry: the schema, names, models, and the topology checks that make
 * an MNA matrix singular. Catching these by graph inspection names the culprit exactly, where a
 * singular pivot would only name a matrix column.
 */

/** The canonical name of ground after validation. */
export const GROUND = '0';

/** A circuit that passed every check, with lowercase names. */
export interface ValidatedCircuit {
  /** The parsed circuit; element, node and model names lowercase, ground as `0`. */
  circuit: Circuit;
  /** Non-ground nodes in order of first appearance. */
  nodes: string[];
  /** Models by lowercase name. */
  models: Map<string, DeviceModel>;
  /** Each used model's parameters with SPICE defaults filled in, by lowercase name. */
  cards: Map<string, Record<string, number>>;
  /** Model parameters the engine does not evaluate, one message each. */
  warnings: string[];
}

const MODEL_KINDS: Partial<Record<Element['kind'], readonly string[]>> = {
  D: ['D'],
  Q: ['NPN', 'PNP'],
  M: ['NMOS', 'PMOS'],
};

const TWO_TERMINAL: readonly (readonly [number, number])[] = [[0, 1]];
const BJT_PAIRS: readonly (readonly [number, number])[] = [
  [0, 1],
  [1, 2],
];
const MOSFET_PAIRS: readonly (readonly [number, number])[] = [
  [0, 2],
  [2, 3],
];

/** Terminal pairs that conduct at DC (used for the path-to-ground check). */
function dcPairs(el: Element): readonly (readonly [number, number])[] {
  switch (el.kind) {
    case 'R':
    case 'L':
    case 'V':
    case 'D':
    case 'E':
      return TWO_TERMINAL;
    case 'Q':
      return BJT_PAIRS;
    case 'M':
      return MOSFET_PAIRS;
    default:
      return [];
  }
}

function zodToEngineError(input: CircuitInput, error: z.ZodError): EngineError {
  const issue = error.issues[0]!;
  const [head, index, field] = issue.path;
  if (head === 'elements' && typeof index === 'number') {
    const raw = (input.elements as unknown[] | undefined)?.[index] as
      { name?: unknown } | undefined;
    const name = typeof raw?.name === 'string' ? raw.name.toLowerCase() : `element #${index + 1}`;
    const what = field === undefined ? '' : ` ${String(field)}`;
    return new EngineError('invalid-circuit', `${name}${what}: ${issue.message}`, {
      element: name,
    });
  }
  return new EngineError(
    'invalid-circuit',
    `${issue.path.join('.') || 'circuit'}: ${issue.message}`,
  );
}

/** Disjoint sets over node names, for the loop and path checks. */
function unionFind(): { find(a: string): string; union(a: string, b: string): boolean } {
  const parent = new Map<string, string>();
  const find = (a: string): string => {
    let root = a;
    for (let up = parent.get(root); up !== undefined; up = parent.get(root)) root = up;
    if (root !== a) parent.set(a, root);
    return root;
  };
  return {
    find,
    /** Joins two sets; false when they were already one. */
    union(a, b) {
      const ra = find(a);
      const rb = find(b);
      if (ra === rb) return false;
      parent.set(ra, rb);
      return true;
    },
  };
}

/** Throws `voltage-source-loop` if the voltage-defined branches (plus `extra`) form a loop. */
export function checkVoltageLoops(
  circuit: Circuit,
  extra: { name: string; nodes: [string, string] }[] = [],
): void {
  const uf = unionFind();
  const branches = circuit.elements
    .filter((el) => el.kind === 'V' || el.kind === 'L' || el.kind === 'E')
    .map((el) => ({ name: el.name, nodes: [el.nodes[0], el.nodes[1]] as [string, string] }))
    .concat(extra);
  for (const br of branches) {
    if (!uf.union(br.nodes[0], br.nodes[1])) {
      throw new EngineError(
        'voltage-source-loop',
        `${br.name} closes a loop of voltage sources and inductors (${br.nodes[0]}–${br.nodes[1]}): the loop's current is undetermined`,
        { element: br.name, node: br.nodes[0] },
      );
    }
  }
}

function canonicalNode(n: string): string {
  return isGround(n) ? GROUND : n.toLowerCase();
}

/** Validates a circuit and runs every check that does not need the numerics. */
export function prepareCircuit(input: CircuitInput): ValidatedCircuit {
  const parsed = circuitSchema.safeParse(input);
  if (!parsed.success) throw zodToEngineError(input, parsed.error);
  // zod's output is a fresh copy that nothing else holds, so it is made canonical in place.
  const circuit: Circuit = parsed.data;
  for (const el of circuit.elements) {
    el.name = el.name.toLowerCase();
    const nodes = el.nodes as string[];
    for (let i = 0; i < nodes.length; i++) nodes[i] = canonicalNode(nodes[i]!);
    if ('model' in el) el.model = el.model.toLowerCase();
  }
  for (const m of circuit.models) m.name = m.name.toLowerCase();
  if (circuit.elements.length === 0)
    throw new EngineError('invalid-circuit', 'the circuit has no elements');

  const seen = new Set<string>();
  for (const el of circuit.elements) {
    if (seen.has(el.name))
      throw new EngineError('invalid-circuit', `element name ${el.name} is used twice`, {
        element: el.name,
      });
    seen.add(el.name);
  }
  const models = new Map<string, DeviceModel>();
  for (const m of circuit.models) {
    if (models.has(m.name))
      throw new EngineError('invalid-circuit', `model ${m.name} is defined twice`);
    models.set(m.name, m);
  }
  const warnings: string[] = [];
  const cards = new Map<string, Record<string, number>>();
  for (const el of circuit.elements) {
    if (!('model' in el)) continue;
    const model = models.get(el.model);
    if (!model)
      throw new EngineError(
        'unknown-model',
        `${el.name} uses model ${el.model}, which is not defined`,
        { element: el.name },
      );
    if (!MODEL_KINDS[el.kind]!.includes(model.kind)) {
      throw new EngineError(
        'unknown-model',
        `${el.name} needs a ${MODEL_KINDS[el.kind]!.join(' or ')} model, but ${el.model} is ${model.kind}`,
        {
          element: el.name,
        },
      );
    }
    if (!cards.has(model.name)) {
      cards.set(model.name, resolveModelParams(model));
      for (const p of unsupportedParams(model))
        warnings.push(
          `model ${model.name}: parameter ${p} is not evaluated by the engine and was ignored`,
        );
    }
  }

  // Every non-ground node must be named by at least two terminals.
  const nodes: string[] = [];
  const terminals = new Map<string, { count: number; element: string }>();
  for (const el of circuit.elements) {
    for (const n of el.nodes) {
      if (n === GROUND) continue;
      const t = terminals.get(n);
      if (t) t.count++;
      else {
        terminals.set(n, { count: 1, element: el.name });
        nodes.push(n);
      }
    }
  }
  for (const n of nodes) {
    const t = terminals.get(n)!;
    if (t.count === 1) {
      throw new EngineError(
        'dangling-node',
        `node ${n} is connected only to ${t.element}: connect it to something else or remove it`,
        {
          node: n,
          element: t.element,
        },
      );
    }
  }

  checkVoltageLoops(circuit);

  const uf = unionFind();
  for (const el of circuit.elements)
    for (const [i, j] of dcPairs(el)) uf.union(el.nodes[i]!, el.nodes[j]!);
  const groundRoot = uf.find(GROUND);
  for (const n of nodes) {
    if (uf.find(n) !== groundRoot) {
      const el = circuit.elements.find((e) => e.nodes.includes(n))!;
      throw new EngineError(
        'floating-node',
        `node ${n} has no DC path to ground (it connects only through capacitors, current sources or gates)`,
        {
          node: n,
          element: el.name,
        },
      );
    }
  }
  return { circuit, nodes, models, cards, warnings };
}
