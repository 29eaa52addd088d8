import type { Quantity, SphereGrid, UnmeasuredRegion, Warning } from '../types.js';
import { warning } from '../warnings.js';
import { isFullSphere } from './isFullSphere.js';
import { hasTrp } from '../quantity.js';

const FOUR_PI = 4 * Math.PI;

/** One region in words: solid angle, share of 4π, centre and extent. */
export function regionText(r: UnmeasuredRegion): string {
  const phi = r.phiRangeDeg[0] === 0 && r.phiRangeDeg[1] === 360 ? 'all φ' : `φ ${fmt(r.phiRangeDeg[0])}°→${fmt(r.phiRangeDeg[1])}°`;
  return `${r.solidAngleSr.toFixed(4)} sr (${(100 * r.solidAngleSr / FOUR_PI).toFixed(2)} % of 4π) centred at θ ${fmt(r.centre.thetaDeg)}°, φ ${fmt(r.centre.phiDeg)}°, `
    + `reaching ${fmt(r.radiusDeg)}° from it (θ ${fmt(r.thetaRangeDeg[0])}–${fmt(r.thetaRangeDeg[1])}°, ${phi})`;
}

const fmt = (v: number): string => String(Math.round(v * 10) / 10);

/**
 * The grid warnings every result carries (results.json, inspect, the PDF's data quality):
 * 'partial-sphere' with each unmeasured region (solid angle, share of 4π, centre, extent);
 * 'trp-partial-sphere' when TRP is therefore not reported (eirp and gain; EIS has no TRP);
 * 'missing-points' listing the lattice directions absorbed by their neighbours and the solid
 * angle they took over. Nothing for a full, complete grid.
 * Cost O(regions + missing).
 * @throws never.
 * @example gridWarnings(buildSphereGrid(θ ≤ 150°).grid, 'eirp').map((w) => w.code) // ['partial-sphere', 'trp-partial-sphere']
 */
export function gridWarnings(grid: SphereGrid, quantity: Quantity, where?: { file?: string; line?: number }): Warning[] {
  const out: Warning[] = [];
  const regions = grid.unmeasured ?? [];
  if (!isFullSphere(grid)) {
    const lost = FOUR_PI - grid.solidAngleSr;
    const list = regions.length ? `: ${regions.map((r, k) => `region ${k + 1}: ${regionText(r)}`).join('; ')}` : '';
    out.push(warning('partial-sphere', `the scan leaves ${lost.toFixed(4)} sr (${(100 * lost / FOUR_PI).toFixed(2)} % of 4π) unmeasured in ${regions.length || 1} region${regions.length === 1 ? '' : 's'}${list}; unmeasured directions count as not covered`, where));
    if (hasTrp(quantity)) out.push(warning('trp-partial-sphere', `TRP is not reported: ${(100 * lost / FOUR_PI).toFixed(2)} % of 4π is unmeasured`, where));
  }
  const missing = grid.missing ?? [];
  if (missing.length) {
    const absorbed = missing.reduce((s, m) => s + m.absorbedSr, 0);
    const shown = missing.slice(0, 20).map((m) => `(θ ${m.thetaDeg}°, φ ${m.phiDeg}°)`).join(', ');
    out.push(warning('missing-points', `${missing.length} grid direction${missing.length === 1 ? '' : 's'} without a sample, absorbed by the neighbouring cells (${absorbed.toExponential(3)} sr, ${(100 * absorbed / FOUR_PI).toFixed(4)} % of 4π): ${shown}${missing.length > 20 ? `, … (${missing.length - 20} more)` : ''}`, where));
  }
  return out;
}
