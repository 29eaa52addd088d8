/**
 * The uncertainty block end to end through runAnalyze (in-process): job file → results.json.
 */
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { pdfPages } from '../../report/pdfText.js';
import { consoleTable } from '../../../src/report/consoleTable.js';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { runAnalyze } from '../../../src/batch/runAnalyze.js';
import { loadJobFile } from '../../../src/io/jobFile.js';
import { parseLimitSetText } from '../../../src/limits/parseLimitSet.js';
import { handsetModule, regularGrid, simulateBeams } from '../../../src/sim/index.js';
import { resultsSchemaProblems } from '../../helpers/resultsSchemaProblems.js';

/** One invented handset unit on a constant-step grid, long layout. */
function writeUnit(dir: string, unit: string, stepDeg: number, powerDbm = 13): void {
  const { model, codebook } = handsetModule({ conductedPowerDbm: powerDbm });
  const g = regularGrid({ thetaStepDeg: stepDeg, phiStepDeg: stepDeg, polesOnce: true });
  const beams = simulateBeams(model, codebook, g, 28e9);
  const lines = ['unit,beam,theta_deg,phi_deg,eirp_dbm'];
  for (const b of beams) for (let i = 0; i < g.thetaDeg.length; i++) lines.push(`${unit},${b.id},${g.thetaDeg[i]},${g.phiDeg[i]},${b.eirpDbm[i].toFixed(3)}`);
  writeFileSync(path.join(dir, `${unit}.csv`), lines.join('\n') + '\n');
}

const CHECKS = `checks:
  - { kind: percentile, name: cov50, level_pct: 50, limit: 4, tolerance_db: 0.5 }
  - { kind: min-peak, name: peak, limit: 15 }
  - { kind: min-coverage, name: cov4, threshold: 4, min_efficiency: 0.5 }
  - { kind: min-relative-coverage, name: within 15 dB, db_below_peak: 15, min_efficiency: 0.5 }
`;

async function run(job: string, stepDeg = 5, pdf = false) {
  const input = mkdtempSync(path.join(tmpdir(), 'spherecov-mu-'));
  writeUnit(input, 'PX-1', stepDeg);
  writeFileSync(path.join(input, 'spherecov.yaml'), job);
  const out = mkdtempSync(path.join(tmpdir(), 'spherecov-mu-out-'));
  const r = await runAnalyze({ input, outDir: out, pdf, jobs: 1 });
  expect(resultsSchemaProblems(r.results), 'results.json matches schemas/results.schema.json').toEqual([]);
  return { out, ...r };
}

