// Speed of the beam-value analysis at the issue-9 size: 64 beams on a full 2° grid (16,022
// points), simulated with src/sim's handset model (16 + 48 extra beams). Run with
// `npx vitest bench test/analysis/removalGreedy.bench.ts --run`; a report, not a timed test.
import { bench, describe } from 'vitest';
import { beamRemoval } from '../../src/analysis/beamRemoval.js';
import { findHoles } from '../../src/analysis/findHoles.js';
import { greedySubset } from '../../src/analysis/greedySubset.js';
import { handsetModule } from '../../src/sim/handsetModule.js';
import { simulateBeams } from '../../src/sim/simulateBeams.js';
import { gridNeighbors } from '../../src/sphere/neighbors.js';
import { fullGrid } from './fixtures.js';
import { bestOf } from './reference.js';
import { percentile } from '../../src/coverage/percentile.js';
import { weightedCdf } from '../../src/coverage/weightedCdf.js';

const grid = fullGrid(2);
const { model, codebook } = handsetModule({ conductedPowerDbm: 13, extraBeams: 48 });
const beams = simulateBeams(model, codebook, grid, 28e9).map((b) => b.eirpDbm);
const ids = codebook.map((b) => b.id);
const tspValues = bestOf(beams);
const tsp = { values: tspValues, bestBeam: new Int32Array(tspValues.length) };

describe(`${beams.length} beams × ${grid.thetaDeg.length} points`, () => {
  bench('beamRemoval (50 %, 10 dBm)', () => { beamRemoval(grid, beams, 'eirp', 50, 10); }, { iterations: 5 });
  bench('greedySubset (50 %, 0.5 dB)', () => { greedySubset(grid, beams, ids, 'eirp', 50, 0.5); }, { iterations: 3 });
  bench('greedySubset (50 %, 0 dB: all steps until equal)', () => { greedySubset(grid, beams, ids, 'eirp', 50, 0); }, { iterations: 3 });
  // For scale: one greedy step evaluated by the core's sort-based CDF for every candidate
  // (what the quickselect replaces).
  bench('one greedy step by core weightedCdf + percentile (64 candidates)', () => {
    for (const b of beams) percentile(weightedCdf(b, grid.weightSr), 50, 'eirp');
  }, { iterations: 3 });
  bench('gridNeighbors + findHoles (10 dBm)', () => { findHoles(grid, tsp, beams, ids, 10, 'eirp', gridNeighbors(grid)); }, { iterations: 5 });
});

const picked = greedySubset(grid, beams, ids, 'eirp', 50, 0.5);
process.stderr.write(`[analysis bench] greedy 0.5 dB subset: ${picked.beams.length} of ${beams.length} beams\n`);
