// The insight lane (src/batch/insightLane.ts): the optional analysis of a large unit on a second
// thread gives the same answer as on the main thread, falls back when the worker fails, and a run
// with a spare thread writes the same results.json as --jobs 1. The worker is the compiled one
// (dist/), as the CLI runs it: from TypeScript sources the lane never starts.
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ensureBuilt, ROOT } from '../cli/buildOnce.js';
import { writeBigExport } from '../reliability/bigExport.js';
import { computeInsights, type InsightRequest } from '../../src/batch/insights.js';
import { LANE_MIN_BYTES, LANE_MIN_WORK } from '../../src/batch/insightLane.js';
import { fullGrid, gaussianBeam } from '../analysis/fixtures.js';
import { packBeams } from '../../src/report/viewerPack.js';

type LaneModule = typeof import('../../src/batch/insightLane.js');

const dir = mkdtempSync(path.join(tmpdir(), 'spherecov-lane-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

let compiled: LaneModule;
const bigFile = path.join(dir, 'in', 'U-LANE', 'all_beams_28GHz.csv');
beforeAll(async () => {
  ensureBuilt();
  compiled = (await import(pathToFileURL(path.join(ROOT, 'dist', 'batch', 'insightLane.js')).href)) as LaneModule;
  mkdirSync(path.dirname(bigFile), { recursive: true });
  // 16 beams on a 1° grid: 16 × 64,442 samples, over LANE_MIN_WORK; about 20 MB, over LANE_MIN_BYTES.
  await writeBigExport(bigFile, 16, 1);
}, 300_000);

/** A codebook of smooth beams on a 5° grid (2,594 points), with a hole-making threshold. */
function request(): InsightRequest {
  const grid = fullGrid(5);
  const beams = Array.from({ length: 12 }, (_, k) => gaussianBeam(grid, 15 * k, 30 * k, 40, 20));
  return { grid, beams, ids: beams.map((_, k) => `B${k}`), quantity: 'eirp', levelPct: 50, threshold: 12 };
}

describe('InsightLane (compiled worker)', () => {
  it('answers what computeInsights gives on the main thread', async () => {
    const lane = compiled.InsightLane.open(1, [bigFile]);
    expect(lane).not.toBeNull();
    const q = request();
    const want = computeInsights(q);
    expect(want.holes.length).toBeGreaterThan(0); // the case exercises every part
    expect(await lane?.request(q).insights).toEqual(want);
    expect(await lane?.request({ ...q, levelPct: 90, threshold: null }).insights).toEqual(computeInsights({ ...q, levelPct: 90, threshold: null }));
    lane?.close();
  });

  it('packs the beams for the viewer as this thread does, after the insights, when asked', async () => {
    const lane = compiled.InsightLane.open(1, [bigFile]);
    const q = request();
    const answer = lane?.request(q, { pack: true });
    expect(await answer?.insights).toEqual(computeInsights(q));
    const packed = await answer?.pack;
    expect(packed).not.toBeNull();
    expect(packed).toEqual(packBeams(q.grid, q.beams));
    expect(await lane?.request(q).pack).toBeNull(); // not asked for
    lane?.close();
    expect(await lane?.request(q, { pack: true }).pack).toBeNull(); // a closed lane: packed on the main thread
  });

  it('gives null (the caller computes here) when the worker fails or is closed', async () => {
    const lane = compiled.InsightLane.open(1, [bigFile]);
    const q = request();
    expect(await lane?.request({ ...q, ids: q.ids.slice(1) }).insights).toBeNull(); // findHoles throws in the worker
    lane?.close();
    expect(await lane?.request(q).insights).toBeNull();
  });

  it('is not started without a spare thread or for small files', () => {
    expect(compiled.InsightLane.open(0, [bigFile])).toBeNull();
    expect(compiled.InsightLane.open(undefined, [bigFile])).toBeNull();
    expect(compiled.InsightLane.open(1, [path.join(ROOT, 'fixtures', 'io', 'long.csv')])).toBeNull();
    expect(LANE_MIN_BYTES).toBeGreaterThan(0);
    expect(compiled.InsightLane.worthIt({ beams: new Array(16).fill(new Float64Array(0)), grid: { weightSr: new Float64Array(LANE_MIN_WORK / 16) } as never })).toBe(true);
    expect(compiled.InsightLane.worthIt({ beams: new Array(16).fill(new Float64Array(0)), grid: { weightSr: new Float64Array(LANE_MIN_WORK / 16 - 1) } as never })).toBe(false);
  });
});

describe('analyze with a spare thread', () => {
  const run = (jobs: string, pdf: boolean) => {
    const out = path.join(dir, `out-${jobs}-${pdf ? 'pdf' : 'nopdf'}`);
    const r = spawnSync(process.execPath, [path.join(ROOT, 'bin', 'spherecov.js'), 'analyze', path.join(dir, 'in'), '--out', out,
      ...(pdf ? [] : ['--no-pdf']), '--quiet', '--jobs', jobs, '--coverage-thresholds', '24,10', '--creation-date', '2026-01-01T00:00:00Z'], { cwd: ROOT, encoding: 'utf8' });
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    return out;
  };

  it('writes the same results.json as --jobs 1', () => {
    const one = readFileSync(path.join(run('1', false), 'results.json'), 'utf8');
    expect(JSON.parse(one).units[0].holes.length).toBeGreaterThan(0);
    expect(readFileSync(path.join(run('2', false), 'results.json'), 'utf8')).toBe(one);
  }, 120_000);

  it('writes the same viewer.html as --jobs 1 (the lane packs the beams)', () => {
    const one = readFileSync(path.join(run('1', true), 'viewer.html'), 'utf8');
    expect(readFileSync(path.join(run('2', true), 'viewer.html'), 'utf8')).toBe(one);
  }, 180_000);
});
