/**
 * Power gain of one element in a direction ψ off its boresight: a cos^q main lobe over the
 * front hemisphere on top of a constant back-lobe floor, normalized so that the pattern
 * integrates to 4π (a lossless element: gain = directivity).
 *
 * Formula: U(ψ) = (1 − f)·max(cos ψ, 0)^q + f, with f = 10^(floorDb/10);
 * ∮U dΩ = (1 − f)·2π/(q + 1) + 4π f (elementary: ∫₀^{π/2} cos^q θ sin θ dθ = 1/(q + 1)), so
 * G(ψ) = U(ψ) / ((1 − f)/(2(q + 1)) + f)                                    Eq. (E1)
 * Units: cosPsi dimensionless in [−1, 1]; gain linear (not dB).
 * Boundary rule: f = 1 (floorDb = 0) gives the isotropic element, G ≡ 1; q = 0, f = 0 gives
 * the ideal hemispherical element, G = 2 in front.
 * Cost: one pow per call.
 * @throws never; q < 0 or floorDb > 0 are programming errors caught by the model builders.
 * @example
 * elementGain(1, 1, -Infinity); // 4: cos ψ element, peak directivity 2(q+1) = 4 (6.0 dBi)
 */
export function elementGain(cosPsi: number, q: number, floorDb: number): number {
  const f = floorDb === -Infinity ? 0 : 10 ** (floorDb / 10);
  const front = cosPsi > 0 ? cosPsi ** q : 0;
  const u = (1 - f) * front + f;
  return u / ((1 - f) / (2 * (q + 1)) + f); // Eq. (E1)
}
