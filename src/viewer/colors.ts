/**
 * Colours of the page's maps and sphere: the report's own colour maps (src/report/colorMap.ts),
 * scales as in src/report/unitMaps.ts (nice range over the finite values; best at the top of the
 * bar for every quantity; a symmetric diverging scale for differences).
 */
import type { Quantity } from '../types.js';
import { CATEGORICAL, colorMapLut, DIVERGING_LUT, lutIndex, type ColorMapName } from '../report/colorMap.js';
import { niceRange } from '../report/format.js';

export interface Scale { lo: number; hi: number; ticks: number[]; invert: boolean; diverging: boolean }

export function finiteRange(values: ArrayLike<number>): [number, number] {
  let lo = Infinity, hi = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (Number.isFinite(v)) { if (v < lo) lo = v; if (v > hi) hi = v; }
  }
  return Number.isFinite(lo) ? [lo, hi] : [0, 1];
}

/** The value scale of the PDF's TSP map (unitMaps.valueScale): a nice range, best at t = 1. */
export function valueScale(values: ArrayLike<number>, q: Quantity): Scale {
  const [lo, hi] = finiteRange(values);
  const r = niceRange(lo, hi, 6);
  return { lo: r.lo, hi: r.hi, ticks: r.ticks, invert: q === 'eis', diverging: false };
}

/** The PDF's difference scale: symmetric about 0, at least ±0.5 dB. */
export function diffScale(delta: ArrayLike<number>): Scale {
  const [lo, hi] = finiteRange(delta);
  const r = niceRange(0, Math.max(Math.abs(lo), Math.abs(hi), 0.5), 4);
  return { lo: -r.hi, hi: r.hi, ticks: [-r.hi, 0, r.hi], invert: false, diverging: true };
}

export function scaleT(s: Scale, v: number): number {
  const t = (v - s.lo) / (s.hi - s.lo);
  return s.invert ? 1 - t : t;
}

/** RGBA per grid point (alpha 0 for a non-finite value). */
export function pointColors(values: ArrayLike<number>, s: Scale, map: ColorMapName): Uint8ClampedArray {
  const lut = s.diverging ? DIVERGING_LUT : colorMapLut(map);
  const out = new Uint8ClampedArray(4 * values.length);
  for (let p = 0; p < values.length; p++) {
    const v = values[p];
    if (!Number.isFinite(v)) continue;
    const k = 3 * lutIndex(scaleT(s, v));
    out[4 * p] = lut[k]; out[4 * p + 1] = lut[k + 1]; out[4 * p + 2] = lut[k + 2]; out[4 * p + 3] = 255;
  }
  return out;
}

/** RGBA per grid point from its best beam (the PDF's categorical beam colours). */
export function beamColors(bestBeam: Int32Array): Uint8ClampedArray {
  const out = new Uint8ClampedArray(4 * bestBeam.length);
  for (let p = 0; p < bestBeam.length; p++) {
    const b = bestBeam[p];
    if (b < 0) continue;
    const c = CATEGORICAL[b % CATEGORICAL.length];
    out[4 * p] = c[0]; out[4 * p + 1] = c[1]; out[4 * p + 2] = c[2]; out[4 * p + 3] = 255;
  }
  return out;
}

/** CSS colour of t ∈ [0, 1] on a scale's colour map (for the colour bar). */
export function cssColorAt(s: Scale, map: ColorMapName, t: number): string {
  const lut = s.diverging ? DIVERGING_LUT : colorMapLut(map);
  const k = 3 * lutIndex(t);
  return `rgb(${lut[k]},${lut[k + 1]},${lut[k + 2]})`;
}

export function beamCss(b: number): string {
  const c = CATEGORICAL[b % CATEGORICAL.length];
  return `rgb(${c[0]},${c[1]},${c[2]})`;
}
