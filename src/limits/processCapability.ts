/**
 * One-sided process capability index from the sample mean and standard deviation.
 *
 * Formula (Eq. C1): lower limit L: Cpk = (mean − L) / (3σ); upper limit U: Cpk = (U − mean) / (3σ)
 * (Montgomery, Introduction to Statistical Quality Control, one-sided Cpk — from memory; common
 * practice). Units: mean, σ and limit in the same unit (dB or fraction); Cpk is dimensionless.
 * Boundary rule: null when σ is null (fewer than two units) or 0 (the index is unbounded and JSON
 * cannot carry ±Infinity).
 *
 * Cost O(1).
 * @example processCapability(12, 0.5, 11.5, 'lower') // 0.333…
 */
export function processCapability(mean: number, sigma: number | null, limit: number,
  bound: 'lower' | 'upper'): number | null {
  if (sigma === null || !(sigma > 0)) return null;
  return bound === 'lower' ? (mean - limit) / (3 * sigma) : (limit - mean) / (3 * sigma); // Eq. C1
}
