import { describe, expect, it } from 'vitest';
import { WARNINGS, warning } from '../src/warnings.js';

describe('warning catalogue', () => {
  it('every code has a title and a remedy', () => {
    for (const [code, info] of Object.entries(WARNINGS)) {
      expect(info.title.length, code).toBeGreaterThan(3);
      expect(info.remedy.length, code).toBeGreaterThan(3);
    }
  });
  it('builds a typed warning with its location', () => {
    expect(warning('beam-resampled', 'beam 3', { file: 'a.csv', line: 2 })).toEqual({
      code: 'beam-resampled', message: 'beam 3', file: 'a.csv', line: 2,
    });
  });
});
