import { z } from 'zod';
import type { CircuitInput } from '../circuit.ts';
import { EngineError } from '../errors.ts';
import type { OperatingPoint } from '../operating-point.ts';
import { prepareCircuit } from '../topology.ts';
import {
  deratingPolicySchema,
  type DeratingPolicy,
  type DeratingPolicyInput,
} from './derating-policy.ts';
import { createEvaluator } from './evaluator.ts';
import type { EvaluationSettingsInput } from './settings.ts';
import { parseInput, partRatingSchema, type PartRating, type PartRatingInput } from './spec.ts';

/**
 * Part stress against derated ratings at a bias point: each resistor's power; each diode's
 * forward current, reverse voltage and power; each transistor's power, current and voltage
 * (BJT VCE, MOSFET VDS); and, where a thermal resistance is given, the junction (or body)
 * temperature Tj = Ta + θ·P. A stress within factor × rating passes, one between that and the
 * rating warns, one above the rating fails; without a rating the stress is shown, unrated.
 */

export type StressStatus = 'pass' | 'warn' | 'fail' | 'unrated';
export type StressQuantity =
  'power' | 'current' | 'voltage' | 'reverse-voltage' | 'junction-temperature';

export interface StressCheck {
  quantity: StressQuantity;
  unit: 'W' | 'A' | 'V' | '°C';
  /** The stress (a magnitude; a temperature for junction-temperature). */
  value: number;
  /** The part's rating; null when none is given. */
  rating: number | null;
  /** The policy's factor (null for temperatures and unrated checks). */
  factor: number | null;
  /** What the policy allows: factor × rating, or rated Tj − margin. */
  allowed: number | null;
  /** value / rating, % (for temperatures: of the rated Tj in °C); null when unrated. */
  usePercent: number | null;
  status: StressStatus;
  /** Where the policy's number comes from. */
  source: string | null;
}

export interface PartStressRow {
  element: string;
  kind: 'R' | 'D' | 'Q' | 'M';
  checks: StressCheck[];
  /** The worst status of the checks (unrated only when every check is). */
  status: StressStatus;
}

export interface PartStressResult {
  /** Ambient temperature used for junction temperatures, °C. */
  ambient: number;
  policy: DeratingPolicy;
  rows: PartStressRow[];
}

export interface PartStressInput {
  circuit: CircuitInput;
  /** The bias point to check; solved from circuit and settings when absent. */
  bias?: OperatingPoint | undefined;
  settings?: EvaluationSettingsInput | undefined;
  ratings?: readonly PartRatingInput[] | undefined;
  policy?: DeratingPolicyInput | undefined;
  /** Ambient temperature, °C. Default the bias point's circuit temperature. */
  ambient?: number | undefined;
}

const RANK: Record<StressStatus, number> = { unrated: 0, pass: 1, warn: 2, fail: 3 };

function rated(
  quantity: StressQuantity,
  unit: StressCheck['unit'],
  value: number,
  rating: number | undefined,
  policy: { factor: number; source: string },
): StressCheck {
  if (rating === undefined)
    return {
      quantity,
      unit,
      value,
      rating: null,
      factor: null,
      allowed: null,
      usePercent: null,
      status: 'unrated',
      source: null,
    };
  const allowed = rating * policy.factor;
  const status = value <= allowed ? 'pass' : value <= rating ? 'warn' : 'fail';
  return {
    quantity,
    unit,
    value,
    rating,
    factor: policy.factor,
    allowed,
    usePercent: (value / rating) * 100,
    status,
    source: policy.source,
  };
}

function junction(
  power: number,
  ambient: number,
  r: PartRating | undefined,
  policy: DeratingPolicy,
): StressCheck[] {
  if (r?.thetaJA === undefined) return [];
  const value = ambient + r.thetaJA * Math.max(0, power);
  const base = {
    quantity: 'junction-temperature' as const,
    unit: '°C' as const,
    value,
    factor: null,
  };
  if (r.tjMax === undefined)
    return [
      { ...base, rating: null, allowed: null, usePercent: null, status: 'unrated', source: null },
    ];
  const allowed = r.tjMax - policy.junctionTemperature.marginKelvin;
  const status = value <= allowed ? 'pass' : value <= r.tjMax ? 'warn' : 'fail';
  const usePercent = r.tjMax !== 0 ? (value / r.tjMax) * 100 : null;
  return [
    {
      ...base,
      rating: r.tjMax,
      allowed,
      usePercent,
      status,
      source: policy.junctionTemperature.source,
    },
  ];
}

/** Stress of every resistor, diode and transistor against its derated ratings. */
export function partStress(input: PartStressInput): PartStressResult {
  const policy = parseInput(deratingPolicySchema, input.policy, 'derating policy');
  const ratingList = parseInput(
    z.array(partRatingSchema).max(2000),
    input.ratings ?? [],
    'ratings',
  );
  const circuit = prepareCircuit(input.circuit).circuit;
  const ratings = new Map<string, PartRating>();
  for (const r of ratingList) {
    const name = r.element.toLowerCase();
    const el = circuit.elements.find((e) => e.name === name);
    if (!el)
      throw new EngineError(
        'bad-option',
        `rating for ${name}: no element of that name is in the circuit`,
        { element: name },
      );
    if (!['R', 'D', 'Q', 'M'].includes(el.kind))
      throw new EngineError(
        'bad-option',
        `rating for ${name}: only resistors, diodes and transistors carry ratings`,
        { element: name },
      );
    ratings.set(name, r);
  }
  const bias =
    input.bias ??
    createEvaluator({ circuit: input.circuit, settings: input.settings }).solve([]).bias;
  const ambient =
    parseInput(z.number().finite().gt(-273.15).optional(), input.ambient, 'ambient') ??
    bias.temperature;
  const rows: PartStressRow[] = [];
  for (const el of circuit.elements) {
    const r = ratings.get(el.name);
    let checks: StressCheck[];
    if (el.kind === 'R') {
      const power = Math.abs(bias.elements[el.name]?.power ?? 0);
      checks = [
        rated('power', 'W', power, r?.power, policy.resistorPower),
        ...junction(power, ambient, r, policy),
      ];
    } else if (el.kind === 'D' || el.kind === 'Q' || el.kind === 'M') {
      const d = bias.devices[el.name];
      if (!d) continue;
      const power = Math.abs(d.power);
      if (d.kind === 'D') {
        checks = [
          rated('current', 'A', Math.max(0, d.id), r?.current, policy.diodeForwardCurrent),
          rated(
            'reverse-voltage',
            'V',
            Math.max(0, -d.vd),
            r?.reverseVoltage,
            policy.diodeReverseVoltage,
          ),
          rated('power', 'W', power, r?.power, policy.diodePower),
        ];
      } else {
        const current = Math.abs(d.kind === 'Q' ? d.ic : d.id);
        const voltage = Math.abs(d.kind === 'Q' ? d.vce : d.vds);
        checks = [
          rated('power', 'W', power, r?.power, policy.transistorPower),
          rated('current', 'A', current, r?.current, policy.transistorCurrent),
          rated('voltage', 'V', voltage, r?.voltage, policy.transistorVoltage),
        ];
      }
      checks.push(...junction(power, ambient, r, policy));
    } else continue;
    const status = checks.reduce<StressStatus>(
      (worst, c) => (RANK[c.status] > RANK[worst] ? c.status : worst),
      'unrated',
    );
    rows.push({ element: el.name, kind: el.kind, checks, status });
  }
  return { ambient, policy, rows };
}
