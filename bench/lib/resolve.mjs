// Find the project's compiled functions in dist/ as they land. Each stage names the export it
// needs and the files it may live in; a missing file or export means "not available yet".
import { spawnSync } from 'node:child_process';
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
  beamRemoval: ['dist/analysis/beamRemoval.js', 'dist/analysis/index.js', 'dist/index.js'],
  findHoles: ['dist/analysis/findHoles.js', 'dist/analysis/index.js', 'dist/index.js'],
  greedySubset: ['dist/analysis/greedySubset.js', 'dist/analysis/index.js', 'dist/index.js'],
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

/**
 * Is the CLI runnable? Its compiled entry must exist and `spherecov --help` must start (a missing
 * module behind it means another stage has not landed yet). Resolves to { ok, why }.
 */
export function cliAvailable() {
  if (!existsSync(join(repoDir, 'dist/cli/main.js'))) return { ok: false, why: 'dist/cli/main.js missing' };
  const r = spawnSync(process.execPath, [join(repoDir, 'bin/spherecov.js'), '--help'], { cwd: repoDir, encoding: 'utf8', timeout: 60_000 });
  if (r.status === 0) return { ok: true, why: '' };
  const line = (r.stderr || r.stdout || '').split('\n').find((l) => /Error|error/.test(l)) ?? `exit ${r.status}`;
  return { ok: false, why: `the CLI does not start: ${line.trim().slice(0, 160)}` };
}
