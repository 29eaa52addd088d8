/**
 * Colours of the page's maps and sphere: the report's own colour maps (src/report/colorMap.ts),
 * scales from src/report/valueScale.ts (nice range over the finite values; best at the top of the
 * bar for every quantity; a symmetric diverging scale for differences).
 */
import type { Quantity } from '../types.js';
import { CATEGORICAL, colorMapLut, DIVERGING_LUT, lutIndex, type ColorMapName } from '../report/colorMap.js';
import { deltaScaleMaxDb, finiteRange, scaleT, valueScale, type ValueScale } from '../report/valueScale.js';

/** A map scale of the page: the PDF's value scale (src/report/valueScale.ts), or its symmetric difference scale. */
export interface Scale extends ValueScale { diverging: boolean }

/** The value scale of the PDF's TSP map over the finite values, best at t = 1. */
export function valueScaleOf(values: ArrayLike<number>, q: Quantity): Scale {
  const [lo, hi] = finiteRange(values);
  return { ...valueScale(lo, hi, q), diverging: false };
}

/** The PDF's difference scale: symmetric about 0, at least ±0.5 dB (deltaScaleMaxDb). */
export function diffScale(delta: ArrayLike<number>): Scale {
  const hi = deltaScaleMaxDb(delta);
  return { lo: -hi, hi, step: hi, ticks: [-hi, 0, hi], invert: false, diverging: true };
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
