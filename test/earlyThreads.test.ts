import { mkdirSync, mkdtempSync, rmSync, truncateSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { earlyPlan, EARLY_SCAN_ENTRIES } from '../src/earlyThreads.js';
import { PARALLEL_MIN_BYTES } from '../src/io/readInParallel.js';
import { LANE_MIN_BYTES } from '../src/batch/insightLane.js';

// Which worker threads bin/spherecov.js starts before the CLI loads: a guess from the command
// line and file sizes (sparse files: the size counts, nothing is written).
const dir = mkdtempSync(path.join(tmpdir(), 'spherecov-early-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function sized(rel: string, bytes: number): string {
  const p = path.join(dir, rel);
  mkdirSync(path.dirname(p), { recursive: true });
  writeFileSync(p, '');
  truncateSync(p, bytes);
  return p;
}

describe('earlyPlan', () => {
  const big = sized('big/u1/pattern.csv', PARALLEL_MIN_BYTES);
  const mid = sized('mid/pattern.csv', LANE_MIN_BYTES);
  const small = sized('small/pattern.csv', LANE_MIN_BYTES - 1);

  it('a large file (given, or two folder levels down) starts both; a mid-size one the lane only', async () => {
    expect(await earlyPlan(['analyze', big])).toEqual({ range: true, lane: true });
    expect(await earlyPlan(['analyze', path.join(dir, 'big'), '--out', path.join(dir, 'out')])).toEqual({ range: true, lane: true });
    expect(await earlyPlan(['analyze', '--no-pdf', mid])).toEqual({ range: false, lane: true });
    expect(await earlyPlan(['analyze', small])).toEqual({ range: false, lane: false });
  });

  it('none for other commands, --jobs 1, a missing path; no lane with --core-only', async () => {
    expect(await earlyPlan(['inspect', big])).toEqual({ range: false, lane: false });
    expect(await earlyPlan(['analyze', big, '--jobs', '1'])).toEqual({ range: false, lane: false });
    expect(await earlyPlan(['analyze', big, '--jobs=1'])).toEqual({ range: false, lane: false });
    expect(await earlyPlan(['analyze', '-j', '1', big])).toEqual({ range: false, lane: false });
    expect(await earlyPlan(['analyze', big, '-j1'])).toEqual({ range: false, lane: false });
    expect(await earlyPlan(['analyze', big, '-j', '2'])).toEqual({ range: true, lane: true });
    expect(await earlyPlan(['analyze', path.join(dir, 'nowhere')])).toEqual({ range: false, lane: false });
    expect(await earlyPlan(['analyze', big, '--core-only'])).toEqual({ range: true, lane: false });
  });

  it('looks at no more than EARLY_SCAN_ENTRIES paths', async () => {
    const many = path.join(dir, 'many');
    for (let i = 0; i < EARLY_SCAN_ENTRIES + 5; i++) sized(`many/f${String(i).padStart(5, '0')}.csv`, 1);
    sized('many/zzzz-last.csv', PARALLEL_MIN_BYTES);
    expect((await earlyPlan(['analyze', many])).range).toBe(false);
  });
});
