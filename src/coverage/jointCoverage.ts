/**
 * Joint coverage of two patterns on one grid: the share of the whole sphere where both reach
 * their own level, as the inter-band requirement of 3GPP TS 38.101-2 §6.2A.1 reads it (per band
 * the region where EIRP ≥ that band's spherical-coverage level − ΔT_IB,S,n; the requirement holds
 * when the share of 4π where both regions hold is at least (100 − percentile rank) %; reference
 * notes, "Rules attached to the transmit tables"; verify against the current release).
 *
 * Formula: share = Σ w_i [a_i ≥ La ∧ b_i ≥ Lb] / 4π                              Eq. (J1)
 * Boundary rule: a value equal to its level is inside; unmeasured solid angle is outside (it
 * counts as worst). Units: dBm in, a fraction of 4π out. Cost O(n).
 * @throws RangeError when the arrays differ in length.
 * @example jointCoverage(w, a, 10, b, 5).share // 0.3368 for θ bands 60°–100° (closed form (cos 60° − cos 100°)/2)
 */
export function jointCoverage(weightSr: Float64Array, a: Float64Array, levelA: number, b: Float64Array, levelB: number):
  { inA: Uint8Array; inB: Uint8Array; share: number; shareA: number; shareB: number } {
  const n = weightSr.length;
  if (a.length !== n || b.length !== n) throw new RangeError(`jointCoverage: ${n} weights, ${a.length} and ${b.length} values`);
  const inA = new Uint8Array(n);
  const inB = new Uint8Array(n);
  let both = 0, sa = 0, sb = 0;
  for (let i = 0; i < n; i++) {
    inA[i] = a[i] >= levelA ? 1 : 0;
    inB[i] = b[i] >= levelB ? 1 : 0;
    if (inA[i]) sa += weightSr[i];
    if (inB[i]) sb += weightSr[i];
    if (inA[i] && inB[i]) both += weightSr[i]; // Eq. (J1)
  }
  const FOUR_PI = 4 * Math.PI;
  return { inA, inB, share: both / FOUR_PI, shareA: sa / FOUR_PI, shareB: sb / FOUR_PI };
}
