import { EngineError } from '../errors.ts';
import type { OperatingPoint } from '../operating-point.ts';

/**
 * Result paths: the names the worksheet views give their figures (`data-result-path` in the web
 * app), resolved against a bias point and, for the signal figures, the small-signal figures at
 * the worksheet's frequency. Names may themselves hold dots (`nodes.out.1`), so each section
 * takes the rest of the path as one name, and a device or element quantity is the part after
 * the last dot.
 */

/** The small-signal figures a path can name (the shape of SmallSignalFigures). */
export interface SignalFigures {
  gain: { mag: number; db: number; deg: number };
  zin: { mag: number; deg: number };
  zout: { mag: number; deg: number };
}

/** What paths resolve against. */
export interface ResultSource {
  bias: OperatingPoint;
  /** Present when the worksheet has an input source and an output node. */
  smallSignal?: SignalFigures | undefined;
}

export type ParsedResultPath =
  | { section: 'nodes' | 'sources'; name: string }
  | { section: 'devices'; name: string; quantity: string }
  | { section: 'elements'; name: string; quantity: 'current' | 'power' }
  | { section: 'supplyPower' }
  | { section: 'gain'; quantity: 'vv' | 'db' | 'deg' }
  | { section: 'zin' | 'zout'; quantity: 'ohm' | 'deg' };

export const RESULT_PATH_FORMS =
  'nodes.NODE, sources.VSOURCE, devices.DEVICE.QUANTITY, elements.ELEMENT.current|power, supplyPower, gain.vv|db|deg, zin.ohm|deg or zout.ohm|deg';

function badPath(path: string, why: string): EngineError {
  return new EngineError('bad-option', `result path '${path}': ${why}`);
}

function splitLast(path: string, rest: string): [string, string] {
  const dot = rest.lastIndexOf('.');
  if (dot <= 0 || dot === rest.length - 1)
    throw badPath(path, 'give the name and the quantity, e.g. devices.q1.ic');
  return [rest.slice(0, dot).toLowerCase(), rest.slice(dot + 1)];
}

/** Checks a path's form (not whether its names exist); throws EngineError `bad-option`. */
export function parseResultPath(path: string): ParsedResultPath {
  const p = path.trim();
  if (p === 'supplyPower') return { section: 'supplyPower' };
  const dot = p.indexOf('.');
  const head = dot < 0 ? p : p.slice(0, dot);
  const rest = dot < 0 ? '' : p.slice(dot + 1);
  switch (head) {
    case 'nodes':
    case 'sources':
      if (rest === '') throw badPath(path, `name the ${head === 'nodes' ? 'node' : 'source'}`);
      return { section: head, name: rest.toLowerCase() };
    case 'devices': {
      const [name, quantity] = splitLast(path, rest);
      return { section: 'devices', name, quantity };
    }
    case 'elements': {
      const [name, quantity] = splitLast(path, rest);
      if (quantity !== 'current' && quantity !== 'power')
        throw badPath(path, 'an element quantity is current or power');
      return { section: 'elements', name, quantity };
    }
    case 'gain':
      if (rest === 'vv' || rest === 'db' || rest === 'deg')
        return { section: 'gain', quantity: rest };
      throw badPath(path, 'gain is gain.vv, gain.db or gain.deg');
    case 'zin':
    case 'zout':
      if (rest === 'ohm' || rest === 'deg') return { section: head, quantity: rest };
      throw badPath(path, `${head} is ${head}.ohm or ${head}.deg`);
    default:
      throw badPath(path, `expected one of ${RESULT_PATH_FORMS}`);
  }
}

/** True for the paths that need the small-signal analysis (gain, zin, zout). */
export function needsSmallSignal(parsed: ParsedResultPath): boolean {
  return parsed.section === 'gain' || parsed.section === 'zin' || parsed.section === 'zout';
}

/** The value a parsed path names, or undefined when the source has no such figure. */
export function readResultPath(source: ResultSource, parsed: ParsedResultPath): number | undefined {
  const op = source.bias;
  switch (parsed.section) {
    case 'nodes':
      return op.nodes[parsed.name];
    case 'sources':
      return op.sources[parsed.name];
    case 'supplyPower':
      return op.supplyPower;
    case 'elements':
      return op.elements[parsed.name]?.[parsed.quantity];
    case 'devices': {
      const value = (op.devices[parsed.name] as unknown as Record<string, unknown> | undefined)?.[
        parsed.quantity
      ];
      return typeof value === 'number' ? value : undefined;
    }
    case 'gain': {
      const g = source.smallSignal?.gain;
      if (!g) return undefined;
      return parsed.quantity === 'vv' ? g.mag : g[parsed.quantity];
    }
    default: {
      const z = source.smallSignal?.[parsed.section];
      if (!z) return undefined;
      return parsed.quantity === 'ohm' ? z.mag : z.deg;
    }
  }
}

/** Why a well-formed path names nothing in this source: the message of the error an entry point throws. */
export function missingPathReason(
  source: ResultSource,
  parsed: ParsedResultPath,
  path: string,
): string {
  const op = source.bias;
  const list = (keys: string[]): string => (keys.length > 0 ? keys.join(', ') : 'none');
  switch (parsed.section) {
    case 'nodes':
      return `result path '${path}': node ${parsed.name} is not in the circuit (nodes: ${list(Object.keys(op.nodes))})`;
    case 'sources':
      return `result path '${path}': ${parsed.name} is not a voltage source of the circuit (sources: ${list(Object.keys(op.sources))})`;
    case 'elements':
      return `result path '${path}': element ${parsed.name} is not in the circuit`;
    case 'devices': {
      const device = op.devices[parsed.name];
      if (!device)
        return `result path '${path}': ${parsed.name} is not a diode, BJT or MOSFET of the circuit (devices: ${list(Object.keys(op.devices))})`;
      const numeric = Object.entries(device)
        .filter(([, v]) => typeof v === 'number')
        .map(([k]) => k);
      return `result path '${path}': ${parsed.name} has no quantity ${parsed.quantity} (it has ${numeric.join(', ')})`;
    }
    default:
      return `result path '${path}': the gain and impedances need the input source and the output node in the settings`;
  }
}

/** The value of a path, throwing EngineError `bad-option` when the path is malformed or names nothing. */
export function resolveResultPath(source: ResultSource, path: string): number {
  const parsed = parseResultPath(path);
  const value = readResultPath(source, parsed);
  if (value === undefined)
    throw new EngineError('bad-option', missingPathReason(source, parsed, path));
  return value;
}

/** Each path's value in the source, null where the path names nothing (for limits and hand checks). */
export function resultValues(
  source: ResultSource,
  paths: readonly string[],
): Record<string, number | null> {
  const out: Record<string, number | null> = {};
  for (const path of paths) out[path] = readResultPath(source, parseResultPath(path)) ?? null;
  return out;
}
