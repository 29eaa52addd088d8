/**
 * Issue 8, property 4: a large export is analyzed with peak memory bounded by the numeric arrays,
 * not by the text. The file carries a wide ignored text column, so its text is ~8× its numbers:
 * a reader that held the text (as a Buffer or a string) would exceed the bound below, one that
 * streams stays near the float64 arrays. Peak RSS of the whole CLI process (all threads) comes
 * from a preload (rssPreload.mjs), compared with the same CLI on a tiny input. CI size ~60 MB;
 * `npm run soak` uses ~1 GB. The refusal of a file over the sample limit is tested on the reader
 * in readerRegressions.test.ts (the limit is 10⁸ samples, too big to generate in CI).
 */
import { mkdirSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROOT, ensureBuilt } from '../cli/buildOnce.js';
import { writeBigExport } from './bigExport.js';
import { BIN, DATE, tmp } from './cliHarness.js';
import { spawnSync } from 'node:child_process';
import { recordFigure, SOAK } from './figures.js';
import type { ResultsFile } from '../../src/types.js';

const PRELOAD = path.join(ROOT, 'test', 'reliability', 'rssPreload.mjs');
// CI: 16 beams on a 1° grid with a 120-character note: ~1.04 M rows, ~140 MB of text, 8 MB of values.
// Soak: 64 beams on a 0.5° grid with a 40-character note: ~16.6 M rows, ~1 GB of text, 127 MiB of values.
const SIZE = SOAK ? { beams: 64, stepDeg: 0.5, note: 40 } : { beams: 16, stepDeg: 1, note: 120 };

const dir = tmp('huge');
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function peakRssKiB(input: string, out: string, extra: string[]): { kib: number; code: number | null; stderr: string; ms: number } {
  const rssFile = path.join(dir, `rss-${Date.now()}.txt`);
  const t0 = Date.now();
  const r = spawnSync(process.execPath, ['--import', PRELOAD, BIN, 'analyze', input, '--out', out, '--creation-date', DATE, '--quiet', ...extra], {
    cwd: ROOT, encoding: 'utf8', env: { ...process.env, SPHERECOV_RSS_FILE: rssFile },
  });
  return { kib: Number(readFileSync(rssFile, 'utf8')), code: r.status, stderr: r.stderr, ms: Date.now() - t0 };
}

let big: { rows: number; bytes: number };
const input = path.join(dir, 'in');
beforeAll(async () => {
  ensureBuilt();
  mkdirSync(path.join(input, 'U-BIG'), { recursive: true });
  big = await writeBigExport(path.join(input, 'U-BIG', 'all_beams_28GHz.csv'), SIZE.beams, SIZE.stepDeg, SIZE.note);
}, 600_000);

describe('huge export', () => {
  it('is analyzed with peak memory bounded by its numeric arrays, not its text', () => {
    const base = peakRssKiB(path.join(ROOT, 'fixtures', 'cli', 'pass'), path.join(dir, 'out-small'), ['--no-pdf', '--jobs', '1']);
    expect(base.code).toBe(0);
    const r = peakRssKiB(input, path.join(dir, 'out-big'), ['--no-pdf', '--jobs', '1']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const results = JSON.parse(readFileSync(path.join(dir, 'out-big', 'results.json'), 'utf8')) as ResultsFile;
    expect(results.units).toHaveLength(1);
    expect(results.units[0].beams).toHaveLength(SIZE.beams);

    const numericMiB = (big.rows * 8) / 2 ** 20; // one float64 value a sample (angles shared by the beams)
    const textMiB = big.bytes / 2 ** 20;
    const extraMiB = (r.kib - base.kib) / 1024;
    recordFigure(SOAK ? 'huge.soak' : 'huge.ci', {
      fileMiB: +textMiB.toFixed(1), rows: big.rows, numericMiB: +numericMiB.toFixed(1), peakRssMiB: +(r.kib / 1024).toFixed(1),
      baselineRssMiB: +(base.kib / 1024).toFixed(1), extraMiB: +extraMiB.toFixed(1), seconds: +(r.ms / 1000).toFixed(1),
    });
    // Bounded by the numbers: a few copies of the value arrays (growth doubling, TSP, CDF sort) plus slack.
    expect(extraMiB).toBeLessThan(6 * numericMiB + 48);
    // And clearly not by the text.
    expect(extraMiB).toBeLessThan(0.4 * textMiB);
  }, 600_000);
});
