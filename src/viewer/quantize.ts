/**
 * The viewer's storage rule for pattern values: round to a quantum of 0.01 dB.
 *
 * q = round(v / Δ), v' = q·Δ with Δ = 0.01 dB (Eq. Q1), so |v' − v| ≤ Δ/2 = 0.005 dB, far below
 * what a map colour, a plotted curve or any OTA measurement (uncertainty of the order of ±1 dB,
 * common practice) can show. Rounding is monotone (v₁ ≤ v₂ ⇒ v₁' ≤ v₂'), so the total scan
 * pattern of rounded beams is the rounded total scan pattern, and every step-rule percentile of
 * the rounded pattern is the rounded percentile (the same sample is selected): values recomputed
 * in the page differ from results.json by at most 0.005 dB, differences of two by at most 0.01 dB.
 * Cost O(1).
 * @example quantizeDb(12.3456) // 1235 (12.35 dB)
 */
export const QUANTUM_DB = 0.01;

export function quantizeDb(valueDb: number): number {
  return Math.round(valueDb * 100); // Eq. Q1 with Δ = 1/100 (multiplying by 100 is monotone too)
}

/** The stored value back in dB (q / 100 gives the double nearest to q·0.01). */
export function dequantizeDb(q: number): number {
  return q / 100; // Eq. Q1 with Δ = 1/100
}
