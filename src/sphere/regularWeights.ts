import type { RegularLayout } from '../types.js';
import { seamGap } from './regularLayout.js';

const RAD = Math.PI / 180;

/**
 * Exact solid angle of every cell of a regular grid, sr.
 *
 * A cell spans halfway to its neighbours: θ from the midpoint with the row above to the
 * midpoint with the row below, φ likewise; Ω = Δφ·(cos θ₁ − cos θ₂) (Eq. 1), evaluated as
 * Δφ·2·sin((θ₁+θ₂)/2)·sin((θ₂−θ₁)/2) to avoid cancellation in thin cells. A pole point is a
 * cap (or, without φ wrap, the measured sector of it): Ω = ΣΔφ·(cos θ₁ − cos θ₂).
 * Boundary rule for partial ranges: the first and last measured θ rows extend half their
 * neighbouring step beyond themselves (clamped to 0 and 180) — never to the pole; without φ
 * wrap the boundary columns extend half their neighbouring step into the unmeasured gap.
 * Source: spherical zone area 2π(1 − cos θ) (geometry); DESIGN.md "Regular grid weights".
 * Cost O(n).
 * @throws never (the layout comes from detectRegularLayout).
 * @example regularWeights(layout) // 1° full grid: Σ = 4π to ~1e-15
 */
export function regularWeights(layout: RegularLayout, pointCount: number): Float64Array {
  const { thetaRowsDeg: rowsDeg, phiColsDeg: cols, rowStart, rowLength } = layout;
  const rows = rowsDeg.length;
  const m = cols.length;
  const seam = layout.phiWraps ? -1 : seamGap(cols);
  const gap = (c: number): number => (c + 1 < m ? cols[c + 1] - cols[c] : 360 - cols[m - 1] + cols[0]);
  const widthRad = new Float64Array(m);
  let circleRad = 0;
  for (let c = 0; c < m; c++) {
    const prev = (c + m - 1) % m;
    let before = gap(prev);
    let after = gap(c);
    if (prev === seam) before = after;
    if (c === seam) after = before;
    widthRad[c] = ((before + after) / 2) * RAD;
    circleRad += widthRad[c];
  }
  const w = new Float64Array(pointCount);
  for (let r = 0; r < rows; r++) {
    const t = rowsDeg[r];
    const lo = r > 0 ? (rowsDeg[r - 1] + t) / 2 : t === 0 ? 0 : Math.max(0, t - (rowsDeg[1] - t) / 2);
    const hi = r + 1 < rows ? (t + rowsDeg[r + 1]) / 2 : t === 180 ? 180 : Math.min(180, t + (t - rowsDeg[r - 1]) / 2);
    const band = 2 * Math.sin(((lo + hi) / 2) * RAD) * Math.sin(((hi - lo) / 2) * RAD); // Eq. 1: cos lo − cos hi
    if (rowLength[r] === 1 && (t === 0 || t === 180)) {
      w[rowStart[r]] = circleRad * band; // pole cap
      continue;
    }
    for (let c = 0; c < m; c++) w[rowStart[r] + c] = widthRad[c] * band; // Eq. 1
  }
  return w;
}
