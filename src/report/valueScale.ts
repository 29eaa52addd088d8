import type { Quantity } from '../types.js';
import { isLowerBetter } from '../quantity.js';
import { niceRange } from './format.js';

/**
 * The value → colour scales of the maps, one owner for the PDF (unitMaps.ts, the summary's
 * thumbnails) and viewer.html (src/viewer/colors.ts), so both draw a unit alike. Pure (no PNG or
 * PDF code), so the viewer bundle can import it.
 */
export interface ValueScale {
  lo: number;
  hi: number;
  step: number;
  ticks: number[];
  /** Lower is better (EIS): the scale runs downwards so the best value is at t = 1. */
  invert: boolean;
}

/** Smallest and largest finite value; [0, 1] when there is none. O(n). */
export function finiteRange(values: ArrayLike<number>): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (Number.isFinite(v)) {
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  }
  return Number.isFinite(lo) ? [lo, hi] : [0, 1];
}

/** A nice range over [lo, hi] with about 6 ticks, best at t = 1 (top of the bar) for every quantity. */
export function valueScale(lo: number, hi: number, q: Quantity): ValueScale {
  const r = niceRange(lo, hi, 6);
  return { lo: r.lo, hi: r.hi, step: r.step, ticks: r.ticks, invert: isLowerBetter(q) };
}

/** Position on the colour bar, 0 … 1, of a value (best at 1). */
export function scaleT(s: ValueScale, v: number): number {
  const t = (v - s.lo) / (s.hi - s.lo);
  return s.invert ? 1 - t : t;
}

/**
 * Half-width (dB) of the symmetric difference scale: a nice value at or above the largest
 * |difference|, at least 0.5 dB so a near-identical pair does not paint noise in full colour.
 */
export function deltaScaleMaxDb(delta: ArrayLike<number>): number {
  const [lo, hi] = finiteRange(delta);
  return niceRange(0, Math.max(Math.abs(lo), Math.abs(hi), 0.5), 4).hi;
}
