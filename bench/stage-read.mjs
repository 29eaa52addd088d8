#!/usr/bin/env node
// Reading stage: readExportFile on one export, timed inside the process (the read call only).
//   node bench/stage-read.mjs FILE   → {"readS", "rows", "beams", "bytes", "errors", ["assembleS", "points"]}
import { statSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { stageMain, timed } from './lib/emit.mjs';
import { findExport, need } from './lib/resolve.mjs';

await stageMain(async () => {
  const file = resolve(process.argv[2]);
  const { readExportFile } = await need('readExportFile');
  const r = await timed(() => readExportFile(file, { inputRoot: dirname(file) }));
  const res = r.value;
  const rows = res.beams.reduce((s, b) => s + b.values.length, 0);
  const out = { readS: r.s, rows, beams: res.beams.length, bytes: statSync(file).size, errors: res.errors.length, firstError: res.errors[0]?.message };
  const asm = await findExport('assembleMeasurements');
  if (asm.fn) {
    const a = await timed(() => asm.fn(res.beams, [{ path: res.file, sha256: res.sha256 }]));
    out.assembleS = a.s;
    out.points = a.value.measurements[0]?.grid.thetaDeg.length ?? null;
  }
  return out;
});
