import { formatValue } from '@biasproof/calc';

/** Axis tick text: short, SI-prefixed. */
export const tick = (unit: string) => (x: number) => formatValue(x, unit, { digits: 3 });

/** Powers of ten from lo to hi, for a log axis. */
export function decadeTicks(lo: number, hi: number): number[] {
  const out: number[] = [];
  for (let e = Math.floor(Math.log10(lo)); e <= Math.ceil(Math.log10(hi)); e++) {
    const f = 10 ** e;
    if (f >= lo * 0.999 && f <= hi * 1.001) out.push(f);
  }
  return out;
}

/** Colours of the plots, from the app's palette (teal, fault red, ink, ochre). */
export const plotColours = {
  primary: '#125e63',
  secondary: '#9b2419',
  ink: '#394452',
  marker: '#5f4f0e',
  grid: '#d8dcd4',
} as const;

/** About `count` evenly spaced round values (steps of 1, 2 or 5 × 10ⁿ) inside [lo, hi]. */
export function roundTicks(lo: number, hi: number, count = 6): number[] {
  if (!(hi > lo)) return [lo];
  const raw = (hi - lo) / count;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = ([1, 2, 5, 10].find((m) => m * power >= raw) ?? 10) * power;
  const out: number[] = [];
  for (let t = Math.ceil(lo / step) * step; t <= hi + step * 1e-9; t += step)
    out.push(Number(t.toPrecision(12)));
  return out;
}
