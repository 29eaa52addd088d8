/**
 * Compensated sum of an array (Neumaier's improvement of Kahan summation): the rounding error
 * of each addition is carried in a correction term, so the result is accurate to about one
 * rounding of the true sum regardless of the order or magnitude spread of the terms (Eq. 1:
 * t = s + x; c += |s| ≥ |x| ? (s − t) + x : (x − t) + s; result s + c).
 * Source: A. Neumaier, Z. Angew. Math. Mech. 54 (1974) 39–51.
 * Used for solid angles (weights) and TRP. Cost O(n), no allocation.
 * @throws never; NaN in, NaN out.
 * @example neumaierSum([1, 1e100, 1, -1e100]) // 2 (a plain loop gives 0)
 */
export function neumaierSum(values: ArrayLike<number>): number {
  let sum = 0;
  let comp = 0;
  for (let i = 0; i < values.length; i++) {
    const x = values[i];
    const t = sum + x;
    comp += Math.abs(sum) >= Math.abs(x) ? sum - t + x : x - t + sum; // Eq. 1
    sum = t;
  }
  return sum + comp;
}
