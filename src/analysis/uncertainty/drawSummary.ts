/**
 * What the Monte-Carlo draws of one value say about it, with the basic bootstrap correction
 * (Davison & Hinkley, Bootstrap Methods and their Application, 1997, §5.2.1 — from memory).
 * The perturbed re-readings v*_k of a value v measured once scatter around v and, where the value
 * is a maximum over noisy beams, sit above it by about the same bias that the measurement itself
 * carries; so the bias is estimated as b = mean(v*) − v (Eq. S1) and the true value's
 * distribution as 2v − v*_k (Eq. S2), whose 2.5 % and 97.5 % points give the 95 % band.
 * `common` (optional): each draw's common shift; subtracting its mean from the bias removes the
 * scatter of the common draw (which shifts a dB reading one-for-one and has no bias of its own).
 * Units: those of v. Boundary rule: NaN draws (a level not evaluable) are skipped; with none
 * left every field is null. Quantiles: the step rule on the sorted draws (smallest x with at
 * least q·N draws at or below it).
 * Cost O(N log N).
 * @example drawSummary(10, Float64Array.from([10.5, 10.7])) // bias 0.6, stdDev 0.141…, band [9.3, 9.5]
 */
export function drawSummary(value: number, draws: Float64Array, common?: Float64Array): { bias: number | null; stdDev: number | null; low95: number | null; high95: number | null } {
  const xs: number[] = [];
  let shift = 0;
  draws.forEach((x, k) => { if (!Number.isNaN(x)) { xs.push(x); if (common) shift += common[k]; } });
  const n = xs.length;
  if (n === 0 || !Number.isFinite(value)) return { bias: null, stdDev: null, low95: null, high95: null };
  let mean = 0;
  for (const x of xs) mean += x;
  mean /= n;
  let ss = 0;
  for (const x of xs) ss += (x - mean) * (x - mean);
  const corrected = xs.map((x) => 2 * value - x).sort((a, b) => a - b); // Eq. (S2)
  const q = (p: number): number => corrected[Math.min(n - 1, Math.max(0, Math.ceil(p * n) - 1))];
  return { bias: mean - shift / n - value, stdDev: n > 1 ? Math.sqrt(ss / (n - 1)) : 0, low95: q(0.025), high95: q(0.975) }; // Eq. (S1)
}
