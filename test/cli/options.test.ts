import { describe, expect, it } from 'vitest';
import { OPTIONS, joinNegativeValues, renderOptionsTable, flagText } from '../../src/cli/options.js';
import { parseIsoDate, parseJobs, parseNumberList, parsePercentiles, UsageError } from '../../src/cli/parse.js';
import { exitCode } from '../../src/cli/exitCode.js';

describe('options as data', () => {
  it('declares every CONTRACT.md analyze option', () => {
    const flags = OPTIONS.map(flagText).join(' ');
    for (const f of ['--out', '--percentiles', '--coverage-thresholds', '--limits', '--quantity', '--no-pdf', '--jobs']) {
      expect(flags).toContain(f);
    }
  });

  it('renders one table row per option', () => {
    const table = renderOptionsTable();
    expect(table.trim().split('\n')).toHaveLength(OPTIONS.length + 2);
    expect(table).toContain('`--coverage-thresholds <list>`');
  });
});

describe('negative option values', () => {
  it('joins a dash-leading number to its option', () => {
    expect(joinNegativeValues(['analyze', 'x', '--coverage-thresholds', '-88,-85'])).toEqual(['analyze', 'x', '--coverage-thresholds=-88,-85']);
    expect(joinNegativeValues(['--relative-db', '-.5'])).toEqual(['--relative-db=-.5']);
    expect(joinNegativeValues(['--coverage-thresholds=-88,-85'])).toEqual(['--coverage-thresholds=-88,-85']);
  });

  it('leaves switches and option-like tokens alone', () => {
    expect(joinNegativeValues(['--quiet', '-5'])).toEqual(['--quiet', '-5']);
    expect(joinNegativeValues(['--out', '-q'])).toEqual(['--out', '-q']);
    expect(joinNegativeValues(['--', '--jobs', '-1'])).toEqual(['--', '--jobs', '-1']);
  });
});

describe('value parsing', () => {
  it('parses number lists, negative ones too', () => {
    expect(parseNumberList('-88,-85', 'coverage-thresholds')).toEqual([-88, -85]);
    expect(parseNumberList(' 10 , 12.5', 'x')).toEqual([10, 12.5]);
    expect(() => parseNumberList('10,,12', 'x')).toThrow(UsageError);
    expect(() => parseNumberList('ten', 'x')).toThrow("--x: found 'ten', expected a number");
  });

  it('checks percentile levels, jobs and dates', () => {
    expect(() => parsePercentiles('50,101')).toThrow(/between 0 and 100/);
    expect(parseJobs('2')).toBe(2);
    expect(() => parseJobs('0')).toThrow(UsageError);
    expect(() => parseJobs('1.5')).toThrow(UsageError);
    expect(parseIsoDate('2025-01-31')).toBe('2025-01-31T00:00:00.000Z');
    expect(parseIsoDate('2025-01-31T12:00:00Z')).toBe('2025-01-31T12:00:00.000Z');
    expect(() => parseIsoDate('yesterday')).toThrow(UsageError);
  });
});

describe('exitCode (CONTRACT.md "Exit")', () => {
  const unit = (verdict: 'pass' | 'fail' | 'none') => ({ verdict }) as never;
  it('0 / 1 / 2', () => {
    expect(exitCode({ units: [unit('pass'), unit('none')], errors: [] })).toBe(0);
    expect(exitCode({ units: [unit('pass'), unit('fail')], errors: [] })).toBe(1);
    expect(exitCode({ units: [unit('pass')], errors: [{ file: 'a.csv', message: 'x' }] })).toBe(2);
    expect(exitCode({ units: [unit('fail')], errors: [{ file: 'a.csv', message: 'x' }] })).toBe(2);
  });

  it('--fail-on adds conditions that give 1, never hiding an unreadable input (2)', () => {
    const u = (verdict: 'pass' | 'none', fullSphere = true, warnings: string[] = []) => ({ verdict, grid: { fullSphere }, warnings }) as never;
    expect(exitCode({ units: [u('none')], errors: [] }, ['not-judged'])).toBe(1);
    expect(exitCode({ units: [u('pass', false)], errors: [] }, ['not-judged'])).toBe(0);
    expect(exitCode({ units: [u('pass', false)], errors: [] }, ['partial-sphere'])).toBe(1);
    expect(exitCode({ units: [u('pass', true, ['w'])], errors: [] }, ['warnings'])).toBe(1);
    expect(exitCode({ units: [u('pass', true, ['w'])], errors: [] }, ['not-judged', 'partial-sphere'])).toBe(0);
    expect(exitCode({ units: [u('none')], errors: [{ file: 'a.csv', message: 'x' }] }, ['not-judged'])).toBe(2);
  });
});
