import type { DeviceModel, Element } from '../circuit.ts';
import { toKelvin } from '../constants.ts';
import { compileDevice, type CompiledElement, type DeviceScaling } from '../mna.ts';
import { bjtAtTemperature, type BjtAtTemperature } from '../models/bjt.ts';
import { diodeAtTemperature, type DiodeAtTemperature } from '../models/diode.ts';
import { mosfetAtTemperature, type MosfetAtTemperature } from '../models/mosfet.ts';
import type { DeviceStamp } from '../models/stamp.ts';
import type { PreparedCircuit } from '../prepared.ts';
import { sameInternals, withModelParameters } from './model-variant.ts';

/**
 * Model variants for a run of many samples solved one after another (Monte Carlo, corners,
 * sensitivities). withModelParameters gives every variant new device stamps; a solve through
 * stamps it has not seen costs about twice as much, because the engine's calls into them stop
 * being monomorphic. Here each device of a varied model keeps one stamp for the whole run, and a
 * variant rewrites, in place, the temperature-scaled parameter record the stamp reads on every
 * call (the records of models/*.ts are read at call time, not copied at creation). So a variant
 * is valid only until the next one is made: the run solves each variant at once and keeps only
 * its results. A change that adds or removes an internal node, or turns a BJT's base resistance
 * bias-dependent, falls back to withModelParameters. test/variation-model-variant.test.ts checks
 * this path against cold solves of the edited cards.
 */

/** Parameters whose change can add or remove an internal node, make RB bias-dependent, or void a MOSFET's length. */
const STRUCTURAL = new Set(['RS', 'RB', 'RBM', 'RC', 'RE', 'RD', 'LD']);

type Scaled = DiodeAtTemperature | BjtAtTemperature | MosfetAtTemperature;

interface DeviceSlot {
  index: number;
  el: Extract<Element, { kind: 'D' | 'Q' | 'M' }>;
  stamp: DeviceStamp;
  /** The record the stamp reads, rewritten per variant. */
  scaled: Scaled;
  variableRb: boolean;
}

export interface ModelSlots {
  /** `prepared` (the base or a variant of it) with the model's parameters replaced; valid until the next call. */
  apply(prepared: PreparedCircuit, params: Readonly<Record<string, number>>): PreparedCircuit;
}

function rescale(
  slot: DeviceSlot,
  card: Record<string, number>,
  model: DeviceModel,
  tempK: number,
  tnomK: number,
): Scaled {
  const el = slot.el;
  if (el.kind === 'D') return diodeAtTemperature(card, el.area, tempK, tnomK);
  if (el.kind === 'Q')
    return bjtAtTemperature(card, model.kind === 'PNP' ? -1 : 1, el.area, tempK, tnomK);
  return mosfetAtTemperature(card, model.kind === 'PMOS' ? -1 : 1, el.w, el.l, tempK, tnomK);
}

/** Series resistances of the device from its new record, in compileDevice's order and labels. */
function seriesValue(label: string, s: Scaled): number {
  if (label === 'rc') return (s as BjtAtTemperature).rc;
  if (label === 're') return (s as BjtAtTemperature).re;
  if (label === 'rb') return (s as BjtAtTemperature).rbpr;
  if (label === 'rd') return (s as MosfetAtTemperature).rd;
  return (s as DiodeAtTemperature | MosfetAtTemperature).rs;
}

