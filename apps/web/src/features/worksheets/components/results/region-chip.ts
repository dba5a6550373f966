import type { DeviceOp } from '@biasproof/calc';
import type { ResultCell } from '@/features/worksheets/components/results/result-csv.ts';

/**
 * The region as a chip. Green where a device of that kind usually sits when biased as an
 * amplifier or a conducting diode; amber where it may be meant but deserves a second look;
 * grey where it does not conduct.
 */
const tones: Record<string, { tone: 'ok' | 'caution' | 'neutral'; title: string }> = {
  'D:forward': { tone: 'ok', title: 'Conducting' },
  'D:off': { tone: 'neutral', title: 'Not conducting' },
  'D:reverse': { tone: 'neutral', title: 'Reverse-biased' },
  'Q:active': { tone: 'ok', title: 'Forward-active: base-emitter on, base-collector off' },
  'Q:saturation': { tone: 'caution', title: 'Both junctions conduct' },
  'Q:cut-off': { tone: 'neutral', title: 'Neither junction conducts' },
  'Q:reverse-active': { tone: 'caution', title: 'Base-collector on, base-emitter off' },
  'M:saturation': { tone: 'ok', title: 'Channel pinched off: VDS ≥ VGS − VTH' },
  'M:triode': { tone: 'caution', title: 'Channel on, VDS < VGS − VTH' },
  'M:cut-off': { tone: 'neutral', title: 'VGS below threshold' },
};

export function regionCell(name: string, op: DeviceOp): ResultCell {
  const look = tones[`${op.kind}:${op.region}`] ?? { tone: 'neutral' as const, title: op.region };
  return { chip: op.region, tone: look.tone, title: look.title, path: `devices.${name}.region` };
}
