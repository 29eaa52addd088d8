/**
 * The optional analysis of one measurement (what --core-only skips): what each beam is worth
 * (beam removal), where the total scan pattern misses the threshold (coverage holes) and the
 * smallest beam subset that keeps the analysis level. One function, so the main thread and the
 * insight lane's worker (insightLane.ts) compute it alike; plain data in and out.
 * This module's imports are the worker's whole module graph: keep it to src/analysis, the core
 * pattern and the sphere's neighbour graph.
 */
import type { BeamRemoval, BeamSubset, CoverageHole, Quantity, SphereGrid, TotalScanPattern } from '../types.js';
import { beamRemoval } from '../analysis/beamRemoval.js';
import { findHoles } from '../analysis/findHoles.js';
import { greedySubset } from '../analysis/greedySubset.js';
import { totalScanPattern } from '../coverage/totalScanPattern.js';
import { bestAndRunnerUp } from '../analysis/bestAndRunnerUp.js';

/** What the optional analysis reads: the grid, the beams in codebook order, the level and threshold the limit set implies. */
export interface InsightRequest {
  grid: SphereGrid;
  beams: Float64Array[];
  ids: string[];
  quantity: Quantity;
  /** Percentile level of removal and subset (limits/impliedChoices.ts). */
  levelPct: number;
  /** Coverage threshold of removal and holes; null: no holes, no coverage loss. */
  threshold: number | null;
}

export interface Insights {
  /** Per beam, in codebook order. */
  removal: BeamRemoval[];
  holes: CoverageHole[];
  subset: BeamSubset;
}

/**
 * The optional analysis, in the order the batch always ran it. `tsp` is the measurement's total
 * scan pattern when the caller has it (computeMetrics'); otherwise it is computed here by the
 * same function, so the answer is the same either way.
 * Cost: O(B·n) for removal and subset plus the subset's steps; holes O(n) without any hole.
 */
export function computeInsights(q: InsightRequest, tsp?: TotalScanPattern): Insights {
  const { grid, beams, ids, quantity, levelPct, threshold } = q;
  // Without the caller's TSP: one pass gives it (bit for bit totalScanPattern's) and the runner-up that removal needs.
  const ranked = tsp === undefined && beams.length > 0 ? bestAndRunnerUp(beams, quantity) : undefined;
  const removal = beams.length > 1
    ? beamRemoval(grid, beams, quantity, levelPct, threshold, ranked)
    : beams.map(() => ({ percentileLossDb: null, coverageLoss: null }));
  const pattern = tsp ?? ranked?.tsp ?? totalScanPattern(beams, quantity);
  return {
    removal,
    holes: threshold === null ? [] : findHoles(grid, pattern, beams, ids, threshold, quantity),
    subset: greedySubset(grid, beams, ids, quantity, levelPct, undefined, pattern),
  };
}
