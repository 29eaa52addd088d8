import { neumaierSum } from '../sphere/neumaierSum.js';
import { sphereNormSr } from './sphereNormSr.js';

const LN10_OVER_10 = Math.LN10 / 10;

/**
 * Exponentials of dB values written with at most two decimals (v = k/100 exactly as parsed, the
 * usual chamber export): entry k + POWER_MEMO_OFFSET holds Math.exp(v·ln10/10) of that very v,
 * computed on first use (0 = not yet: an exponential of |v| ≤ 300 is never 0). A value is looked
 * up only when k/100 reproduces it bit for bit, so each term is the same double the exponential
 * gives — only fewer exponentials are taken (a 64-beam 1° unit has 4.12 M samples but a few
 * thousand distinct values; the exponential was over half of the metrics' time). Other values
 * take the exponential directly. Module scratch, valid forever (a pure function of k).
 */
const POWER_MEMO_OFFSET = 30000;
const powerMemo = new Float64Array(2 * POWER_MEMO_OFFSET + 1);

/**
 * Total radiated power of one beam: TRP = (1/4π) Σ w_i · 10^(EIRP_i/10), back to dBm (Eq. 1;
 * DESIGN.md "TRP"; TS 38.521-2 Annex M.4.3 for Voronoi weights on constant-density grids).
 * For gain patterns the same sum gives the sphere-average gain in dBi (radiation efficiency;
 * directivity = peak − this value). Only meaningful on a full sphere: returns null otherwise
 * (the caller warns 'trp-partial-sphere'). On a full sphere the divisor is Σw (≈ 4π within
 * 1e-6, sphereNormSr), so an isotropic pattern gives TRP = EIRP exactly on any grid.
 * `weightSumSr` is that Σw when the caller already has it (grid.solidAngleSr, the same
 * Neumaier sum in the same order, so the result is bit-identical); omitted, it is summed here.
 * Neumaier-compensated sums, no allocation. Not defined for EIS (the caller passes null).
 * Cost O(n): one exponential a point, or a table look-up for values with two decimals (powerMemo).
 * @throws RangeError when the lengths differ.
 * @example beamTrpDbm(new Float64Array(n).fill(10), grid.weightSr, true) // 10
 */
export function beamTrpDbm(
  values: ArrayLike<number>,
  weightSr: ArrayLike<number>,
  fullSphere: boolean,
  weightSumSr: number = neumaierSum(weightSr),
): number | null {
  const n = values.length;
  if (weightSr.length !== n) throw new RangeError(`beamTrpDbm: ${n} values but ${weightSr.length} weights`);
  if (!fullSphere) return null;
  // Neumaier's Eq. 1 of src/sphere/neumaierSum.ts written out in locals: this is the hottest sum
  // of the measure stage, and calling the owner's neumaierError here measured 1.2–2× slower
  // (same-process A/B, 64 beams × 64,442 points, issue 15). test/coverage/trp.test.ts holds it
  // bit-identical to neumaierSum of the same terms.
  let sum = 0;
  let comp = 0;
  for (let i = 0; i < n; i++) {
    // The memo look-up written out, not called: before the loop is optimized (one unit's first
    // beams), a call a sample costs more than the exponential it saves.
    // ⌊100·v + 0.5⌋, not Math.round: it never gives −0 (Math.round does for 100·v in [−0.5, 0)),
    // which makes the optimized loop bail out; a k off by one beside a half only misses the memo
    // (k/100 ≠ v), never changes a term.
    const v = values[i];
    const k = Math.floor(v * 100 + 0.5);
    const j = k + POWER_MEMO_OFFSET;
    let e: number;
    if (k / 100 === v && j >= 0 && j < powerMemo.length) {
      e = powerMemo[j];
      if (e === 0) {
        e = Math.exp(v * LN10_OVER_10);
        powerMemo[j] = e;
      }
    } else e = Math.exp(v * LN10_OVER_10);
    const x = weightSr[i] * e; // Eq. 1
    const t = sum + x;
    comp += Math.abs(sum) >= Math.abs(x) ? sum - t + x : x - t + sum;
    sum = t;
  }
  return 10 * Math.log10((sum + comp) / sphereNormSr(weightSumSr)); // Eq. 1
}
