import { decodeNonFinite } from './api/canonical-json.ts';

/**
 * Every number of a revision at a dotted path, as findings pin them and the diff compares them.
 *
 * Result paths are the ones the web app puts on every number it shows (`data-result-path`):
 * the bias point at the top (`nodes.out`, `devices.q1.ic`, `elements.r1.current`,
 * `sources.vcc`, `supplyPower`), then `smallSignal.devices.q1.gm`, `gain.vv`, `zin.ohm`,
 * `sweep.midbandDb`, `signalSize.errorPercent`, `signalSize.ports.q1.BE.ratio`,
 * `loadLine.d1.q.v` and `comparison.ideal.nodes.out`. Input paths name elements and models by
 * their lowercase names (`elements.r2.value`, `elements.v1.ac.mag`, `models.qn.BF`) and
 * settings under `settings.` (`settings.temperature`). Findings are pinned to these paths, so
 * a finding, the results view and the diff all speak of the same number the same way.
 */

/** A scalar at a path: finite numbers as numbers, non-finite ones as `"Infinity"`, `"-Infinity"`, `"NaN"`. */
export type PathValue = number | string | boolean | null;
export type PathValues = Map<string, PathValue>;

/** The content of a revision the paths are read from (results as stored or decoded). */
export interface RevisionContent {
  circuit: unknown;
  settings: unknown;
  results: unknown;
}

type Obj = Record<string, unknown>;
const isObj = (v: unknown): v is Obj => v !== null && typeof v === 'object' && !Array.isArray(v);
const list = (v: unknown): Obj[] => (Array.isArray(v) ? v.filter(isObj) : []);

function scalar(v: unknown): PathValue | undefined {
  if (v === null) return null;
  if (typeof v === 'number') return Number.isFinite(v) ? v : String(v);
  if (typeof v === 'string' || typeof v === 'boolean') return v;
  return undefined;
}

/**
 * Every scalar leaf below `prefix`. A list of words (warnings) becomes one text; lists of
 * points (sweeps, curves) are left out, because their figures (corners, Q-point) are paths.
 */
function walk(out: PathValues, prefix: string, value: unknown, skip: readonly string[] = []) {
  const leaf = scalar(value);
  if (leaf !== undefined) {
    out.set(prefix, leaf);
  } else if (Array.isArray(value)) {
    if (value.every((x) => typeof x === 'string')) out.set(prefix, value.join('; '));
  } else if (isObj(value)) {
    for (const [key, item] of Object.entries(value)) {
      if (!skip.includes(key)) walk(out, prefix ? `${prefix}.${key}` : key, item);
    }
  }
}

/** An engine `Outcome` (or `Missing`): its value's paths, or `<prefix>.error` / `<prefix>.missing`. */
function outcome(out: PathValues, prefix: string, o: unknown, onValue: (value: unknown) => void) {
  if (!isObj(o)) return;
  if (o.ok === true) onValue(o.value);
  else if ('missing' in o) out.set(`${prefix}.missing`, scalar(o.missing) ?? null);
  else out.set(`${prefix}.error`, isObj(o.error) ? (scalar(o.error.message) ?? null) : null);
}

function comparisonPaths(out: PathValues, value: unknown) {
  for (const law of list(isObj(value) ? value.laws : undefined)) {
    const base = `comparison.${String(law.law)}`;
    if (isObj(law.error)) out.set(`${base}.error`, scalar(law.error.message) ?? null);
    const op = isObj(law.operatingPoint) ? law.operatingPoint : {};
    const nodeDiff = isObj(law.nodeDifferencePercent) ? law.nodeDifferencePercent : {};
    const currentDiff = isObj(law.currentDifferencePercent) ? law.currentDifferencePercent : {};
    for (const [node, v] of Object.entries(isObj(op.nodes) ? op.nodes : {})) {
      walk(out, `${base}.nodes.${node}`, v);
      if (node in nodeDiff) walk(out, `${base}.nodes.${node}.diffPercent`, nodeDiff[node]);
    }
    for (const [device, d] of Object.entries(isObj(op.devices) ? op.devices : {})) {
      if (!isObj(d)) continue;
      // The main current the comparison table shows: IC of a BJT, ID of a diode or MOSFET.
      walk(out, `${base}.devices.${device}.current`, d.kind === 'Q' ? d.ic : d.id);
      if (device in currentDiff) {
        walk(out, `${base}.devices.${device}.current.diffPercent`, currentDiff[device]);
      }
    }
  }
}

