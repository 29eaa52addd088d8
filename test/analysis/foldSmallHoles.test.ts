import { describe, expect, it } from 'vitest';
import { foldSmallHoles, SMALL_HOLE_SHARE } from '../../src/analysis/foldSmallHoles.js';
import type { CoverageHole } from '../../src/types.js';
import { expectClose } from '../helpers/expectClose.js';

const hole = (solidAngleSr: number): CoverageHole => ({ solidAngleSr, thetaDeg: 90, phiDeg: 0, worst: -10, nearestBeam: '0' });
const FOUR_PI = 4 * Math.PI;

describe('foldSmallHoles', () => {
  it('lists holes of at least 0.1 % of 4π in order and folds the rest into a count and a share', () => {
    const atLimit = SMALL_HOLE_SHARE * FOUR_PI;
    const holes = [hole(1), hole(atLimit), hole(atLimit * 0.99), hole(0.002)];
    const f = foldSmallHoles(holes);
    expect(f.listed).toEqual([holes[0], holes[1]]); // exactly at the limit is listed
    expect(f.small).toBe(2);
    // Closed form: the folded share is (0.99·0.001·4π + 0.002) / 4π.
    expectClose(f.smallShare, 0.99 * SMALL_HOLE_SHARE + 0.002 / FOUR_PI, 1e-15, 'sum of two shares');
  });

  it('no holes: nothing listed, nothing folded', () => {
    expect(foldSmallHoles([])).toEqual({ listed: [], small: 0, smallShare: 0 });
  });
});
