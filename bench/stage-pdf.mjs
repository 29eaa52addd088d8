#!/usr/bin/env node
// PDF stage: renderUnitPdf for one unit (16 beams on a 5° grid), timed in-process: one warm-up
// render (fonts, templates), then ITER timed renders, median.
//   node bench/stage-pdf.mjs UNIT_DIR RESULTS_JSON [ITER]
// The UnitResult is the one the CLI wrote (--no-pdf run on the same folder); the Measurement
// and TSP are rebuilt with the readers and computeMetrics.
import { readdirSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { stageMain, timed } from './lib/emit.mjs';
import { need } from './lib/resolve.mjs';
import { median } from './lib/stats.mjs';

await stageMain(async () => {
  const f = await need('readExportFile', 'assembleMeasurements', 'computeMetrics', 'renderUnitPdf', 'loadReportSettings');
  const dir = resolve(process.argv[2]);
  const results = JSON.parse(readFileSync(resolve(process.argv[3]), 'utf8'));
  const iter = Number(process.argv[4] ?? 3);
  const file = join(dir, readdirSync(dir).find((n) => n.endsWith('.csv')));
  const res = await f.readExportFile(file, { inputRoot: resolve(dir, '..') });
  const m = f.assembleMeasurements(res.beams, [{ path: res.file, sha256: res.sha256 }]).measurements[0];
  const result = results.units[0];
  const pct = result.tsp.percentiles.map((p) => p.levelPct);
  const thr = result.tsp.coverage.map((c) => c.threshold);
  const { tsp } = f.computeMetrics(m, { percentilesPct: pct, thresholds: thr, relativeDb: result.tsp.relativeCoverage?.map((r) => r.dbBelowPeak) ?? [] });
  const settings = await f.loadReportSettings();
  const input = { result, measurement: m, tsp, generatedAt: new Date(0).toISOString(), toolVersion: 'bench' };
  const first = await timed(() => f.renderUnitPdf(input, settings));
  const times = [];
  for (let i = 0; i < iter; i++) times.push((await timed(() => f.renderUnitPdf(input, settings))).s);
  return { firstS: first.s, pdfS: median(times), bytes: first.value.length, beams: m.beams.length, points: m.grid.thetaDeg.length, times };
});
