/**
 * --reference as a folder of a golden unit's exports measured outside the build: the fixture
 * builds (fixtures/cli, cos² beams) differ only by their per-unit power offset, so every EIRP
 * delta against the golden unit is that offset exactly (U-03 is generated 12 dB below U-01).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { ensureBuilt, ROOT } from './buildOnce.js';
import type { ResultsFile } from '../../src/types.js';
import { expectClose } from '../helpers/expectClose.js';

const FIX = path.join(ROOT, 'fixtures', 'cli');

beforeAll(() => ensureBuilt(), 180_000);

describe('--reference <folder>', () => {
  it('compares every unit of the build with a golden unit from its own folder', () => {
    const out = mkdtempSync(path.join(tmpdir(), 'spherecov-ref-'));
    const r = spawnSync(process.execPath, [path.join(ROOT, 'bin', 'spherecov.js'), 'analyze', path.join(FIX, 'fail'), '--out', out,
      '--reference', path.join(FIX, 'pass', 'U-02'), '--no-pdf', '--quiet'], { encoding: 'utf8' });
    expect(r.status, r.stderr).toBe(0);
    const res = JSON.parse(readFileSync(path.join(out, 'results.json'), 'utf8')) as ResultsFile;
    expect(res.units.map((u) => u.unit)).toEqual(['U-01', 'U-02', 'U-03']); // the golden unit is not a result
    const offsets: Record<string, number> = { 'U-01': -0.5, 'U-02': 0, 'U-03': -12.5 }; // p0 24 / 24.5 / 12 vs 24.5
    for (const u of res.units) {
      expect(u.reference?.unit).toBe('U-02');
      // Offsets are exact in the generator; values are printed with 3 decimals.
      expectClose(u.reference!.deltas.peak as number, offsets[u.unit], 1e-9, `${u.unit}: peak delta`);
      expectClose(u.reference!.deltas.p50 as number, offsets[u.unit], 2e-3, `${u.unit}: 50 % delta (3-decimal rounding)`);
    }
  });

  it('refuses a folder without exports in plain words', () => {
    const out = mkdtempSync(path.join(tmpdir(), 'spherecov-ref-'));
    const empty = mkdtempSync(path.join(tmpdir(), 'spherecov-empty-'));
    const r = spawnSync(process.execPath, [path.join(ROOT, 'bin', 'spherecov.js'), 'analyze', path.join(FIX, 'pass'), '--out', out,
      '--reference', empty, '--no-pdf', '--quiet'], { encoding: 'utf8' });
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/--reference: no export files/);
  });
});

describe('one unit folder analyzed on its own', () => {
  it('is one unit named after the folder, not one unit per beam file', () => {
    const out = mkdtempSync(path.join(tmpdir(), 'spherecov-one-'));
    const r = spawnSync(process.execPath, [path.join(ROOT, 'bin', 'spherecov.js'), 'analyze', path.join(ROOT, 'fixtures', 'demo', 'RV28-P1-001'),
      '--out', out, '--no-pdf', '--quiet'], { encoding: 'utf8' });
    expect(r.status, r.stderr).toBe(0);
    const res = JSON.parse(readFileSync(path.join(out, 'results.json'), 'utf8')) as ResultsFile;
    expect(res.units.map((u) => [u.unit, u.beams.length])).toEqual([['RV28-P1-001', 16]]);
  });
});
