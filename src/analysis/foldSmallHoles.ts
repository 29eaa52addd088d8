import type { CoverageHole } from '../types.js';

/**
 * Holes smaller than this share of 4π are folded into one count instead of being listed: 0.1 % of
 * 4π is about 12.6 msr (≈ 41 square degrees), under two cells of a 5° grid at the equator
 * (7.6 msr each), i.e. at the edge of what the grid can resolve as a region (our choice).
 */
export const SMALL_HOLE_SHARE = 0.001;

/** The holes worth a line of their own, and the count and share of 4π of the folded small ones. */
export interface FoldedHoles {
  listed: CoverageHole[];
  small: number;
  smallShare: number;
}

/**
 * Split coverage holes (findHoles, largest first) into those of at least `minShare` of 4π, kept
 * in order (the report labels them H1, H2 … on the map), and the rest, folded into a count and
 * their total share of 4π (summed in order; a few terms, no compensation needed).
 * Cost O(holes).
 * @example foldSmallHoles([{ solidAngleSr: 1, …}, { solidAngleSr: 0.001, …}]) // { listed: [first], small: 1, smallShare: 0.001 / 4π }
 */
export function foldSmallHoles(holes: CoverageHole[], minShare = SMALL_HOLE_SHARE): FoldedHoles {
  const fourPi = 4 * Math.PI;
  const listed = holes.filter((h) => h.solidAngleSr / fourPi >= minShare);
  const rest = holes.filter((h) => h.solidAngleSr / fourPi < minShare);
  return { listed, small: rest.length, smallShare: rest.reduce((a, h) => a + h.solidAngleSr, 0) / fourPi };
}
