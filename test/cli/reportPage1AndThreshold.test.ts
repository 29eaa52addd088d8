/**
 * End-to-end through the built CLI (issue 14, "Reports say exactly one thing"): the coverage holes
 * and the unit report's map contour use one threshold, which results.json records and the caption
 * states; the job file's test_info block reaches results.json and page 1 of every report as written.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { cpSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { ensureBuilt, ROOT } from './buildOnce.js';
import { pdfPages } from '../report/pdfText.js';
import type { ResultsFile } from '../../src/types.js';
import { expectClose } from '../helpers/expectClose.js';

const FIX = path.join(ROOT, 'fixtures', 'cli');
const tmp = () => mkdtempSync(path.join(tmpdir(), 'spherecov-page1-'));

let out: string;
let res: ResultsFile;
let code: number | null;

beforeAll(() => {
  ensureBuilt();
  const dir = tmp();
  // The fixture limits with a test tolerance on the coverage check: the verdict is judged at
  // 10 − 1.5 = 8.5 dBm, while holes and contour must stay at the 10 dBm written.
  const limits = readFileSync(path.join(FIX, 'limits-fixture.yaml'), 'utf8').replace('    min_efficiency: 0.8', '    min_efficiency: 0.8\n    tolerance_db: 1.5');
  expect(limits).toContain('tolerance_db: 1.5');
  writeFileSync(path.join(dir, 'limits.yaml'), limits);
  const input = path.join(dir, 'build');
  cpSync(path.join(FIX, 'fail'), input, { recursive: true });
  writeFileSync(path.join(input, 'spherecov.yaml'), [
    'limits: ../limits.yaml',
    'test_info:',
    '  chamber: 007',
    '  operator: C. Invented',
    '  date_measured: 2026-11-30',
    '  dut_description: "fixture module: cos² beams"',
    '  notes: |',
    '    radome fitted',
    '    second line',
    '',
  ].join('\n'));
  out = path.join(dir, 'out');
  const r = spawnSync(process.execPath, [path.join(ROOT, 'bin', 'spherecov.js'), 'analyze', input, '--out', out, '--creation-date', '2025-03-01T09:00:00Z', '--jobs', '1', '--quiet', '--no-viewer'], { encoding: 'utf8' });
  expect(r.stderr).toBe('');
  code = r.status;
  res = JSON.parse(readFileSync(path.join(out, 'results.json'), 'utf8')) as ResultsFile;
}, 180_000);

describe('one threshold for holes and the map contour', () => {
  it('results.json records it per unit: the coverage check as written, no tolerance applied', () => {
    expect(code).toBe(1);
    for (const u of res.units) {
      expect(u.analysisThreshold).toEqual({ value: 10, source: 'min-coverage-check', toleranceApplied: false });
      expect(u.checks.find((c) => c.kind === 'min-coverage')!.toleranceDb).toBe(1.5); // the verdict's relaxation exists
    }
  });

  it('the holes were found at it: their solid angle is 4π minus the coverage at that threshold', () => {
    for (const u of res.units) {
      const at = u.tsp.coverage.find((c) => c.threshold === u.analysisThreshold!.value)!;
      expect(at).toBeDefined();
      const holesSr = u.holes!.reduce((a, h) => a + h.solidAngleSr, 0);
      // Closed form: holes are the directions worse than t, coverage those at or better (CONTRACT.md),
      // so on a full sphere the two add to 4π; 1e-9 sr covers summation order over ~2600 cells.
      expectClose(holesSr, 4 * Math.PI * (1 - at.efficiency), 1e-9, 'holes + covered = 4π at one threshold');
    }
  });

  it("each unit report's map caption and holes section name that same value and say no tolerance is applied", async () => {
    for (const u of res.units) {
      const text = (await pdfPages(readFileSync(path.join(out, `${u.unit}_28GHz.pdf`)))).join(' ');
      const contour = /contour at (-?\d+\.\d+) dBm/.exec(text);
      expect(contour, u.unit).not.toBeNull();
      expect(Number(contour![1])).toBe(u.analysisThreshold!.value);
      expect(text).toMatch(/the same threshold the coverage holes are found at \(the limit set's coverage threshold as written; no test tolerance applied\)/);
      const holes = /coverage threshold \((-?\d+\.\d+) dBm, the map's contour\)/.exec(text);
      expect(holes, u.unit).not.toBeNull();
      expect(Number(holes![1])).toBe(u.analysisThreshold!.value);
    }
  });
});

describe('test_info from the job file', () => {
  const asWritten = { chamber: '007', operator: 'C. Invented', date_measured: '2026-11-30', dut_description: 'fixture module: cos² beams', notes: 'radome fitted\nsecond line\n' };

  it('is written verbatim into results.json', () => {
    expect(res.testInfo).toEqual(asWritten);
  });

  it('is on page 1 of every unit report and of summary.pdf', async () => {
    const files = [...res.units.map((u) => `${u.unit}_28GHz.pdf`), 'summary.pdf'];
    for (const f of files) {
      const page1 = (await pdfPages(readFileSync(path.join(out, f))))[0];
      for (const [label, value] of [['Chamber', '007'], ['Operator', 'C. Invented'], ['Date measured', '2026-11-30'], ['DUT description', 'fixture module: cos² beams'], ['Notes', 'radome fitted second line']]) {
        expect(page1, `${f}: ${label}`).toContain(`${label} ${value}`);
      }
    }
  });
});
