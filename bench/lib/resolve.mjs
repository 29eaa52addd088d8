// Find the project's compiled functions in dist/ as they land. Each stage names the export it
// needs and the files it may live in; a missing file or export means "not available yet".
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

export const repoDir = join(dirname(fileURLToPath(import.meta.url)), '..', '..');

/** Where each function the benchmark calls is expected (first hit wins). */
export const EXPORTS = {
  readExportFile: ['dist/io/readExportFile.js', 'dist/io/index.js', 'dist/index.js'],
  assembleMeasurements: ['dist/io/assembleMeasurements.js', 'dist/io/index.js', 'dist/index.js'],
  computeMetrics: ['dist/coverage/computeMetrics.js', 'dist/coverage/index.js', 'dist/index.js'],
  buildSphereGrid: ['dist/sphere/buildGrid.js', 'dist/sphere/index.js', 'dist/index.js'],
  mergeSamples: ['dist/sphere/mergeSamples.js', 'dist/sphere/index.js', 'dist/index.js'],
  createMeasurement: ['dist/measurement.js', 'dist/index.js'],
  renderUnitPdf: ['dist/report/renderUnitPdf.js', 'dist/report/index.js', 'dist/index.js'],
  loadReportSettings: ['dist/report/loadReportSettings.js', 'dist/report/settings.js', 'dist/report/index.js', 'dist/index.js'],
};

/**
 * Resolve to { fn, from } for the named export, or { fn: null, why } when no candidate file has
 * it (or importing one throws: a half-finished module counts as not available).
 */
export async function findExport(name) {
  const tried = [];
  for (const rel of EXPORTS[name] ?? []) {
    const abs = join(repoDir, rel);
    if (!existsSync(abs)) continue;
    try {
      const mod = await import(pathToFileURL(abs).href);
      if (typeof mod[name] === 'function') return { fn: mod[name], from: rel };
      tried.push(`${rel} has no ${name}`);
    } catch (e) {
      tried.push(`${rel}: ${String(e?.message ?? e).split('\n')[0]}`);
    }
  }
  return { fn: null, why: tried.length ? tried.join('; ') : `${name} not built yet (no dist file)` };
}

/** Resolve several exports; resolves to { name: fn } or throws Error("not available yet: …"). */
export async function need(...names) {
  const out = {};
  const missing = [];
  for (const n of names) {
    const r = await findExport(n);
    if (r.fn) out[n] = r.fn;
    else missing.push(`${n} (${r.why})`);
  }
  if (missing.length) throw new Error(`not available yet: ${missing.join(', ')}`);
  return out;
}

/** The CLI is runnable when the launcher's target exists. */
export function cliAvailable() {
  return existsSync(join(repoDir, 'dist/cli/main.js'));
}
