import { availableParallelism } from 'node:os';
import { describe, expect, it } from 'vitest';
import { readThreads } from '../../src/batch/analyzePlan.js';

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
