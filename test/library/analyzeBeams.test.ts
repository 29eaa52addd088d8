import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyzeBeams, BeamsInputError, unitReportPdf } from '../../src/index.js';
import type { UnitResult } from '../../src/index.js';
import { ensureBuilt, ROOT } from '../cli/buildOnce.js';
import { pdfPages } from '../report/pdfText.js';

const out = mkdtempSync(path.join(tmpdir(), 'spherecov-lib-'));
beforeAll(() => ensureBuilt(), 180_000);
afterAll(() => rmSync(out, { recursive: true, force: true }));

/** fixtures/io/long.csv as arrays: one direction list shared by beams 0 and 1. */
function longCsv() {
  const rows = readFileSync(path.join(ROOT, 'fixtures', 'io', 'long.csv'), 'utf8').trim().split('\n').filter((l) => !l.startsWith('#')).slice(1).map((l) => l.split(','));
  const of = (beam: string) => rows.filter((r) => r[2] === beam);
  return {
    directions: { thetaDeg: of('0').map((r) => Number(r[0])), phiDeg: of('0').map((r) => Number(r[1])) },
    beams: ['0', '1'].map((id) => ({ id, values: of(id).map((r) => Number(r[3])) })),
  };
}

/** The fields that do not depend on where the data came from (a file or memory). */
function comparable(u: UnitResult) {
  const { sources, warnings, ...rest } = u;
  return rest;
}

describe('analyzeBeams: data in memory → the UnitResult the CLI writes', () => {
  it('equals results.json of `spherecov analyze` on the same samples (limits, checks, verdict, metrics)', () => {
    const cli = spawnSync(process.execPath, [path.join(ROOT, 'bin', 'spherecov.js'), 'analyze', 'fixtures/io/long.csv', '--out', out, '--no-pdf',
      '--limits', '3gpp-fr2-pc3-n257', '--quiet'], { cwd: ROOT, encoding: 'utf8' });
    const fromCli = (JSON.parse(readFileSync(path.join(out, 'results.json'), 'utf8')) as { units: UnitResult[] }).units[0];
    expect(cli.status, cli.stderr).toBe(fromCli.verdict === 'fail' ? 1 : 0);
    const { result } = analyzeBeams({ unit: 'DUT-A', frequencyHz: 28e9, ...longCsv(), limits: '3gpp-fr2-pc3-n257' });
    // results.json is the JSON form of the same object (-0 and undefined fields as JSON writes them)
    expect(JSON.parse(JSON.stringify(comparable(result)))).toEqual(comparable(fromCli));
    expect(result.checks.length).toBeGreaterThan(0);
    expect(result.sources).toEqual([{ path: '(memory)', sha256: '' }]);
  }, 120_000);

  it('accepts azimuth/elevation and gives the same grid and metrics as θ/φ', () => {
    const { directions, beams } = longCsv();
    const azEl = { azimuthDeg: directions.phiDeg, elevationDeg: directions.thetaDeg.map((t) => 90 - t) };
    const a = analyzeBeams({ directions, beams, coreOnly: true }).result;
    const b = analyzeBeams({ directions: azEl, beams, coreOnly: true }).result;
    expect(b.tsp).toEqual(a.tsp);
    expect(b.grid).toEqual(a.grid);
  });

  it('lists every problem of unusable input instead of failing later', () => {
    const { directions, beams } = longCsv();
    const bad = () => analyzeBeams({
      directions: { thetaDeg: [...directions.thetaDeg.slice(0, -1), 200], phiDeg: directions.phiDeg },
      beams: [beams[0], { id: '0', values: [Number.NaN] }],
      limits: 'no-such-profile',
    });
    expect(bad).toThrow(BeamsInputError);
    try {
      bad();
    } catch (e) {
      const p = (e as BeamsInputError).problems;
      expect(p[0]).toBe('directions[83]: θ 200 is not between 0 and 180 degrees');
      expect(p).toContain("beams[1]: beam id '0' given twice");
      expect(p).toContain("beams[1] ('0'): 1 values for 84 directions");
      expect(p).toContain("beams[1] ('0'): value NaN at index 0 is not a finite number (dB)");
      expect(p.some((x) => x.startsWith('limits: ') && x.includes('no-such-profile'))).toBe(true);
    }
    expect(() => analyzeBeams({ directions: { thetaDeg: [0, 0], phiDeg: [0, 0] }, beams: [{ id: 'a', values: [1, 2] }] })).toThrow(/distinct directions/);
  });
});

describe('unitReportPdf: an analyzed unit → its PDF', () => {
  it('renders the unit report with the verdict, the checks and the cautions', async () => {
    const analysis = analyzeBeams({ unit: 'DUT-A', frequencyHz: 28e9, ...longCsv(), limits: '3gpp-fr2-pc3-n257' });
    const pdf = await unitReportPdf(analysis, { generatedAt: '2026-01-01T00:00:00Z', settings: { title: 'From code' } });
    expect(Buffer.from(pdf.subarray(0, 5)).toString()).toBe('%PDF-');
    const text = (await pdfPages(Buffer.from(pdf))).join('\n');
    expect(text).toContain('DUT-A');
    expect(text).toContain('From code');
    expect(text).toMatch(/not a regulatory conformance/i);
  }, 120_000);
});
