/**
 * Compensated summation (Neumaier's improvement of Kahan summation): the rounding error of each
 * addition is carried in a correction term, so the result is accurate to about one rounding of
 * the true sum regardless of the order or magnitude spread of the terms (Eq. 1:
 * t = s + x; c += |s| ≥ |x| ? (s − t) + x : (x − t) + s; result s + c).
 * Source: A. Neumaier, Z. Angew. Math. Mech. 54 (1974) 39–51.
 * Used for solid angles (weights), TRP and CDF steps. This file owns Eq. 1 (the one exception:
 * TRP's loop in src/coverage/trp.ts writes it out, measured faster, and its test holds it to
 * neumaierSum bit for bit): `neumaierSum` for an array, `NeumaierAccumulator` for a loop that adds as it goes,
 * `neumaierAddAt` for many running sums kept in two parallel arrays (one per bin), and
 * `neumaierError` (the correction term alone) for a loop that keeps s and c in local variables.
 * Cost O(1) an addition, no allocation.
 * @throws never; NaN in, NaN out.
 */

/**
 * The rounding error of t = s + x, the term Eq. 1 adds to the correction, for a loop that keeps
 * s and c in local variables.
 * @example let s = 0, c = 0; for (const x of xs) { const t = s + x; c += neumaierError(s, x, t); s = t; } // s + c
 */
export function neumaierError(s: number, x: number, t: number): number {
  return Math.abs(s) >= Math.abs(x) ? s - t + x : x - t + s; // Eq. 1
}

/**
 * A running compensated sum: `add` each term, read `total()` at any point (it does not end the
 * sum). Same additions in the same order as `neumaierSum`, so the same bits.
 * @example const acc = new NeumaierAccumulator(); for (const w of [1, 1e100, 1, -1e100]) acc.add(w); acc.total() // 2
 */
export class NeumaierAccumulator {
  private sum = 0;
  private comp = 0;

  add(x: number): void {
    const t = this.sum + x;
    this.comp += neumaierError(this.sum, x, t); // Eq. 1
    this.sum = t;
  }

  /** s + c: the compensated sum of every term added so far. */
  total(): number {
    return this.sum + this.comp;
  }
}

/**
 * Add x to running sum k of many kept side by side: `sums[k]` holds s, `comps[k]` c (Eq. 1);
 * the compensated value of sum k is `sums[k] + comps[k]`.
 * @example const s = new Float64Array(2), c = new Float64Array(2); neumaierAddAt(s, c, 1, 0.5) // s[1] = 0.5
 */
export function neumaierAddAt(sums: Float64Array, comps: Float64Array, k: number, x: number): void {
  const s = sums[k];
  const t = s + x;
  comps[k] += neumaierError(s, x, t); // Eq. 1
  sums[k] = t;
}

/**
 * Compensated sum of an array (Eq. 1). Cost O(n), no allocation.
 * @example neumaierSum([1, 1e100, 1, -1e100]) // 2 (a plain loop gives 0)
 */
export function neumaierSum(values: ArrayLike<number>): number {
  let sum = 0;
  let comp = 0;
  for (let i = 0; i < values.length; i++) {
    const x = values[i];
    const t = sum + x;
    comp += neumaierError(sum, x, t); // Eq. 1
    sum = t;
  }
  return sum + comp;
}
