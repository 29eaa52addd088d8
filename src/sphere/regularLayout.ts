import type { RegularLayout } from '../types.js';

/**
 * Detects a regular grid among canonical points (sorted by θ, then φ; poles already merged to
 * one point at φ = 0): every distinct θ row that is not a pole must hold exactly the same φ
 * columns (non-uniform steps allowed), with at least two rows (a pole counts) and two columns.
 * Pole rows (θ = 0 or 180) hold one point. Returns null when any combination is missing.
 *
 * φ seam rule: with the circular gaps between consecutive columns, the columns wrap (a full
 * φ circle) unless the largest gap exceeds 1.5× every other gap; that gap is then the
 * unmeasured φ span (`phiWraps` false). Cost O(n).
 * @throws never.
 * @example detectRegularLayout(thetaDeg, phiDeg) // 5° full grid: 35 rows of 72 + 2 poles
 */
export function detectRegularLayout(thetaDeg: Float64Array, phiDeg: Float64Array): RegularLayout | null {
  const n = thetaDeg.length;
  const rowStarts: number[] = [];
  for (let i = 0; i < n; i++) if (i === 0 || thetaDeg[i] !== thetaDeg[i - 1]) rowStarts.push(i);
  const rows = rowStarts.length;
  if (rows < 2) return null;
  const rowStart = Int32Array.from(rowStarts);
  const rowLength = new Int32Array(rows);
  for (let r = 0; r < rows; r++) rowLength[r] = (r + 1 < rows ? rowStart[r + 1] : n) - rowStart[r];
  let cols: Float64Array | null = null;
  for (let r = 0; r < rows; r++) {
    const t = thetaDeg[rowStart[r]];
    if (t === 0 || t === 180) continue; // pole rows are merged to one point
    const row = phiDeg.subarray(rowStart[r], rowStart[r] + rowLength[r]);
    if (cols === null) { cols = row; continue; }
    if (row.length !== cols.length) return null;
    for (let c = 0; c < row.length; c++) if (row[c] !== cols[c]) return null;
  }
  if (cols === null || cols.length < 2) return null;
  const thetaRowsDeg = new Float64Array(rows);
  for (let r = 0; r < rows; r++) thetaRowsDeg[r] = thetaDeg[rowStart[r]];
  return { thetaRowsDeg, phiColsDeg: Float64Array.from(cols), rowStart, rowLength, phiWraps: seamGap(cols) < 0 };
}

/**
 * Index c of the unmeasured φ gap (between column c and c + 1, circularly), or −1 when the
 * columns wrap (see the seam rule above).
 */
export function seamGap(colsDeg: ArrayLike<number>): number {
  const m = colsDeg.length;
  let big = -1;
  let bigGap = -Infinity;
  let second = -Infinity;
  for (let c = 0; c < m; c++) {
    const g = c + 1 < m ? colsDeg[c + 1] - colsDeg[c] : 360 - colsDeg[m - 1] + colsDeg[0];
    if (g > bigGap) { second = bigGap; bigGap = g; big = c; } else if (g > second) second = g;
  }
  return bigGap > 1.5 * second * (1 + 1e-9) ? big : -1;
}
