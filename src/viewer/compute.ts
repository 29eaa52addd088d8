/**
 * The page's recomputation when beams are switched off: the tool's own functions, called the way
 * src/batch/unitTask.ts calls them (computeMetrics → judge → findHoles), on the enabled beams.
 */
import type { CheckResult, CoverageHole, CoverageMetrics, Measurement, TotalScanPattern, UnitResult } from '../types.js';
import type { ViewerBuild } from './viewerData.js';
import { computeMetrics } from '../coverage/computeMetrics.js';
import { limitSetFor, percentileLimit } from '../limits/impliedChoices.js';
import { judge } from '../limits/judge.js';
import { findHoles } from '../analysis/findHoles.js';
import { gridSummary } from '../sphere/gridSummary.js';
import { d3GeoVoronoi } from '../sphere/geoDelaunay.js';
// @ts-ignore -- d3-geo-voronoi ships no type declarations (typed in sphere/geoDelaunay.ts).
import * as geoVoronoiPackage from 'd3-geo-voronoi';

// The page has no `require`: the hole search on a scattered grid gets the triangulation from
// the bundle (src/lazyPackage.ts).
d3GeoVoronoi.provide(geoVoronoiPackage as Parameters<typeof d3GeoVoronoi.provide>[0]);

export interface Computed {
  /** Indices (into the measurement's beams) of the enabled beams, ascending. */
  beamIndex: number[];
  /** bestBeam holds indices into the measurement's beams (not into beamIndex). */
  tsp: TotalScanPattern;
  metrics: CoverageMetrics;
  checks: CheckResult[];
  verdict: UnitResult['verdict'];
  worstCheck: UnitResult['worstCheck'];
  holes: CoverageHole[];
}

/** Metrics, checks and holes of the measurement with only the enabled beams (null when none is). */
export function recompute(m: Measurement, enabled: boolean[], build: ViewerBuild, holeThreshold: number | null): Computed | null {
  const beamIndex = m.beams.map((_, k) => k).filter((k) => enabled[k]);
  if (beamIndex.length === 0) return null;
  const beams = beamIndex.map((k) => m.beams[k]);
  const sub: Measurement = { ...m, beams };
  const { tsp, metrics } = computeMetrics(sub, {
    percentilesPct: build.percentilesPct,
    thresholds: build.thresholds,
    relativeDb: build.relativeDb,
    levelLimit: percentileLimit(limitSetFor(build.limitSet, m.quantity)),
  });
  const ls = build.limitSet;
  const judged = ls
    ? judge(metrics, ls, { quantity: m.quantity, fullSphere: gridSummary(sub).fullSphere })
    : { checks: [], verdict: 'none' as const, worstCheck: null };
  const hT = holeThreshold;
  const holes = hT === null ? [] : findHoles(m.grid, tsp, beams.map((b) => b.values), beams.map((b) => b.id), hT, m.quantity);
  const bestBeam = Int32Array.from(tsp.bestBeam, (b) => beamIndex[b]);
  return { beamIndex, tsp: { values: tsp.values, bestBeam }, metrics, checks: judged.checks, verdict: judged.verdict, worstCheck: judged.worstCheck, holes };
}

/**
 * Best and second-best enabled beam at one grid point, and the margin between them in dB
 * (positive: how much better the best beam is; eis: lower is better). Ties go to the earlier beam,
 * as in totalScanPattern.
 */
export function beamsAt(m: Measurement, enabled: boolean[], i: number): { best: number; second: number; marginDb: number | null } {
  const lower = m.quantity === 'eis';
  let best = -1, second = -1;
  for (let k = 0; k < m.beams.length; k++) {
    if (!enabled[k]) continue;
    const v = m.beams[k].values[i];
    if (best < 0 || (lower ? v < m.beams[best].values[i] : v > m.beams[best].values[i])) { second = best; best = k; }
    else if (second < 0 || (lower ? v < m.beams[second].values[i] : v > m.beams[second].values[i])) second = k;
  }
  if (best < 0 || second < 0) return { best, second, marginDb: null };
  const d = m.beams[best].values[i] - m.beams[second].values[i];
  return { best, second, marginDb: lower ? -d : d };
}
