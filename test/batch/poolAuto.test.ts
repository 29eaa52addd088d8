// The default --jobs ('auto') starts workers only when the work left outweighs their start-up.
import { describe, expect, it } from 'vitest';
import { coreToSpare, cpuIdleCores, workersPayOff, workersPayOffAtStart } from '../../src/batch/pool.js';
import { cpuTimes } from '../../src/cpuClock.js';
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

  it('starts workers before any task only for a long build with PDFs on a machine with a core to spare', () => {
    const quiet = { idleCores: 1, loadAvg1: 1.2, cores: 2 };
    // Floor of 130 ms a PDF: 43 × 130 = 5590 ms > 3 × 1850 ms; 42 × 130 = 5460 ms is not.
    expect(workersPayOffAtStart(43, true, 1850, quiet)).toBe(true);
    expect(workersPayOffAtStart(42, true, 1850, quiet)).toBe(false);
    // The 20-unit bench build with PDFs: a worker costs about 15 warm reports, so no worker up front.
    expect(workersPayOffAtStart(20, true, 1850, quiet)).toBe(false);
    // Without PDFs nothing is known of a task's cost before one has run: the decision waits.
    expect(workersPayOffAtStart(1000, false, 550, quiet)).toBe(false);
    // Every core busy since the run began, or too short a window to tell: no worker up front.
    expect(workersPayOffAtStart(100, true, 1850, { ...quiet, idleCores: 0.2 })).toBe(false);
    expect(workersPayOffAtStart(100, true, 1850, { ...quiet, idleCores: null })).toBe(false);
    // Idle during the planning but busy over the last minute (a gap in a neighbour's bursts): wait.
    expect(workersPayOffAtStart(100, true, 1850, { ...quiet, loadAvg1: 1.6 })).toBe(false);
    expect(workersPayOffAtStart(100, true, 1850, { ...quiet, loadAvg1: 1.5 })).toBe(true);
  });

  it('starts no worker while other processes keep every core busy', () => {
    // Idle CPU in cores over the decision window: at least half a core idle is a core to spare.
    expect(coreToSpare(1)).toBe(true);
    expect(coreToSpare(0.5)).toBe(true);
    expect(coreToSpare(0.49)).toBe(false);
    expect(coreToSpare(0)).toBe(false);
  });

  it('measures idle cores from two CPU-time readings', () => {
    // Hand-worked: 2 cores over 1 s = 2000 ms of CPU time; 1000 ms idle → one idle core.
    expect(cpuIdleCores({ idleMs: 500, totalMs: 4000 }, { idleMs: 1500, totalMs: 6000 }, 2)).toBe(1);
    // Both cores busy for the whole window: no idle time.
    expect(cpuIdleCores({ idleMs: 500, totalMs: 4000 }, { idleMs: 500, totalMs: 6000 }, 2)).toBe(0);
    // No time between the readings: assume the other cores are free (the old behaviour).
    expect(cpuIdleCores({ idleMs: 1, totalMs: 2 }, { idleMs: 1, totalMs: 2 }, 2)).toBe(1);
    // A real reading: totals only grow, and the idle share lies within 0..cores.
    const a = cpuTimes();
    const b = cpuTimes();
    expect(b.totalMs).toBeGreaterThanOrEqual(a.totalMs);
    const idle = cpuIdleCores(a, b, 2);
    expect(idle).toBeGreaterThanOrEqual(0);
    expect(idle).toBeLessThanOrEqual(2);
  });

  it('is the word auto or a whole number on the command line', () => {
    expect(parseJobs('auto')).toBe('auto');
    expect(parseJobs('3')).toBe(3);
    expect(() => parseJobs('0')).toThrow(/at least 1, or 'auto'/);
  });
});
