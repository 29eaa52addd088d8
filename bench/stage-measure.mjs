#!/usr/bin/env node
// Measuring stage: computeMetrics (TSP, CDF, percentiles, coverage, TRP, best shares) on one
// Measurement, timed in-process: one warm-up call, then ITER timed calls, median.
//   node bench/stage-measure.mjs FILE [ITER]
// The Measurement comes from the readers (readExportFile + assembleMeasurements) when they are
// built, else it is made from the same pattern model with the core's own grid functions.
import { dirname, resolve } from 'node:path';
import { stageMain, timed } from './lib/emit.mjs';
import { findExport, need } from './lib/resolve.mjs';
import { median } from './lib/stats.mjs';

const OPTS = { percentilesPct: [0, 10, 50, 90, 100], thresholds: [10, 20, 25], relativeDb: [3, 6] };

/** 64 beams on a 1° θ/φ grid from gen.py's lobe model (no noise), via the core's grid build. */
async function syntheticMeasurement(beams = 64, step = 1) {
  const { buildSphereGrid, mergeSamples, createMeasurement } = await need('buildSphereGrid', 'mergeSamples', 'createMeasurement');
  const nth = Math.round(180 / step) + 1, nph = Math.round(360 / step), n = nth * nph;
  const th = new Float64Array(n), ph = new Float64Array(n);
  for (let i = 0; i < nth; i++) for (let j = 0; j < nph; j++) (th[i * nph + j] = i * step), (ph[i * nph + j] = j * step);
  const build = buildSphereGrid(th, ph);
  const rad = Math.PI / 180;
  const list = [];
  for (let b = 0; b < beams; b++) {
    const bt = (10 + (140 * (b % 8)) / 7) * rad, bp = ((360 * Math.floor(b / 8)) / Math.max(1, beams / 8) + 7 * (b % 8)) * rad;
    const raw = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      const t = th[k] * rad, p = ph[k] * rad;
      const c = Math.min(1, Math.max(-1, Math.sin(t) * Math.cos(p) * Math.sin(bt) * Math.cos(bp) + Math.sin(t) * Math.sin(p) * Math.sin(bt) * Math.sin(bp) + Math.cos(t) * Math.cos(bt)));
      raw[k] = 30 + 10 * Math.log10(Math.exp(-0.5 * (Math.acos(c) / (14 * rad)) ** 2) + 10 ** -2.2 * (1 + c) / 2 + 10 ** -3.5);
    }
    list.push({ id: String(b), values: mergeSamples(build, raw).values });
  }
  return createMeasurement({ unit: 'bench', frequencyHz: null, quantity: 'eirp', valueUnit: 'dBm', grid: build.grid, beams: list, sources: [], warnings: [], metadata: {} });
}

async function measurementFromFile(file) {
  const io = await findExport('readExportFile');
  const asm = await findExport('assembleMeasurements');
  if (!io.fn || !asm.fn) return null;
  const res = await io.fn(file, { inputRoot: dirname(file) });
  return asm.fn(res.beams, [{ path: res.file, sha256: res.sha256 }]).measurements[0] ?? null;
}

await stageMain(async () => {
  const { computeMetrics } = await need('computeMetrics');
  const file = process.argv[2] ? resolve(process.argv[2]) : null;
  const iter = Number(process.argv[3] ?? 5);
  let m = file ? await measurementFromFile(file) : null;
  const source = m ? 'readers' : 'synthetic';
  if (!m) m = await syntheticMeasurement();
  computeMetrics(m, OPTS);
  const times = [];
  for (let i = 0; i < iter; i++) times.push((await timed(async () => computeMetrics(m, OPTS))).s);
  const points = m.grid.thetaDeg.length;
  const s = median(times);
  return { source, beams: m.beams.length, points, computeS: s, pointsPerS: (m.beams.length * points) / s, times };
});
