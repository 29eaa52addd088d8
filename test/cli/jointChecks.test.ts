/**
 * End-to-end through the CLI for the checks that join two measurements of one unit:
 * beam correspondence on fixtures/cli/bc (transmit and receive exports of one codebook, simulated
 * with src/sim; make-receive-fixtures.mjs) and inter-band coverage on fixtures/cli/band.
 * Limits: the shipped PC3 profiles (TS 38.101-2 Table 6.6.4.2-1: 3.0 dB for n257; §6.2A.1:
 * ΔT_IB,S,n = 6.0 dB for CA_n257A-n259A, levels 11.5 and 5.8 dBm from Table 6.2.1.3-3, via the
 * reference notes).
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

const RAD = Math.PI / 180;

function run(dir: string, limits: string, pdf = false): { status: number | null; res: ResultsFile; out: string; stderr: string } {
  const out = mkdtempSync(path.join(tmpdir(), 'spherecov-joint-'));
  const r = spawnSync(process.execPath, [path.join(ROOT, 'bin', 'spherecov.js'), 'analyze', path.join(ROOT, 'fixtures', 'cli', dir), '--out', out,
    '--limits', limits, '--quiet', ...(pdf ? [] : ['--no-pdf'])], { encoding: 'utf8' });
  const res = JSON.parse(readFileSync(path.join(out, 'results.json'), 'utf8'));
  expect(resultsSchemaProblems(res), 'results.json matches schemas/results.schema.json').toEqual([]);
  return { status: r.status, stderr: r.stderr, out, res };
}

/** Independent oracle for the joint share: TSP per direction from the file, 10° grid weights with polar caps. */
function tspOf(file: string): Map<string, number> {
  const tsp = new Map<string, number>();
  for (const l of readFileSync(file, 'utf8').trim().split('\n').slice(1)) {
    const [t, f, , v] = l.split(',').map(Number);
    const k = `${t},${t === 0 || t === 180 ? 0 : f}`;
    tsp.set(k, Math.max(tsp.get(k) ?? -Infinity, v));
  }
  return tsp;
}
const weight10 = (t: number): number => (t === 0 || t === 180 ? 2 * Math.PI * (1 - Math.cos(5 * RAD)) : 10 * RAD * (Math.cos((t - 5) * RAD) - Math.cos((t + 5) * RAD)));

beforeAll(() => ensureBuilt(), 180_000);

describe('beam correspondence through the CLI', () => {
  it('pairs each unit\'s tx and rx exports: same beam choice gives 0 dB and a pass, a shifted choice fails (exit 1)', () => {
    const { status, res, stderr } = run('bc', '3gpp-fr2-pc3-n257-beam-correspondence');
    expect(status, stderr).toBe(1);
    const tx = res.units.filter((u) => u.quantity === 'eirp');
    expect(tx.map((u) => [u.unit, u.verdict])).toEqual([['B-01', 'pass'], ['B-02', 'fail']]);
    expect(tx[0].checks[0]).toMatchObject({ kind: 'beam-correspondence', value: 0, limit: 3, status: 'pass' });
    expect(tx[0].beamCorrespondence).toMatchObject({ valueDb: 0, otherBeamShareOfRegion: 0, rxChoiceBasis: 'eis', resampled: false });
    // The region is the upper half of the TSP by solid angle: 2π, up to the cells tied at its boundary.
    expect(tx[0].beamCorrespondence!.regionSr).toBeGreaterThanOrEqual(2 * Math.PI - 1e-9);
    expect(tx[1].checks[0].value!).toBeGreaterThan(3);
    // The receive exports are reported, unjudged by a transmit limit set, and say what they served for.
    const rx = res.units.filter((u) => u.quantity === 'eis');
    expect(rx.map((u) => [u.unit, u.verdict, u.checks.length])).toEqual([['B-01', 'none', 0], ['B-02', 'none', 0]]);
    expect(rx[0].warnings.some((w) => w.includes('receive side of unit B-01'))).toBe(true);
  });
  it('without the receive export the check is not evaluable and says what is missing (exit 0, verdict none)', () => {
    const { status, res } = run('pass', '3gpp-fr2-pc3-n257-beam-correspondence');
    expect(status).toBe(0);
    expect(res.units[0].checks[0]).toMatchObject({ status: 'not-evaluable' });
    expect(res.units[0].checks[0].note).toContain('receive (EIS) export');
    expect(res.units[0].verdict).toBe('none');
  });
  it('names the receive report apart from the transmit report of the same unit and frequency, and draws the ΔEIRP_BC CDF', async () => {
    const { out } = run('bc', '3gpp-fr2-pc3-n257-beam-correspondence', true);
    expect(readdirSync(out).filter((f) => f.endsWith('.pdf')).sort()).toEqual(['B-01_28GHz.pdf', 'B-01_28GHz_eis.pdf', 'B-02_28GHz.pdf', 'B-02_28GHz_eis.pdf', 'summary.pdf']);
    const text = (await pdfPages(readFileSync(path.join(out, 'B-02_28GHz.pdf')))).join(' ');
    expect(text).toContain('Beam correspondence (ΔEIRP_BC)');
    expect(text).toContain('share of the region with ΔEIRP_BC ≤ x');
  }, 120_000);
});

describe('inter-band coverage through the CLI', () => {
  it('joint share of the two bands\' regions, judged on both frequencies of the unit (exit 1: I-02 fails)', () => {
    const { status, res, stderr } = run('band', '3gpp-fr2-pc3-ca-n257-n259');
    expect(status, stderr).toBe(1);
    expect(res.units.map((u) => [u.unit, u.frequencyHz, u.verdict])).toEqual([
      ['I-01', 28e9, 'pass'], ['I-01', 40e9, 'pass'], ['I-02', 28e9, 'fail'], ['I-02', 40e9, 'fail'],
    ]);
    for (const unit of ['I-01', 'I-02']) {
      const a = tspOf(path.join(ROOT, 'fixtures', 'cli', 'band', unit, `${unit}_28GHz.csv`));
      const b = tspOf(path.join(ROOT, 'fixtures', 'cli', 'band', unit, `${unit}_40GHz.csv`));
      let both = 0;
      for (const [k, va] of a) if (va >= 11.5 - 6 && (b.get(k) as number) >= 5.8 - 6) both += weight10(Number(k.split(',')[0]));
      const u = res.units.find((x) => x.unit === unit)!;
      expectClose(u.checks[0].value!, both / (4 * Math.PI), 1e-9, `${unit}: joint share, TSP ≥ level − 6 dB in both bands (recomputed from the files)`);
      expect(u.checks[0].limit).toBe(0.5);
      expect(u.interBand!.bands.map((x) => x.levelDbm)).toEqual([5.5, -0.2]);
    }
  });
  it('maps the joint region in the PDF', async () => {
    const { out } = run('band', '3gpp-fr2-pc3-ca-n257-n259', true);
    const text = (await pdfPages(readFileSync(path.join(out, 'I-02_40GHz.pdf')))).join(' ');
    expect(text).toContain('Inter-band coverage: joint region of the two bands');
    expect(text).toContain('both (joint region)');
  }, 120_000);
});
