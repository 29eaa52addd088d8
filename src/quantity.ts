/**
 * The quantity owner: every rule that depends on what the pattern values are (eirp, eis, gain)
 * lives here, and every stage asks this module instead of writing `quantity === 'eis'`.
 *
 * - the list of quantities and their unit and label;
 * - the sense: eirp and gain are better when larger, eis (a sensitivity) when smaller;
 * - the worst value, which the unmeasured share of the sphere counts as (−∞ for eirp/gain,
 *   +∞ for eis: an unmeasured direction is never covered and never the best);
 * - one resolution order (resolveQuantity).
 *
 * Source: DESIGN.md "Concepts with one owner each", CONTRACT.md ("peak is the best value: the
 * maximum for eirp/gain, the minimum for eis"); 3GPP TS 38.101-2 defines EIS spherical coverage
 * on the minimum (most sensitive) EIS per direction. Cost O(1) each unless stated.
 */

/** Every quantity, in the order used for listings and option choices. */
export const QUANTITIES = ['eirp', 'eis', 'gain'] as const;

/** What the pattern values are. eirp/gain: larger is better; eis: smaller is better. */
export type Quantity = (typeof QUANTITIES)[number];

/** Unit of the stored values: dBm for eirp and eis, dBi for gain. */
export type ValueUnit = 'dBm' | 'dBi';

interface QuantityInfo {
  /** Label at the start of a heading or a table cell. */
  label: string;
  /** Label inside a sentence or a generated check name ("peak gain"). */
  labelInText: string;
  /** Stored unit of the values. */
  unit: ValueUnit;
  /** True when a smaller value is better (eis). */
  lowerIsBetter: boolean;
  /** TRP (a total radiated power) is meaningful: eirp and gain (a mean gain), not eis. */
  hasTrp: boolean;
}

const INFO: Record<Quantity, QuantityInfo> = {
  eirp: { label: 'EIRP', labelInText: 'EIRP', unit: 'dBm', lowerIsBetter: false, hasTrp: true },
  eis: { label: 'EIS', labelInText: 'EIS', unit: 'dBm', lowerIsBetter: true, hasTrp: false },
  gain: { label: 'Gain', labelInText: 'gain', unit: 'dBi', lowerIsBetter: false, hasTrp: true },
};

/** True for one of the quantity names. @example isQuantity('eis') // true */
export function isQuantity(x: unknown): x is Quantity {
  return typeof x === 'string' && (QUANTITIES as readonly string[]).includes(x);
}

/** Stored unit of a quantity's values. @example quantityUnit('gain') // 'dBi' */
export function quantityUnit(q: Quantity): ValueUnit {
  return INFO[q].unit;
}

/** Heading label ('EIRP', 'EIS', 'Gain'). */
export function quantityLabel(q: Quantity): string {
  return INFO[q].label;
}

/** In-sentence label ('EIRP', 'EIS', 'gain'). */
export function quantityLabelInText(q: Quantity): string {
  return INFO[q].labelInText;
}

/** True when a smaller value is better (eis). */
export function isLowerBetter(q: Quantity): boolean {
  return INFO[q].lowerIsBetter;
}

/** True when TRP is meaningful for the quantity (eirp, gain). */
export function hasTrp(q: Quantity): boolean {
  return INFO[q].hasTrp;
}

/** +1 when larger is better, −1 when smaller is better: `sign · v` is then "larger is better". */
export function betterSign(q: Quantity): 1 | -1 {
  return INFO[q].lowerIsBetter ? -1 : 1;
}

/** a strictly better than b. @example isBetter('eis', -90, -88) // true */
export function isBetter(q: Quantity, a: number, b: number): boolean {
  return INFO[q].lowerIsBetter ? a < b : a > b;
}

/** v at or better than the threshold t (coverage counts ties as covered). */
export function isAtOrBetter(q: Quantity, v: number, t: number): boolean {
  return INFO[q].lowerIsBetter ? v <= t : v >= t;
}

/** The better of two values. */
export function betterOf(q: Quantity, a: number, b: number): number {
  return isBetter(q, b, a) ? b : a;
}

/** The best of a list (max for eirp/gain, min for eis); the worst value for an empty list. Cost O(n). */
export function bestOf(q: Quantity, values: Iterable<number>): number {
  let best = worstValue(q);
  for (const v of values) if (isBetter(q, v, best)) best = v;
  return best;
}

/** The worst of a list (min for eirp/gain, max for eis); the best possible value for an empty list. Cost O(n). */
export function worstOf(q: Quantity, values: Iterable<number>): number {
  let worst = -worstValue(q);
  for (const v of values) if (isBetter(q, worst, v)) worst = v;
  return worst;
}

/**
 * The worst possible value, which the unmeasured share of the sphere counts as: −∞ for
 * eirp/gain (below every measured value), +∞ for eis.
 */
export function worstValue(q: Quantity): number {
  return INFO[q].lowerIsBetter ? Infinity : -Infinity;
}

/**
 * A value moved by d dB towards worse: v − d for eirp/gain, v + d for eis. Used for a
 * threshold relaxed by a test tolerance and for a threshold d dB from the best value.
 * @example worsenedBy('eis', -90, 1) // -89
 */
export function worsenedBy(q: Quantity, v: number, dB: number): number {
  return INFO[q].lowerIsBetter ? v + dB : v - dB;
}

/** How much better v is than the reference (positive = better): v − ref, or ref − v for eis. */
export function betterByDb(q: Quantity, v: number, ref: number): number {
  return INFO[q].lowerIsBetter ? ref - v : v - ref;
}

/** Comparator that sorts best first (descending for eirp/gain, ascending for eis). */
export function bestFirst(q: Quantity): (a: number, b: number) => number {
  return INFO[q].lowerIsBetter ? (a, b) => a - b : (a, b) => b - a;
}

/** Where a quantity was named, from strongest to weakest (see resolveQuantity). */
export interface QuantitySources {
  /** --quantity */
  option?: Quantity;
  /** the job file's `quantity` */
  job?: Quantity;
  /** the value column's name (eirp_dbm, eis, gain_dbi …) */
  columns?: Quantity;
  /** a `# quantity: …` metadata line */
  metadata?: Quantity;
}

/**
 * The one resolution order for the measured quantity: --quantity option > job file > value
 * columns > metadata line > eirp assumed (the caller warns). A limit set never decides the
 * measured quantity: it declares its own, and a mismatch is reported (the checks are not
 * evaluable). Checks written in a job file join the quantity of the limit set they are merged
 * into; with no limit set they take the same order (option > job file > eirp).
 * The columns-vs-metadata conflict is the reader's error, not resolved here.
 * @example resolveQuantity({ job: 'eis', columns: 'eirp' }) // { quantity: 'eis', from: 'job' }
 */
export function resolveQuantity(s: QuantitySources): { quantity: Quantity; from: keyof QuantitySources | 'assumed' } {
  for (const from of ['option', 'job', 'columns', 'metadata'] as const) {
    const q = s[from];
    if (q) return { quantity: q, from };
  }
  return { quantity: 'eirp', from: 'assumed' };
}

/** How "at or better than" reads for a quantity: ≥ / "at or above" (eirp, gain), ≤ / "at or below" (eis). */
export function atOrBetterText(q: Quantity): { symbol: '≥' | '≤'; words: 'at or above' | 'at or below' } {
  return INFO[q].lowerIsBetter ? { symbol: '≤', words: 'at or below' } : { symbol: '≥', words: 'at or above' };
}
