import { availableParallelism } from 'node:os';
import { describe, expect, it } from 'vitest';
import { readThreads } from '../../src/batch/analyzePlan.js';
import { coresFreeOfOthers } from '../../src/batch/pool.js';

// How many threads one file read may use (issue 18): a second one only where it cannot compete
// with the pool's lanes or with other processes.
describe('readThreads', () => {
  const cores = availableParallelism();
  it('is 1 with --jobs 1, whatever the machine', () => {
    expect(readThreads(1, 1, 8)).toBe(1);
  });
  it('is 1 when the groups fill the cores (the pool uses them) or no core was idle', () => {
    expect(readThreads('auto', cores, 8)).toBe(1);
    expect(readThreads('auto', 1, 0.2)).toBe(1);
    expect(readThreads(2, 1, 0)).toBe(1);
  });
  it('is 2 for one group on a machine with an idle core (when it has two cores)', () => {
    expect(readThreads('auto', 1, 1)).toBe(cores >= 2 ? 2 : 1);
    expect(readThreads(2, 1, 1)).toBe(cores >= 2 ? 2 : 1);
  });
});

// The spare core is judged on what other processes leave free (coresFreeOfOthers): this run's
// own CPU (its main thread and V8's background threads) does not count against it.
describe('coresFreeOfOthers', () => {
  const at = (idleMs: number, totalMs: number) => ({ idleMs, totalMs });
  it('a quiet 2-core machine where this run keeps 1.3 cores busy: one core free of others', () => {
    // 200 ms window on 2 cores = 400 core-ms; 140 idle (0.7 core); this process used 260 ms (1.3 cores).
    expect(coresFreeOfOthers(at(0, 0), at(140, 400), 0, 260, 2)).toBeCloseTo(1, 12);
  });
  it('another process holding a whole core: nothing free, whatever this run uses', () => {
    expect(coresFreeOfOthers(at(0, 0), at(0, 400), 0, 200, 2)).toBeCloseTo(0, 12);
  });
  it('no time passed: as idle CPU alone would say (cores − 1)', () => {
    expect(coresFreeOfOthers(at(5, 10), at(5, 10), 0, 0, 2)).toBe(1);
  });
});
