/**
 * End-to-end on fixtures/cli/eis-pol (make-receive-fixtures.mjs): EIS exports with a θ/φ pair,
 * φ = θ + a known offset per unit (P-01 +1 dB, P-02 +3 dB, P-03 0 dB).
 * The oracle reads the files with the definitions written out independently of src/: exact 5°
 * cell solid angles Ω = Δφ·(cos θ₁ − cos θ₂) with polar caps, per direction the MINIMUM over
 * beams of ONE polarization, the step percentile "smallest value whose cumulative solid angle
 * reaches p·4π" (CONTRACT.md). Limits: PC3 n257 100 MHz, REFSENS −85.3 dBm and EIS spherical
 * coverage −74.4 dBm at 50 % (TS 38.101-2 Tables 7.3.2.3-1 / 7.3.4.3-1 via the reference notes).
 * Rule under test (reference notes, "Receive requirements and polarization"): each polarization
 * is judged on its own; the unit passes only when both pass; no power sum of EIS.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { ensureBuilt, ROOT } from './buildOnce.js';
import type { ResultsFile } from '../../src/types.js';
import { expectClose } from '../helpers/expectClose.js';
import { pdfPages } from '../report/pdfText.js';
import { resultsSchemaProblems } from '../helpers/resultsSchemaProblems.js';

const DIR = path.join(ROOT, 'fixtures', 'cli', 'eis-pol');
const RAD = Math.PI / 180;

function oracle(unitDir: string, column: 2 | 3): { best: number; p50: number } {
  const tsp = new Map<string, number>();
  for (const f of readdirSync(unitDir)) {
    for (const l of readFileSync(path.join(unitDir, f), 'utf8').trim().split('\n').slice(1)) {
      const c = l.split(',').map(Number);
      const key = c[0] === 0 || c[0] === 180 ? `${c[0]},0` : `${c[0]},${c[1]}`;
      tsp.set(key, Math.min(tsp.get(key) ?? Infinity, c[column]));
    }
  }
  const pts = [...tsp].map(([k, v]) => {
    const t = Number(k.split(',')[0]);
    const w = t === 0 || t === 180 ? 2 * Math.PI * (1 - Math.cos(2.5 * RAD)) : 5 * RAD * (Math.cos((t - 2.5) * RAD) - Math.cos((t + 2.5) * RAD));
    return { v, w };
  }).sort((a, b) => a.v - b.v);
  let acc = 0;
  const p50 = pts.find((p) => (acc += p.w) >= 2 * Math.PI * (1 - 1e-12))!.v;
  return { best: pts[0].v, p50 };
}

function analyze(...extra: string[]): { status: number | null; res: ResultsFile; csv: string; stderr: string; out: string } {
  const out = mkdtempSync(path.join(tmpdir(), 'spherecov-eispol-'));
  const r = spawnSync(process.execPath, [path.join(ROOT, 'bin', 'spherecov.js'), 'analyze', DIR, '--out', out,
    '--limits', '3gpp-fr2-pc3-n257-eis-100mhz', '--quiet', ...extra], { encoding: 'utf8' });
  const res = JSON.parse(readFileSync(path.join(out, 'results.json'), 'utf8'));
  expect(resultsSchemaProblems(res), 'results.json matches schemas/results.schema.json').toEqual([]);
  return { out, status: r.status, stderr: r.stderr, res, csv: readFileSync(path.join(out, 'summary.csv'), 'utf8') };
}

beforeAll(() => ensureBuilt(), 180_000);

describe('EIS θ/φ pairs through the CLI', () => {
  it('judges each polarization on its own; the verdict follows the worse one (exit 1: P-02 fails in φ only)', () => {
    const { status, res, csv, stderr } = analyze('--no-pdf');
    expect(status, stderr).toBe(1);
    expect(res.units.map((u) => [u.unit, u.verdict, u.polarizationRule, u.limitingPolarization])).toEqual([
      ['P-01', 'pass', 'each', 'phi'],
      ['P-02', 'fail', 'each', 'phi'],
      ['P-03', 'pass', 'each', 'theta'], // equal: ties keep θ
    ]);
    for (const u of res.units) {
      const dir = path.join(DIR, u.unit);
      for (const [name, col] of [['theta', 2], ['phi', 3]] as const) {
        const want = oracle(dir, col);
        const p = u.polarizations!.find((x) => x.name === name)!;
        expectClose(p.tsp.peak.value, want.best, 1e-9, `${u.unit} ${name}: best EIS (files carry 3 decimals, read exactly)`);
        expectClose(p.tsp.percentiles.find((x) => x.levelPct === 50)!.value!, want.p50, 1e-9, `${u.unit} ${name}: 50 % level (step rule)`);
        // Each polarization judged against the same limits: REFSENS is a maximum on the best EIS.
        expect(p.checks[0].pass).toBe(want.best <= -85.3);
      }
    }
    const p2 = res.units[1];
    expect(p2.polarizations!.map((p) => [p.name, p.verdict])).toEqual([['theta', 'pass'], ['phi', 'fail']]);
    // The unit's check carries the limiting polarization's value: φ is θ + 3 dB, so −85 dBm > −85.3 dBm.
    expect(p2.checks[0]).toMatchObject({ name: 'REFSENS (peak EIS)', status: 'fail', polarization: 'phi' });
    expectClose(p2.checks[0].value!, -85, 1e-9, 'φ best EIS = −88 + 3 dB (fixture offset)');
    expectClose(p2.tsp.peak.value - p2.polarizations![0].tsp.peak.value, 3, 1e-9, 'the known θ/φ offset (fixture)');
    // Nothing is power-summed: the unit's best EIS is one polarization's, never −88 ⊕ −85.
    for (const u of res.units) expect(u.polarizations!.map((p) => p.tsp.peak.value)).toContain(u.tsp.peak.value);
    const header = csv.split(/\r?\n/)[0].split(',');
    expect(header).toEqual(expect.arrayContaining(['polarization_rule', 'limiting_polarization', 'theta_peak', 'phi_peak', 'theta_p50', 'phi_verdict']));
    const row = csv.split(/\r?\n/)[2].split(',');
    expect(row[header.indexOf('limiting_polarization')]).toBe('phi');
    expect(row[header.indexOf('phi_verdict')]).toBe('fail');
    expect(row[header.indexOf('theta_verdict')]).toBe('pass');
  });

  it('the combined-sensitivity view is explicit: 3.01 dB better than either of two equal polarizations (exit 0)', () => {
    const { status, res, stderr } = analyze('--no-pdf', '--eis-polarizations', 'combined');
    expect(status, stderr).toBe(0);
    expect(res.settings.eisPolarizations).toBe('combined');
    const p3 = res.units.find((u) => u.unit === 'P-03')!;
    expect(p3.polarizationRule).toBe('combined-sensitivity');
    expectClose(p3.tsp.peak.value, oracle(path.join(DIR, 'P-03'), 2).best - 10 * Math.log10(2), 1e-9, '1/EIS = 2/EISθ (linear algebra)');
    expect(p3.polarizations!.every((p) => p.verdict === null)).toBe(true);
  });

  it('writes a PDF that shows both polarizations and names the limiting one', async () => {
    const { status, res, out } = analyze();
    expect(status).toBe(1);
    expect(res.units).toHaveLength(3);
    const text = (await pdfPages(readFileSync(path.join(out, 'P-02_28GHz.pdf')))).join(' ');
    expect(text).toContain('Polarizations θ and φ (EIS)');
    expect(text).toContain('EIS values are never power-summed');
    expect(text).toMatch(/φ \(limiting\) -85\.00/);
    expect(text).toMatch(/REFSENS \(peak EIS\) -88\.00 dBm -85\.00 dBm -85\.30 dBm φ ✗ FAIL/);
  });
});
