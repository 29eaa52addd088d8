import { describe, expect, it } from 'vitest';
import { clock, progressText, Progress } from '../../src/batch/progress.js';

describe('progress line', () => {
  it('formats elapsed and ETA from the mean time per unit', () => {
    expect(clock(0)).toBe('0:00');
    expect(clock(75)).toBe('1:15');
    expect(clock(3725)).toBe('1:02:05');
    expect(progressText(0, 10, 'PX-01', 0)).toBe('[0/10] PX-01  elapsed 0:00  ETA –');
    // 3 done in 30 s → 10 s each → 7 left → 70 s.
    expect(progressText(3, 10, 'PX-04', 30)).toBe('[3/10] PX-04  elapsed 0:30  ETA 1:10');
  });

  it('draws nothing without a writer (not a terminal, or --quiet)', () => {
    const p = new Progress(2, null);
    p.start('a');
    p.finish();
    p.clear();
    expect(p.count).toBe(1);
  });

  it('redraws in place on a terminal', () => {
    const out: string[] = [];
    const p = new Progress(2, (s) => out.push(s));
    p.start('PX-01');
    p.finish();
    p.clear();
    expect(out[0]).toMatch(/^\r\x1b\[2K\[0\/2\] PX-01/);
    expect(out[1]).toMatch(/^\r\x1b\[2K\[1\/2\] PX-01/);
    expect(out[2]).toBe('\r\x1b[2K');
  });
});
