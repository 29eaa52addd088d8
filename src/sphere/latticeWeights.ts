import type { MissingSample, RegularLayout, UnmeasuredRegion } from '../types.js';
import { unitVector } from './direction.js';
import { regionExtent, type RegionCap } from './regionExtent.js';
import { seamGap } from './regularLayout.js';
import { regularUnmeasured } from './regularUnmeasured.js';
import { regularWeights } from './regularWeights.js';


/**
 * Largest share of the lattice points that may be missing, in all and in any one θ row, for a
 * set to count as a lattice (our choice: a grid stitched from two steps misses half of the
 * coarse rows' columns, a window on a coarse grid most of each fine row's).
 */
export const MAX_MISSING_SHARE = 0.2;
export const MAX_ROW_MISSING_SHARE = 0.25;
/** A group of missing samples spanning at most this many rows and columns is absorbed; larger groups are unmeasured. */
export const ABSORB_SPAN = 2;

export interface LatticeWeights {
  weightSr: Float64Array;
  missing: MissingSample[];
  unmeasured: UnmeasuredRegion[];
}

/**
 * Weights of a regular grid with some samples missing: canonical points (θ, then φ; poles
 * merged) whose θ rows all draw their φ values from one set of columns, with at most
 * MAX_MISSING_SHARE of the row × column lattice points absent (and MAX_ROW_MISSING_SHARE of any
 * row's). Returns null for any other set.
 *
 * Every lattice point gets its exact regular cell (regularWeights, Ω = Δφ·(cos θ₁ − cos θ₂)).
 * Missing points are grouped by 8-connectivity (across the φ seam when it wraps). A group that
 * spans at most ABSORB_SPAN rows and ABSORB_SPAN columns (at most 2 × 2 samples) is absorbed:
 * each missing cell's solid angle is split equally among its measured 4-neighbours (same row
 * φ ± 1 column, same column θ ± 1 row, or the pole point) (Eq. 1), so Σw stays 4π (of the
 * lattice) and the missing directions are listed. A larger group is an unmeasured region with
 * the exact area of its cells. The lattice's own cut θ range or φ wedge stays unmeasured
 * (regularUnmeasured).
 * Cost O(rows × columns).
 * @throws never.
 * @example latticeWeights(θ, φ of a 2° grid without (90°, 100°))!.missing // [{ thetaDeg: 90, phiDeg: 100, absorbedSr: 1.2e-3 }]
 */
