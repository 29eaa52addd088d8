import { describe, expect, it } from 'vitest';
import { frequencyToken, sanitizeStem, uniqueStems } from '../../src/batch/sanitize.js';

describe('sanitizeStem', () => {
  it.each([
    ['../../etc/passwd', 'etc_passwd'],
    ['/abs/path', 'abs_path'],
    ['C:\\Windows\\x', 'C_Windows_x'],
    ['CON', 'unit_CON'],
    ['lpt1', 'unit_lpt1'],
    ['nul.txt', 'unit_nul.txt'],
    ['summary', 'unit_summary'],
    ['results', 'unit_results'],
    ['..', 'unit'],
    ['', 'unit'],
    ['=1+2', '1_2'],
    ['-U-05', 'U-05'],
    ['PX 01 ünit', 'PX_01_unit'],
    ['PX-01', 'PX-01'],
  ])('%j → %j', (name, stem) => {
    const s = sanitizeStem(name);
    expect(s).toBe(stem);
    expect(s).toMatch(/^[A-Za-z0-9][A-Za-z0-9._-]*$/);
    expect(s.includes('..')).toBe(false);
  });

  it('caps the length', () => {
    expect(sanitizeStem('x'.repeat(500)).length).toBeLessThanOrEqual(80);
  });

  it('keeps clashing names apart, case-insensitively, in the given order', () => {
    expect(uniqueStems(['a/b', 'a_b', 'A_B', 'c'])).toEqual(['a_b', 'a_b-2', 'A_B-3', 'c']);
  });

  it('writes frequency tokens', () => {
    expect(frequencyToken(28e9)).toBe('28GHz');
    expect(frequencyToken(28.5e9)).toBe('28.5GHz');
    expect(frequencyToken(900e6)).toBe('900MHz');
  });
});