describe('uncertainty through runAnalyze', () => {
  it('without an uncertainty block nothing about the verdict changes; with shared-risk the checks only gain a decision', async () => {
    const plain = (await run(CHECKS)).results.units[0];
    const mu = (await run(`${CHECKS}uncertainty:\n  decision_rule: shared-risk\n  draws: 200\n  eirp: { expanded_db: 2, per_direction_db: 0.3 }\n`)).results;
    const u = mu.units[0];
    expect(plain.confidence).toBeUndefined();
    expect(plain.checks.every((c) => c.decision === undefined)).toBe(true);
    expect(u.verdict).toBe(plain.verdict);
    expect(u.checks.map((c) => ({ ...c, decision: undefined }))).toEqual(plain.checks.map((c) => ({ ...c, decision: undefined })));
    expect(u.confidence!.draws).toBe(200);
    // a window relative to the peak is re-read against each draw's own peak
    expect(u.checks.find((c) => c.kind === 'min-relative-coverage')!.decision!.probabilityOfConformance).not.toBeNull();
    expect(u.confidence!.probabilityOfConformance).not.toBeNull();
    expect(u.checks.every((c) => c.decision!.probabilityOfConformance! >= 0 && c.decision!.probabilityOfConformance! <= 1)).toBe(true);
    expect(mu.settings.uncertainty).toMatchObject({ decisionRule: 'shared-risk' });
    // grid adequacy is reported for every unit, uncertainty or not
    expect(plain.gridAdequacy!.percentiles.find((p) => p.levelPct === 50)!.adequacyDb).toBeGreaterThanOrEqual(0);
  });
  it('guarded with a large guard band fails a unit that passes shared-risk, and a 15° grid is warned about', async () => {
    const r = await run(`${CHECKS}uncertainty:\n  decision_rule: guarded\n  guard_band_db: 20\n  draws: 100\n  eirp: { expanded_db: 2, per_direction_db: 0.3 }\n`, 15, true);
    const u = r.results.units[0];
    expect(u.verdict).toBe('fail');
    expect(r.exitCode).toBe(1);
    expect(u.checks[0].decision!.guardBandDb).toBe(20);
    expect(u.warnings.some((w) => w.includes('PC3 beam-peak-search minimum'))).toBe(true);
    // where it shows: summary.csv columns, the console's column and build line, the PDF page
    const csv = readFileSync(path.join(r.out, 'summary.csv'), 'utf8').split(/\r?\n/);
    expect(csv[0]).toContain('decision_rule,statement,probability_of_conformance,probability_std_err');
    expect(csv[1]).toContain(',guarded,fail,');
    const text = consoleTable(r.results, [], 'out');
    expect(text).toMatch(/how sure/);
    expect(text).toMatch(/fail · P \d/);
    expect(text).toMatch(/expected truly conforming/);
    expect(r.results.build!.confidence!.judged).toBe(1);
    const pages = (await pdfPages(readFileSync(path.join(r.out, 'PX-1.pdf')))).join(' ');
    expect(pages).toContain('How sure is this verdict');
    expect(pages).toContain('P(truly met)');
    expect(pages).toContain('Was the grid fine enough');
  });
  it('rejects a bad block with the key path and position', () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'spherecov-mu-job-'));
    const f = path.join(dir, 'spherecov.yaml');
    writeFileSync(f, 'uncertainty:\n  decision_rule: lenient\n  eirp: { expanded_db: 1, per_direction_db: 0.5 }\n');
    expect(loadJobFile(f).errors.map((e) => e.message)).toEqual([
      "spherecov.yaml:2:18: uncertainty.decision_rule: found 'lenient', expected one of shared-risk, guarded, non-binary",
    ]);
    // The rule across keys (u_r ≤ U/1.96) is judged once every key has the right form.
    writeFileSync(f, 'uncertainty:\n  decision_rule: guarded\n  eirp: { expanded_db: 1, per_direction_db: 0.9 }\n');
    expect(loadJobFile(f).errors.map((e) => e.message)).toEqual([
      "spherecov.yaml:3:45: uncertainty.eirp.per_direction_db: found '0.9', expected at most U/1.96 = 0.5102 dB (the per-direction part cannot exceed the whole)",
    ]);
  });
  it('a limit set may carry the block too (strict keys, located errors)', () => {
    const ok = parseLimitSetText('name: x\nquantity: eirp\nchecks: []\nuncertainty: { decision_rule: non-binary, eirp: { expanded_db: 1.5, per_direction_db: 0.2 } }\n', 'x.yaml');
    expect(ok.limitSet?.uncertainty).toEqual({ decisionRule: 'non-binary', quantities: { eirp: { expandedDb: 1.5, perDirectionDb: 0.2 } } });
    const bad = parseLimitSetText('name: x\nquantity: eirp\nchecks: []\nuncertainty: { decision_rule: guarded, guard_band_db: 1, eirp: { expanded_db: 1.5, per_direction_db: 0.2, k: 2 } }\n', 'x.yaml');
    expect(bad.errors.map((e) => e.message)).toEqual([
      'x.yaml:4:107: uncertainty.eirp.k: found an unknown key, expected one of the keys known here: expanded_db, per_direction_db (the closest is expanded_db)',
    ]);
  });
});
