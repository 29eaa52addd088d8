import { sphereNormSr } from '../coverage/sphereNormSr.js';
import type { BeamRemoval, Quantity, SphereGrid } from '../types.js';
import { createPatchedPercentile } from './patchedPercentile.js';
import { createPercentileSelector } from './percentileSelector.js';
import { betterByDb, isLowerBetter } from '../quantity.js';
import { bestAndRunnerUp } from './bestAndRunnerUp.js';
import { NeumaierAccumulator } from '../sphere/neumaierSum.js';

/**
 * What each beam is worth: how much the chosen percentile of the total scan pattern and the
 * coverage efficiency at a threshold get worse when that one beam is removed from the codebook.
 *
 * percentileLossDb = P(all) − P(all without b) (Eq. 1) for eirp/gain, P(without b) − P(all) for eis
 * (positive = worse without the beam; 0 for a beam that is never strictly needed, such as an
 * exact duplicate); null when either value is not evaluable or b is the only beam.
 * coverageLoss = E(all) − E(all without b) (Eq. 2), E(t) = Σ wᵢ [TSPᵢ at or better than t] / S, a
 * fraction of the sphere in [0, 1] (S = sphereNormSr(Σw): 4π, or Σw on a full sphere, as the
 * core's coverage efficiency); null when threshold is null.
 *
 * Work reuse: the best and second-best beam per point are found once (`bestAndRunnerUp`; a caller
 * that has them for the same beams passes `ranked`); removing b changes the
 * total scan pattern only where b is best, where the second-best value takes over. Ties go to the
 * earlier beam, so of two identical beams the second is the runner-up everywhere the first is
 * best and removing either costs exactly 0. Percentiles use the step rule of
 * `createPercentileSelector` (the core's rule), evaluated by `createPatchedPercentile` on the
 * full total scan pattern patched with the runner-up where b is best (bit-identical to patching
 * a copy and selecting); coverage losses are Neumaier sums over the changed points only.
 * Cost: O(n·B) for best/second-best, then O(points where b is best + bins) per beam (O(n) when
 * the patched evaluator falls back to the plain quickselect).
 * @throws Error when there are no beams or lengths differ from the grid.
 * @example beamRemoval(grid, beams, 'eirp', 50, 10)[3].percentileLossDb // dB lost without beam 3
 */
export function beamRemoval(
  grid: SphereGrid,
  beams: Float64Array[],
  quantity: Quantity,
  levelPct: number,
  threshold: number | null,
  ranked?: ReturnType<typeof bestAndRunnerUp>,
): BeamRemoval[] {
  const n = grid.weightSr.length;
  if (beams.length === 0) throw new Error('beamRemoval: no beams');
  for (const b of beams) if (b.length !== n) throw new Error(`beamRemoval: beam of ${b.length} values on a grid of ${n}`);
  const lowerIsBetter = isLowerBetter(quantity);
  const { tsp: { values: bestVal, bestBeam: bestIdx }, runnerUp: secondVal } = ranked ?? bestAndRunnerUp(beams, quantity);
  const select = createPercentileSelector(grid.weightSr, quantity, levelPct);
  const finite = (v: number | null): number | null => (v === null || !Number.isFinite(v) ? null : v);
  const full = finite(select(bestVal));
  const covered = (v: number): boolean => threshold !== null && (lowerIsBetter ? v <= threshold : v >= threshold);
  const sphereSr = sphereNormSr(grid.solidAngleSr);
  // Points grouped by best beam, ascending within a group (counting sort), as the changed sets.
  const groupStart = new Int32Array(beams.length + 1), byBeam = new Int32Array(n);
  for (let i = 0; i < n; i++) groupStart[bestIdx[i] + 1]++;
  for (let b = 0; b < beams.length; b++) groupStart[b + 1] += groupStart[b];
  const fill = groupStart.slice(0, beams.length);
  for (let i = 0; i < n; i++) byBeam[fill[bestIdx[i]]++] = i;
  let lo = Infinity, hi = -Infinity, nan = false;
  for (const arr of [bestVal, secondVal]) for (let i = 0; i < n; i++) if (arr[i] !== arr[i]) nan = true;
  for (let i = 0; i < n; i++) { const v = bestVal[i]; if (v > -Infinity && v < Infinity) { if (v < lo) lo = v; if (v > hi) hi = v; } }
  // Every answer lies between the percentile of the runner-up pattern and the full one: bins there.
  const floor = beams.length > 1 ? finite(select(secondVal)) : null;
  if (floor !== null && full !== null) { lo = Math.min(floor, full); hi = Math.max(floor, full); }
  const pad = 0.1 * (hi - lo) + 1e-9 * Math.max(1, Math.abs(lo), Math.abs(hi));
  const patched = createPatchedPercentile(grid.weightSr, quantity, levelPct, !nan);
  patched.setBase(bestVal, lo - pad, hi + pad);
  return beams.map((_, b) => {
    const changed = byBeam.subarray(groupStart[b], groupStart[b + 1]);
    const lost = new NeumaierAccumulator(); // Eq. 2: the lost solid angle
    for (let j = 0; j < changed.length; j++) {
      const i = changed[j];
      if (covered(bestVal[i]) && !covered(secondVal[i])) lost.add(grid.weightSr[i]);
    }
    const rest = beams.length > 1 ? (changed.length === 0 ? full : finite(patched.evaluate(changed, changed.length, secondVal) ?? null)) : null;
    const percentileLossDb = full === null || rest === null ? null : betterByDb(quantity, full, rest); // Eq. 1
    return { percentileLossDb, coverageLoss: threshold === null ? null : lost.total() / sphereSr };
  });
}