function smallSignalFigures(out: PathValues, value: unknown) {
  if (!isObj(value)) return;
  const part = (name: string, magnitude: string, keys: string[]) => {
    const p = isObj(value[name]) ? value[name] : {};
    walk(out, `${name}.${magnitude}`, p.mag);
    for (const key of keys) walk(out, `${name}.${key}`, p[key]);
  };
  part('gain', 'vv', ['db', 'deg']);
  part('zin', 'ohm', ['deg']);
  part('zout', 'ohm', ['deg']);
}

/** The result numbers of a stored (or decoded) `WorksheetResults`, by path. */
export function flattenResults(stored: unknown): PathValues {
  const out: PathValues = new Map();
  const r = decodeNonFinite(stored);
  if (!isObj(r)) return out;
  out.set('status', scalar(r.status) ?? null);
  if (r.status === 'failed') walk(out, 'error', r.error);
  if (r.status !== 'solved') return out;
  walk(out, '', r.bias);
  outcome(out, 'comparison', r.comparison, (v) => comparisonPaths(out, v));
  outcome(out, 'smallSignal.devices', r.devices, (v) => {
    for (const [device, d] of Object.entries(isObj(v) ? v : {})) {
      const base = `smallSignal.devices.${device}`;
      walk(out, base, d, ['betaAc']);
      if (isObj(d) && 'betaAc' in d) walk(out, `${base}.beta`, d.betaAc);
    }
  });
  outcome(out, 'smallSignal', r.smallSignal, (v) => smallSignalFigures(out, v));
  outcome(out, 'sweep', r.sweep, (v) => walk(out, 'sweep', v));
  outcome(out, 'signalSize', r.signalSize, (v) => {
    walk(out, 'signalSize', v, ['ports']);
    for (const p of list(isObj(v) ? v.ports : undefined)) {
      walk(out, `signalSize.ports.${String(p.device)}.${String(p.port)}`, p, ['device', 'port']);
    }
  });
  for (const line of list(r.loadLines)) {
    const base = `loadLine.${String(line.device)}`;
    outcome(out, base, line.result, (v) => walk(out, base, v, ['device']));
  }
  return out;
}

/** The inputs of a revision by path: `title`, `elements.<name>.<field>`, `models.<name>.<PARAM>`, `settings.…`. */
export function flattenInputs(circuit: unknown, settings: unknown): PathValues {
  const out: PathValues = new Map();
  const c = isObj(circuit) ? circuit : {};
  walk(out, 'title', c.title);
  for (const el of list(c.elements)) {
    if (typeof el.name !== 'string') continue;
    const base = `elements.${el.name.toLowerCase()}`;
    walk(out, base, el, ['name', 'nodes']);
    // Nodes read as a SPICE card writes them: `out 0`.
    if (Array.isArray(el.nodes)) out.set(`${base}.nodes`, el.nodes.map(String).join(' '));
  }
  for (const model of list(c.models)) {
    if (typeof model.name !== 'string') continue;
    const base = `models.${model.name.toLowerCase()}`;
    walk(out, base, model, ['name', 'params']);
    walk(out, base, model.params);
  }
  walk(out, 'settings', settings);
  return out;
}

export interface RevisionValues {
  inputs: PathValues;
  results: PathValues;
}

export function revisionValues(content: RevisionContent): RevisionValues {
  return {
    inputs: flattenInputs(content.circuit, content.settings),
    results: flattenResults(content.results),
  };
}

/**
 * The value at a finding's path: a result first (as the results view names it, or with the
 * diff's `results.` prefix), else an input. Undefined when the revision has no such number.
 */
export function valueAtPath(values: RevisionValues, path: string): PathValue | undefined {
  if (path.startsWith('results.')) return values.results.get(path.slice('results.'.length));
  return values.results.has(path) ? values.results.get(path) : values.inputs.get(path);
}

/** Equal, where numbers may differ by `relativeTolerance` of the larger magnitude. */
export function samePathValue(
  a: PathValue | undefined,
  b: PathValue | undefined,
  relativeTolerance = 0,
): boolean {
  if (typeof a === 'number' && typeof b === 'number') {
    return a === b || Math.abs(a - b) <= relativeTolerance * Math.max(Math.abs(a), Math.abs(b));
  }
  return a === b;
}
