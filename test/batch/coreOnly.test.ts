// --core-only: the metrics and checks of a full run, without the optional analysis.
import { describe, expect, it } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { runAnalyze } from '../../src/batch/runAnalyze.js';

/** Two cos-shaped beams pointing up and down on a 15° grid (one file each). */
function beamFile(dir: string, beam: string, up: boolean): void {
  const lines = ['theta_deg,phi_deg,eirp_dbm'];
  for (let t = 0; t <= 180; t += 15) for (let f = 0; f < 360; f += 15) {
    const c = Math.cos((t * Math.PI) / 180) * (up ? 1 : -1);
    lines.push(`${t},${f},${(20 + 10 * Math.log10(Math.max(1e-3, c))).toFixed(3)}`);
  }
  writeFileSync(path.join(dir, `unit_beam${beam}.csv`), lines.join('\n') + '\n');
}

describe('--core-only', () => {
  it('gives the same metrics and checks and leaves out holes, beam removal and the subset', async () => {
    const input = mkdtempSync(path.join(tmpdir(), 'spherecov-core-'));
    beamFile(input, '0', true);
    beamFile(input, '1', false);
    const opts = { input, pdf: false, jobs: 1, percentilesPct: [10, 50, 90], thresholds: [15] } as const;
    const full = await runAnalyze({ ...opts, outDir: mkdtempSync(path.join(tmpdir(), 'spherecov-core-a-')) });
    const core = await runAnalyze({ ...opts, outDir: mkdtempSync(path.join(tmpdir(), 'spherecov-core-b-')), coreOnly: true });
    const [f, c] = [full.results.units[0], core.results.units[0]];
    expect(c.tsp).toEqual(f.tsp);
    expect(c.checks).toEqual(f.checks);
    expect(f.subset?.beams.length).toBeGreaterThan(0);
    expect(f.beams.every((b) => b.removal !== undefined)).toBe(true);
    expect(c.subset).toBeNull();
    expect(c.holes).toEqual([]);
    expect(c.beams.every((b) => b.removal === undefined)).toBe(true);
  });
});