export function latticeWeights(thetaDeg: Float64Array, phiDeg: Float64Array): LatticeWeights | null {
  const n = thetaDeg.length;
  const rowStarts: number[] = [];
  for (let i = 0; i < n; i++) if (i === 0 || thetaDeg[i] !== thetaDeg[i - 1]) rowStarts.push(i);
  const nr = rowStarts.length;
  if (nr < 3) return null;
  const colSet = new Set<number>();
  let ordinary = 0;
  for (let r = 0; r < nr; r++) {
    const s = rowStarts[r], e = r + 1 < nr ? rowStarts[r + 1] : n;
    const t = thetaDeg[s];
    if (t === 0 || t === 180) continue;
    ordinary++;
    for (let i = s; i < e; i++) colSet.add(phiDeg[i]);
  }
  const cols = Float64Array.from(colSet).sort();
  const m = cols.length;
  if (m < 3 || ordinary < 2) return null;
  for (let r = 0; r < nr; r++) {
    const s = rowStarts[r], e = r + 1 < nr ? rowStarts[r + 1] : n;
    const t = thetaDeg[s];
    if (t !== 0 && t !== 180 && m - (e - s) > MAX_ROW_MISSING_SHARE * m) return null;
  }
  const rowLength = new Int32Array(nr);
  const rowStart = new Int32Array(nr);
  const thetaRowsDeg = new Float64Array(nr);
  let size = 0;
  for (let r = 0; r < nr; r++) {
    const t = thetaDeg[rowStarts[r]];
    thetaRowsDeg[r] = t;
    rowStart[r] = size;
    rowLength[r] = t === 0 || t === 180 ? 1 : m;
    size += rowLength[r];
  }
  const absent = size - n;
  if (absent <= 0 || absent > MAX_MISSING_SHARE * size) return null;
  const colIndex = new Map<number, number>();
  cols.forEach((c, k) => colIndex.set(c, k));
  const pointAt = new Int32Array(size).fill(-1);
  for (let r = 0; r < nr; r++) {
    const s = rowStarts[r], e = r + 1 < nr ? rowStarts[r + 1] : n;
    if (rowLength[r] === 1) { pointAt[rowStart[r]] = s; continue; }
    for (let i = s; i < e; i++) pointAt[rowStart[r] + colIndex.get(phiDeg[i])!] = i;
  }
  const layout: RegularLayout = { thetaRowsDeg, phiColsDeg: cols, rowStart, rowLength, phiWraps: seamGap(cols) < 0 };
  const cell = regularWeights(layout, size);
  const weightSr = new Float64Array(n);
  for (let L = 0; L < size; L++) if (pointAt[L] >= 0) weightSr[pointAt[L]] = cell[L];

  const wraps = layout.phiWraps;
  const at = (r: number, c: number): number => {
    if (r < 0 || r >= nr) return -2;
    if (rowLength[r] === 1) return rowStart[r];
    if (c < 0 || c >= m) { if (!wraps) return -2; c = (c + m) % m; }
    return rowStart[r] + c;
  };
  const seen = new Uint8Array(size);
  const missing: MissingSample[] = [];
  const unmeasured: UnmeasuredRegion[] = [];
  for (let L0 = 0; L0 < size; L0++) {
    if (pointAt[L0] >= 0 || seen[L0]) continue;
    const group: [number, number][] = [];
    const stack: [number, number][] = [[rowOf(L0), L0 - rowStart[rowOf(L0)]]];
    seen[L0] = 1;
    while (stack.length) {
      const [r, c] = stack.pop()!;
      group.push([r, c]);
      for (let dr = -1; dr <= 1; dr++) for (let dc = -1; dc <= 1; dc++) {
        const L = at(r + dr, c + dc);
        if (L < 0 || seen[L] || pointAt[L] >= 0) continue;
        seen[L] = 1;
        stack.push([r + dr, L - rowStart[r + dr]]);
      }
    }
    const rowSpan = new Set(group.map(([r]) => r)).size;
    const colSpan = new Set(group.map(([, c]) => c)).size;
    let absorbed = rowSpan <= ABSORB_SPAN && colSpan <= ABSORB_SPAN;
    const plan: { r: number; c: number; takers: number[] }[] = [];
    if (absorbed) {
      for (const [r, c] of group) {
        const takers = [at(r, c - 1), at(r, c + 1), at(r - 1, c), at(r + 1, c)].filter((L) => L >= 0 && pointAt[L] >= 0).map((L) => pointAt[L]);
        if (takers.length === 0) { absorbed = false; break; }
        plan.push({ r, c, takers: [...new Set(takers)] });
      }
    }
    if (absorbed) {
      for (const { r, c, takers } of plan) {
        const w = cell[rowStart[r] + c];
        for (const p of takers) weightSr[p] += w / takers.length; // Eq. 1
        missing.push({ thetaDeg: thetaRowsDeg[r], phiDeg: cols[c], absorbedSr: w });
      }
      continue;
    }
    const caps: RegionCap[] = [];
    let area = 0;
    for (const [r, c] of group) {
      const w = cell[rowStart[r] + c];
      area += w;
      const [x, y, z] = unitVector(thetaRowsDeg[r], cols[c]);
      caps.push({ x, y, z, radiusRad: Math.sqrt(w / Math.PI) });
    }
    unmeasured.push(regionExtent(caps, group.map(([, c]) => cols[c]), area));
  }
  unmeasured.push(...regularUnmeasured(layout));
  unmeasured.sort((a, b) => b.solidAngleSr - a.solidAngleSr);
  return { weightSr, missing, unmeasured };

  function rowOf(L: number): number {
    let lo = 0, hi = nr - 1;
    while (lo < hi) { const mid = (lo + hi + 1) >> 1; if (rowStart[mid] <= L) lo = mid; else hi = mid - 1; }
    return lo;
  }
}
