import { describe, expect, it } from 'vitest';
import { collapseWarnings } from '../../src/batch/collapseWarnings.js';
import type { Warning } from '../../src/types.js';

const w = (code: Warning['code'], file: string, message = 'm'): Warning => ({ code, message, file });

describe('collapseWarnings', () => {
  it('keeps codes seen once or twice as they are', () => {
    const list = [w('beam-resampled', 'a.csv'), w('beam-resampled', 'b.csv'), w('partial-sphere', 'a.csv')];
    expect(collapseWarnings(list)).toEqual(list);
  });
  it('folds three or more of one code into the first, with the count of the others', () => {
    const list = [w('identity-from-path', 'a.csv', 'unit from folder'), w('partial-sphere', 'x.csv'),
      w('identity-from-path', 'b.csv'), w('identity-from-path', 'c.csv')];
    expect(collapseWarnings(list)).toEqual([
      { code: 'identity-from-path', file: 'a.csv', message: 'unit from folder (and alike in 2 more places, 2 files)' },
      w('partial-sphere', 'x.csv'),
    ]);
  });
});
