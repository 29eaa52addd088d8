/**
 * Every catalogued warning is raised by something (STYLE.md habit 16): the pipeline (read →
 * assemble → measure, grouped by unit as the batch groups them) runs over the committed fixture
 * builds and a few small builds written here, and each code of src/warnings.ts must appear in
 * some output.
 */
import { describe, expect, it } from 'vitest';
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { WARNINGS } from '../src/warnings.js';
import type { WarningCode } from '../src/types.js';
import { discoverInputs, groupKey, toPosix } from '../src/batch/discover.js';
import { readExportFile } from '../src/io/readExportFile.js';
import { assembleMeasurements } from '../src/io/assembleMeasurements.js';
import { measureUnit, type TaskInput } from '../src/batch/unitTask.js';
import { loadJobFile } from '../src/io/jobFile.js';
import { gridCountWarnings } from '../src/analysis/gridAdequacy/gridCountWarnings.js';

const FIX = path.join(__dirname, '..', 'fixtures');

/** Codes raised for a folder: files grouped into units as the batch does, each group read, assembled and measured. */
async function codesOf(input: string): Promise<Map<WarningCode, string>> {
  const found = new Map<WarningCode, string>();
  const d = await discoverInputs(input);
  const job = d.jobFile ? loadJobFile(d.jobFile).job ?? undefined : undefined;
  const groups = new Map<string, string[]>();
  for (const f of d.files) {
    const k = groupKey(toPosix(path.relative(d.root, f)), job, path.basename(d.root));
    groups.set(k, [...(groups.get(k) ?? []), f]);
  }
  for (const files of groups.values()) {
    const reads = await Promise.all(files.map((f) => readExportFile(f, { inputRoot: d.root, job })));
    const a = assembleMeasurements(reads.flatMap((r) => r.beams), reads.map((r) => ({ path: r.file, sha256: r.sha256 })));
    const ws = [...reads.flatMap((r) => r.warnings), ...a.warnings];
    for (const m of a.measurements) {
      const task = { key: 'k', files, inputRoot: d.root, job: job ?? null, percentilesPct: [50], thresholds: [], relativeDb: [], limitSet: null, report: null, generatedAt: '', toolVersion: '' } as TaskInput;
      const { result } = measureUnit(m, task);
      ws.push(...m.warnings);
      // measureUnit adds these (as text) when the uncertainty block names a power class (issue 17).
      for (const pc of [1, 3]) ws.push(...gridCountWarnings(result.grid.points, result.grid.kind, m.quantity, pc));
    }
    for (const w of ws) if (!found.has(w.code)) found.set(w.code, `${path.relative(FIX, input) || input}: ${w.message}`);
  }
  return found;
}

/** Small invented builds for codes no committed fixture shows. */
function writtenBuilds(): string[] {
  const dir = mkdtempSync(path.join(tmpdir(), 'spherecov-warn-'));
  const grid = (step: number, value: (t: number, p: number) => number, extra = '') => {
    const rows: string[] = [];
    for (let t = 0; t <= 180; t += step) for (let p = 0; p < 360; p += step) rows.push(`${t},${p}${extra},${value(t, p).toFixed(2)}`);
    return rows;
  };
  // Two beams of one unit on grids 10° and 15°: the 15° beam is resampled onto the 10° grid.
  const resampled = path.join(dir, 'resampled', 'R-01');
  mkdirSync(resampled, { recursive: true });
  writeFileSync(path.join(resampled, 'R-01_beam0_28GHz.csv'), ['theta,phi,eirp_dbm', ...grid(10, (t) => 20 - t / 10)].join('\n'));
  writeFileSync(path.join(resampled, 'R-01_beam1_28GHz.csv'), ['theta,phi,eirp_dbm', ...grid(15, (t) => 10 + t / 20)].join('\n'));
  // A frequency column without a unit, and a row that repeats a direction with the same value (merged).
  const bare = path.join(dir, 'bare');
  mkdirSync(bare, { recursive: true });
  const seam: string[] = [];
  for (let t = 0; t <= 180; t += 15) for (let p = 0; p <= 360; p += 15) seam.push(`${t},${p},28,${(5 + t / 30).toFixed(2)}`);
  seam.push(seam[seam.length - 30]);
  writeFileSync(path.join(bare, 'B-01_beam0.csv'), ['theta,phi,freq,eirp_dbm', ...seam].join('\n'));
  // A matrix export with no quantity line: the quantity is assumed.
  const matrix = path.join(dir, 'matrix');
  mkdirSync(matrix, { recursive: true });
  const cols = Array.from({ length: 24 }, (_, k) => k * 15);
  const lines = [`theta,${cols.join(',')}`];
  for (let t = 0; t <= 180; t += 15) lines.push(`${t},${cols.map(() => '4.5').join(',')}`);
  writeFileSync(path.join(matrix, 'M-01_beam0_28GHz.csv'), lines.join('\n'));
  // A positioner that stops at θ = 150°: the cap below it is unmeasured (a partial sphere, TRP not evaluable).
  const blocked = path.join(dir, 'blocked');
  mkdirSync(blocked, { recursive: true });
  const upper = grid(10, (t) => 12 - t / 20).filter((r) => Number(r.split(',')[0]) <= 150);
  writeFileSync(path.join(blocked, 'P-01_beam0_28GHz.csv'), ['theta,phi,eirp_dbm', ...upper].join('\n'));
  return [path.join(dir, 'resampled'), bare, matrix, blocked];
}

describe('every catalogued warning is raised by some fixture', async () => {
  const found = new Map<WarningCode, string>();
  const dirs = ['demo', 'cli/pass', 'cli/fail', 'cli/eis', 'cli/formula', 'io', 'io/calibrated', 'io/calibrated_rx', 'io/dropouts', 'io/matrix', 'bad', 'bad-extra']
    .map((d) => path.join(FIX, d));
  for (const dir of [...dirs, ...writtenBuilds()]) for (const [c, where] of await codesOf(dir)) if (!found.has(c)) found.set(c, where);
  const codes = Object.keys(WARNINGS) as WarningCode[];

  for (const code of codes) {
    it(code, () => {
      expect(found.has(code), `no fixture raises '${code}'`).toBe(true);
    });
  }

  it('the three quality warnings say what they found', () => {
    expect(found.get('few-points')).toMatch(/grid points \(fewer than 100\)/);
    expect(found.get('beam-never-best')).toMatch(/beam '.+' is never the best beam/);
    expect(found.get('scattered-grid')).toMatch(/Voronoi/);
  });
}, 120_000);
