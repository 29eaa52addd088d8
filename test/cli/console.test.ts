/**
 * What a test engineer reads after `analyze`, through the real binary on fixture builds: the
 * verdict table on stdout (not a terminal here: spawnSync pipes stdout and stderr), units that
 * could not be read as rows everywhere with their first error, counts and yield with their
 * denominators, --quiet / --json, the --fail-on gate, and usage errors before any work.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { ensureBuilt, ROOT } from './buildOnce.js';
import type { ResultsFile } from '../../src/types.js';
import { pdfPages } from '../report/pdfText.js';

const FIX = path.join(ROOT, 'fixtures', 'cli');
const LIMITS = path.join(FIX, 'limits-fixture.yaml');
const DATE = '2025-03-01T09:00:00Z';

function run(args: string[]): { code: number | null; stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, [path.join(ROOT, 'bin', 'spherecov.js'), ...args], { cwd: ROOT, encoding: 'utf8' });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}
const tmp = () => mkdtempSync(path.join(tmpdir(), 'spherecov-console-'));
const results = (out: string) => JSON.parse(readFileSync(path.join(out, 'results.json'), 'utf8')) as ResultsFile;

beforeAll(() => ensureBuilt(), 180_000);

describe('a build with an unreadable unit (fixtures/cli/unreadable: U-02 has an n/a cell at line 5)', () => {
  let out: string;
  let r: ReturnType<typeof run>;
  beforeAll(() => {
    out = tmp();
    r = run(['analyze', path.join(FIX, 'unreadable'), '--out', out, '--limits', LIMITS, '--creation-date', DATE]);
  }, 120_000);

  it('exits 2 and names the error on stderr, with no progress line (stderr is not a terminal)', () => {
    expect(r.code).toBe(2);
    expect(r.stderr).toBe("spherecov: U-02/U-02_beam1_28GHz.csv:5:8: eirp_dbm: found 'n/a', expected a number\n");
  });

  it('results.json lists the unit under unitsNotAnalyzed with verdict error and its first error', () => {
    const res = results(out);
    expect(res.units.map((u) => u.unit)).toEqual(['U-01', 'U-03']);
    expect(res.unitsNotAnalyzed).toEqual([{
      unit: 'U-02', frequencyHz: null, verdict: 'error',
      error: { file: 'U-02/U-02_beam1_28GHz.csv', line: 5, column: 8, message: "U-02/U-02_beam1_28GHz.csv:5:8: eirp_dbm: found 'n/a', expected a number" },
      errorCount: 1,
      files: ['U-02/U-02_beam0_28GHz.csv', 'U-02/U-02_beam1_28GHz.csv', 'U-02/U-02_beam2_28GHz.csv', 'U-02/U-02_beam3_28GHz.csv'],
    }]);
    // The damaged unit counts in the build and can only lower the yield.
    expect(res.build).toMatchObject({ units: 2, unitsInBuild: 3, passed: 2, failed: 0, notJudged: 0, errored: 1 });
    const peak = res.build!.stats.find((s) => s.metric === 'check:peak EIRP')!;
    expect(peak).toMatchObject({ yield: 1, passedCount: 2, judged: 2, inBuild: 3 });
    expect(peak.yieldInBuild).toBeCloseTo(2 / 3, 12);
  });

  it('summary.csv has a row for every unit, the unreadable one with verdict error and its location', () => {
    const lines = readFileSync(path.join(out, 'summary.csv'), 'utf8').replace(/^\uFEFF/, '').trim().split('\r\n');
    const head = lines[0].split(',');
    expect(lines).toHaveLength(4);
    const u2 = lines[2];
    expect(u2.startsWith('U-02,')).toBe(true);
    expect(u2).toContain(',error,');
    expect(u2).toContain('U-02/U-02_beam1_28GHz.csv:5:8');
    expect(head.slice(-6)).toEqual(['full_sphere', 'unmeasured_sr', 'missing_points', 'warnings', 'error_location', 'error_message']);
  });

  it('stdout carries the verdict table with the ERROR row, the counts with their denominators and the files written', () => {
    const rows = r.stdout.split('\n');
    expect(rows[0]).toMatch(/^unit\s+frequency\s+verdict\s+worst check\s+margin\s+sphere\s+warnings$/);
    expect(rows.find((l) => l.startsWith('U-01'))).toMatch(/^U-01\s+28\.000 GHz\s+PASS\s+peak EIRP\s+\+5\.00 dB\s+full\s+1$/);
    expect(rows.find((l) => l.startsWith('U-02'))).toMatch(/^U-02\s+—\s+ERROR\s+unreadable: U-02\/U-02_beam1_28GHz\.csv:5:8/);
    expect(r.stdout).toContain('3 unit(s) in the build: 2 passed, 0 failed, 0 not judged, 1 could not be read or analyzed.');
    expect(r.stdout).toContain('Yield: 2 of 3 (66.7 %) units in the build passed; 2 of 2 (100.0 %) judged units passed.');
    expect(r.stdout).toContain("U-02 not analyzed: U-02/U-02_beam1_28GHz.csv:5:8: eirp_dbm: found 'n/a', expected a number");
    expect(r.stdout).toContain('Wrote results.json, summary.csv, build-stats.csv, summary.pdf, U-01_28GHz.pdf, U-03_28GHz.pdf, viewer.html in ');
    // The line names exactly the files the run left in the output folder (besides its own manifest).
    const named = (/^Wrote (.*) in /m.exec(r.stdout) as RegExpExecArray)[1].split(', ').sort();
    expect(readdirSync(out).filter((f) => !f.startsWith('.')).sort()).toEqual(named);
  });

  it('summary.pdf shows the unit as ERROR with its location, and the yield against the build', async () => {
    const pages = await pdfPages(readFileSync(path.join(out, 'summary.pdf')));
    const p1 = pages[0];
    expect(p1).toContain('3: 2 analyzed');
    expect(p1).toContain('1 could not be read or analyzed');
    expect(p1).toContain('2 of 3 (66.7 %) units in the build');
    expect(p1).toMatch(/U-02 — ERROR/);
    expect(p1).toContain('U-02/U-02_beam1_28GHz.csv:5:8');
  });
});

describe('stdout modes', () => {
  it('--quiet prints nothing on success; --json prints results.json instead of the table', () => {
    const a = tmp();
    const q = run(['analyze', path.join(FIX, 'pass'), '--out', a, '--no-pdf', '--quiet', '--creation-date', DATE]);
    expect(q).toEqual({ code: 0, stdout: '', stderr: '' });
    const b = tmp();
    const j = run(['analyze', path.join(FIX, 'pass'), '--out', b, '--no-pdf', '--json', '--creation-date', DATE]);
    expect(j.code).toBe(0);
    expect(j.stdout).toBe(readFileSync(path.join(b, 'results.json'), 'utf8'));
  });

  it('--fail-on not-judged turns an unjudged build into exit 1; without it the exit is 0', () => {
    const base = ['analyze', path.join(FIX, 'pass'), '--no-pdf', '--quiet'];
    expect(run([...base, '--out', tmp()]).code).toBe(0);
    expect(run([...base, '--out', tmp(), '--fail-on', 'not-judged']).code).toBe(1);
    expect(run([...base, '--out', tmp(), '--fail-on', 'partial-sphere']).code).toBe(0);
    expect(run([...base, '--out', tmp(), '--limits', LIMITS, '--fail-on', 'not-judged']).code).toBe(0);
  });
});

describe('inputs that name nothing are usage errors before any work (exit 2, one line, nothing written)', () => {
  const cases: [string, string[], RegExp][] = [
    ['unknown reference unit', ['--reference', 'OSP-9999'], /^spherecov: --reference: 'OSP-9999' is neither a unit of this build \(U-01, U-02\) nor a folder of one unit's exports\n$/],
    ['reference folder that does not exist', ['--reference', '../nonexistent'], /^spherecov: --reference: the folder '..\/nonexistent' does not exist/],
    ['limit profile that does not exist', ['--limits', 'no-such-profile'], /^spherecov: --limits: .*'no-such-profile'.*\n$/],
    ['job file that does not exist', ['--job', 'no/such/job.yaml'], /^spherecov: --job: 'no\/such\/job.yaml' does not exist\n$/],
    ['unknown --fail-on condition', ['--fail-on', 'errors'], /^spherecov: --fail-on: found 'errors', expected one of not-judged, partial-sphere, warnings\n$/],
  ];
  for (const [what, args, message] of cases) {
    it(what, () => {
      const out = path.join(tmp(), 'out');
      const r = run(['analyze', path.join(FIX, 'pass'), '--out', out, ...args]);
      expect(r.code).toBe(2);
      expect(r.stderr).toMatch(message);
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
      expect(r.stdout).toBe('');
      expect(existsSync(out)).toBe(false);
    });
  }

  it('a reference given as the path of a unit folder of the build names that unit', () => {
    const out = tmp();
    const r = run(['analyze', path.join(FIX, 'pass'), '--out', out, '--no-pdf', '--quiet', '--reference', 'fixtures/cli/pass/U-01']);
    expect(r.code).toBe(0);
    expect(results(out).settings.reference).toBe('U-01');
    expect(results(out).units.find((u) => u.unit === 'U-02')!.reference?.unit).toBe('U-01');
  });
});
