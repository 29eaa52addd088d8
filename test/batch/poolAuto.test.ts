// The default --jobs ('auto') starts workers only when the work left outweighs their start-up.
import { describe, expect, it } from 'vitest';
import { coreToSpare, workersPayOff } from '../../src/batch/pool.js';
import { parseJobs } from '../../src/cli/parse.js';

describe("--jobs 'auto'", () => {
  it('keeps a small build on the main thread and starts workers for a long one', () => {
    // 20 units of 25 ms left: 0.5 s of work, less than three times a 0.55 s start-up.
    expect(workersPayOff(20, 25, 550)).toBe(false);
    // 100 units of 150 ms with PDFs: 15 s of work against 3 × 1.85 s.
    expect(workersPayOff(100, 150, 1850)).toBe(true);
    // The boundary: exactly three times the start-up is not enough (strictly more is).
    expect(workersPayOff(33, 50, 550)).toBe(false);
    expect(workersPayOff(34, 50, 550)).toBe(true);
    expect(workersPayOff(0, 1e6, 550)).toBe(false);
  });

  it('starts no worker while other processes keep every core busy', () => {
    // 1-minute load average against the core count: below it a core is idle part of the time.
    expect(coreToSpare(0.3, 2)).toBe(true);
    expect(coreToSpare(1.9, 2)).toBe(true);
    expect(coreToSpare(2, 2)).toBe(false);
    expect(coreToSpare(11, 2)).toBe(false);
    // Platforms without a load average report 0.
    expect(coreToSpare(0, 2)).toBe(true);
  });

  it('is the word auto or a whole number on the command line', () => {
    expect(parseJobs('auto')).toBe('auto');
    expect(parseJobs('3')).toBe(3);
    expect(() => parseJobs('0')).toThrow(/at least 1, or 'auto'/);
  });
});
