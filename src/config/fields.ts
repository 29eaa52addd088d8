import { zod } from './zod.js';
import { LEVEL_RANGE, type SaneRange } from '../io/saneRange.js';

/**
 * Field builders of the configuration schemas (called while a schema is built, so zod is loaded
 * then: src/config/zod.ts). Each one carries the "expected …" words of its
 * error message (in the test engineer's words), so every schema speaks the same grammar, and a
 * description that the published JSON Schemas show in editors.
 */

/** A non-empty text. */
export const text = (what = 'a non-empty text') =>
  zod().string({ error: what }).min(1, { error: what }).refine((s) => s.trim() !== '', { error: what });

/** A finite number inside [lo, hi] (bounds included). */
export const num = (what: string, lo = -Infinity, hi = Infinity) => {
  let s = zod().number({ error: what });
  if (Number.isFinite(lo)) s = s.min(lo, { error: what });
  if (Number.isFinite(hi)) s = s.max(hi, { error: what });
  return s;
};

/** A whole number inside [lo, hi]. */
export const whole = (what: string, lo = -Infinity, hi = Infinity) => num(what, lo, hi).int({ error: what });

/** A level, limit or threshold in dBm/dBi: finite and inside the sane level range (io/saneRange.ts). */
export const level = (range: SaneRange = LEVEL_RANGE) => num(range.expected, range.lo, range.hi);

/** One of a few words. */
export const oneOf = <const T extends readonly [string, ...string[]]>(values: T, what = `one of ${values.join(', ')}`) =>
  zod().enum(values, { error: what });

/** A fraction of the sphere, 0..1. */
export const FRACTION = 'a fraction of the sphere between 0 and 1 (0.5 = 50 %)';
export const fraction = () => num(FRACTION, 0, 1);

/** A CDF level in percent, 0..100. */
export const percent = (what = 'a CDF level in percent between 0 and 100') => num(what, 0, 100);

/** A list of numbers, each inside [lo, hi]. */
export const numbers = (what: string, lo: number, hi: number) =>
  zod().array(num(what, lo, hi), { error: 'a list of numbers' });

/** A [low, high] frequency range in MHz, low < high. */
export const frequencyRangeMhz = () => {
  const what = 'a list [low, high] of two numbers in MHz, low < high';
  return zod().tuple([num(what), num(what)], { error: what }).refine(([lo, hi]) => lo < hi, { error: what });
};
