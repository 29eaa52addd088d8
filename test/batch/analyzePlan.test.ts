/**
 * The plan of an analyze run (src/batch/analyzePlan.ts): what it decides, and that every usage
 * error is found before the output folder is touched.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { groupTasks, planAnalyze } from '../../src/batch/analyzePlan.js';
import { RunError } from '../../src/batch/errors.js';

// Made at collection time: the table of usage errors below names paths inside it.
const sandbox = mkdtempSync(path.join(tmpdir(), 'spherecov-plan-'));
const input = path.join(sandbox, 'build');
const golden = path.join(sandbox, 'golden', 'G-01');

const exportText = (beam: string): string => {
  const out = ['theta_deg,phi_deg,eirp_dbm'];
  for (let t = 0; t <= 180; t += 45) for (let f = 0; f < 360; f += 90) out.push(`${t},${f},${beam}`);
  return out.join('\n') + '\n';
};

beforeAll(() => {
  for (const d of ['build/U-02', 'build/U-01', 'golden/G-01', 'empty']) mkdirSync(path.join(sandbox, d), { recursive: true });
  for (const f of ['U-01/beam1.csv', 'U-01/beam2.csv', 'U-02/beam1.csv']) writeFileSync(path.join(input, f), exportText('10'));
  writeFileSync(path.join(golden, 'beam1.csv'), exportText('12'));
  writeFileSync(path.join(input, 'spherecov.yaml'), [
    'percentiles: [50]',
    'coverage_thresholds: [8]',
    'checks:',
    '  - { kind: min-coverage, threshold: 5, minEfficiency: 0.5 }',
    'reference: U-02',
  ].join('\n') + '\n');
});

afterAll(() => rmSync(sandbox, { recursive: true, force: true }));

describe('planAnalyze', () => {
  it('decides the groups, the metrics (settings joined with the checks\' needs), the limit set and the reference', async () => {
    const out = path.join(sandbox, 'out-1');
    const plan = await planAnalyze({ input, outDir: out, pdf: false });
    expect([...plan.groups.keys()].sort()).toEqual(['U-01', 'U-02']);
    expect(plan.groups.get('U-01')!.map((f) => path.basename(f))).toEqual(['beam1.csv', 'beam2.csv']);
    // 8 from the job file, 5 from its min-coverage check (metricNeeds).
    expect(plan.metrics).toEqual({ percentilesPct: [50], thresholds: [5, 8], relativeDb: [] });
    expect(plan.limitSet?.checks.map((c) => c.kind)).toEqual(['min-coverage']);
    expect(plan.reference).toEqual({ given: 'U-02', unit: 'U-02', folder: null, afterReading: false });
    expect(plan.output).toMatchObject({ pdf: false, viewer: false, report: null });
    expect(groupTasks(plan).map((t) => [t.key, t.reference, t.thresholds])).toEqual([['U-01', 'U-02', [5, 8]], ['U-02', 'U-02', [5, 8]]]);
    expect(existsSync(out)).toBe(false); // planning writes nothing
  });

  it('a golden folder on the command line is found with its files at plan time', async () => {
    const plan = await planAnalyze({ input, outDir: path.join(sandbox, 'out-2'), pdf: false, reference: golden });
    expect(plan.reference.unit).toBeUndefined();
    expect(plan.reference.folder?.files.map((f) => path.relative(golden, f))).toEqual(['beam1.csv']);
  });

  it.each([
    ['a reference folder without exports', { reference: path.join(sandbox, 'empty') }, /--reference: no export files/],
    ['a reference that names nothing', { reference: 'U-99' }, /--reference: 'U-99' is neither a unit of this build/],
    ['a limit profile that does not exist', { limits: 'no-such-profile' }, /--limits:/],
    ['a job file that does not exist', { jobFile: path.join(sandbox, 'nope.yaml') }, /--job: .* does not exist/],
  ])('%s is a usage error before the output folder exists', async (_what, extra, message) => {
    const out = path.join(sandbox, 'out-err');
    await expect(planAnalyze({ input, outDir: out, pdf: false, ...extra })).rejects.toThrow(RunError);
    await expect(planAnalyze({ input, outDir: out, pdf: false, ...extra })).rejects.toThrow(message);
    expect(existsSync(out)).toBe(false);
  });
});
