#!/usr/bin/env node
// Where one unit's --no-pdf analysis spends its time, phase by phase, in-process: the calls the
// batch makes for a unit (src/batch/unitTask.ts), each timed once after the read.
//   node bench/stage-unit.mjs FILE  → {"readS", "assembleS", "metricsS", "removalS", "holesS", "subsetS", …}
// Phases whose module is not built are left out. The analysis level (50 %) and hole threshold
// (the first coverage threshold, 10 dBm) are what the batch picks without a limit set.
import { dirname, resolve } from 'node:path';
import { stageMain, timed } from './lib/emit.mjs';
import { findExport, need } from './lib/resolve.mjs';

await stageMain(async () => {
  const file = resolve(process.argv[2]);
  const f = await need('readExportFile', 'assembleMeasurements', 'computeMetrics');
  const out = {};
  const rd = await timed(() => f.readExportFile(file, { inputRoot: dirname(file) }));
  out.readS = rd.s;
  const as = await timed(async () => f.assembleMeasurements(rd.value.beams, [{ path: rd.value.file, sha256: rd.value.sha256 }]));
  out.assembleS = as.s;
  const m = as.value.measurements[0];
  const opts = { percentilesPct: [0, 10, 50, 90, 100], thresholds: [10, 20, 25], relativeDb: [] };
  const mt = await timed(async () => f.computeMetrics(m, opts));
  out.metricsS = mt.s;
  const values = m.beams.map((b) => b.values);
  const ids = m.beams.map((b) => b.id);
  const level = 50;
  const hT = 10;
  const removal = await findExport('beamRemoval');
  if (removal.fn) out.removalS = (await timed(async () => removal.fn(m.grid, values, m.quantity, level, hT))).s;
  const holes = await findExport('findHoles');
  if (holes.fn) out.holesS = (await timed(async () => holes.fn(m.grid, mt.value.tsp, values, ids, hT, m.quantity))).s;
  const subset = await findExport('greedySubset');
  if (subset.fn) {
    const r = await timed(async () => subset.fn(m.grid, values, ids, m.quantity, level));
    out.subsetS = r.s;
    out.subsetSteps = r.value.beams.length;
  }
  out.beams = m.beams.length;
  out.points = m.grid.thetaDeg.length;
  out.rssAfterMiB = process.memoryUsage().rss / 2 ** 20;
  return out;
});