/** Slots for the devices of `modelName` in the base's compiled system (compiled at one temperature). */
export function modelSlots(base: PreparedCircuit, modelName: string): ModelSlots {
  const key = modelName.toLowerCase();
  const compiled = base.compiled;
  const generic: ModelSlots = { apply: (p, params) => withModelParameters(p, key, params) };
  if (!compiled) return generic;
  const system = compiled.system;
  const tempK = toKelvin(compiled.temperature);
  const slots: DeviceSlot[] = [];
  system.elements.forEach((ce, index) => {
    const el = ce.el;
    if (!(el.kind === 'D' || el.kind === 'Q' || el.kind === 'M') || el.model !== key || !ce.device)
      return;
    // One record per device: compileDevice shares one per card and geometry, through this map.
    const scaling: DeviceScaling = {
      tempK,
      nominalTemperature: compiled.nominalTemperature,
      scaled: new Map(),
    };
    const internals = sameInternals(el, base.cards, system.unknownNames)!;
    const own: CompiledElement = { el, terms: ce.terms, branch: ce.branch, series: [] };
    const stamp = compileDevice(base, el, own, internals, scaling, system.stride, undefined);
    const scaled = [...scaling.scaled.values()][0] as Scaled;
    slots.push({
      index,
      el,
      stamp,
      scaled,
      variableRb: el.kind === 'Q' && (scaled as BjtAtTemperature).rbpi > 0,
    });
  });
  if (slots.length === 0) return generic;
  const devices = system.devices.slice();
  for (const s of slots) devices[devices.indexOf(system.elements[s.index]!.device!)] = s.stamp;

  return {
    apply(prepared, params) {
      const c = prepared.compiled;
      const model = prepared.models.get(key)!;
      if (
        !c ||
        c.system.unknownNames !== system.unknownNames ||
        c.temperature !== compiled.temperature
      )
        return withModelParameters(prepared, key, params);
      const changed: Record<string, number> = { ...model.params };
      // The card is the prepared one with the changes (resolveModelParams's result, without
      // redoing the defaults): RBM follows RB unless the card sets it.
      const card: Record<string, number> = { ...prepared.cards.get(key)! };
      for (const name in params) {
        const upper = name.toUpperCase();
        changed[upper] = params[name]!;
        card[upper] = params[name]!;
        if (upper === 'RB' && !('RBM' in model.params)) card.RBM = params[name]!;
      }
      const nextModel: DeviceModel = { ...model, params: changed };
      const cards = new Map(prepared.cards);
      cards.set(key, card);
      const tnomK = toKelvin(card.TNOM ?? compiled.nominalTemperature);
      const fresh = slots.map((s) => rescale(s, card, nextModel, tempK, tnomK));
      let structural = false;
      for (const name in params) if (STRUCTURAL.has(name.toUpperCase())) structural = true;
      const fits =
        !structural ||
        slots.every(
          (s, k) =>
            sameInternals(s.el, cards, system.unknownNames) !== undefined &&
            (s.el.kind !== 'Q' || (fresh[k] as BjtAtTemperature).rbpi > 0 === s.variableRb) &&
            (s.el.kind !== 'M' || s.el.l - 2 * card.LD! > 0),
        );
      if (!fits) return withModelParameters(prepared, key, params);
      const elements = c.system.elements.slice();
      for (let k = 0; k < slots.length; k++) {
        const s = slots[k]!;
        Object.assign(s.scaled, fresh[k]);
        for (const port of s.stamp.ports)
          if (port.nvt !== 0)
            port.nvt =
              s.el.kind === 'Q'
                ? nvtOf(port.label, s.scaled as BjtAtTemperature)
                : (s.scaled as DiodeAtTemperature).nvt;
        const old = elements[s.index]!;
        elements[s.index] = {
          el: old.el,
          terms: old.terms,
          branch: old.branch,
          device: s.stamp,
          series:
            old.series.length === 0
              ? old.series
              : old.series.map((r) => ({
                  label: r.label,
                  nodes: r.nodes,
                  value: seriesValue(r.label, s.scaled),
                })),
        };
      }
      const models = new Map(prepared.models);
      models.set(key, nextModel);
      const circuit = {
        ...prepared.circuit,
        models: prepared.circuit.models.map((m) => (m.name === key ? nextModel : m)),
      };
      return {
        circuit,
        nodes: prepared.nodes,
        models,
        cards,
        warnings: prepared.warnings,
        compiled: { ...c, system: { ...c.system, elements, devices } },
      };
    },
  };
}

function nvtOf(label: string, q: BjtAtTemperature): number {
  return (label === 'BC' ? q.nr : q.nf) * q.vt;
}
