import { inSaneRange, type SaneRange } from '../io/saneRange.js';
import { FAIL_ON_CONDITIONS, type FailOnCondition } from '../batch/exitCode.js';

/**
 * Option value parsing: plain-words UsageError on bad values, never a stack trace.
 */

/** A problem with the command line; the CLI prints the message and exits with code 2. */
export class UsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'UsageError';
  }
}

/**
 * Parse a comma-separated list of finite numbers (`-88,-85`, `10, 12.5`), each inside `range`
 * when one is given (io/saneRange.ts).
 * @throws UsageError naming the option and the offending item.
 */
export function parseNumberList(text: string, option: string, range?: SaneRange): number[] {
  const items = text.split(',').map((s) => s.trim());
  if (items.length === 0 || items.every((s) => s === '')) {
    throw new UsageError(`--${option}: found '${text}', expected a comma-separated list of numbers`);
  }
  return items.map((s) => {
    const v = s === '' ? NaN : Number(s);
    if (!Number.isFinite(v)) {
      throw new UsageError(`--${option}: found '${s}', expected a number in a comma-separated list (e.g. --${option} 10,12.5)`);
    }
    if (range && !inSaneRange(v, range)) throw new UsageError(`--${option}: found '${s}', expected ${range.expected}`);
    return v;
  });
}

/** Percentile levels: numbers in [0, 100]. */
export function parsePercentiles(text: string): number[] {
  const list = parseNumberList(text, 'percentiles');
  for (const p of list) {
    if (p < 0 || p > 100) throw new UsageError(`--percentiles: found '${p}', expected a level between 0 and 100 %`);
  }
  return list;
}

/** --fail-on: a comma list of the gate conditions. */
export function parseFailOn(text: string): FailOnCondition[] {
  const items = text.split(',').map((s) => s.trim()).filter((s) => s !== '');
  if (items.length === 0) throw new UsageError(`--fail-on: found '${text}', expected a comma list of ${FAIL_ON_CONDITIONS.join(', ')}`);
  for (const i of items) {
    if (!(FAIL_ON_CONDITIONS as readonly string[]).includes(i)) {
      throw new UsageError(`--fail-on: found '${i}', expected one of ${FAIL_ON_CONDITIONS.join(', ')}`);
    }
  }
  return [...new Set(items)] as FailOnCondition[];
}

/** Worker count: a whole number ≥ 1. */
export function parseJobs(text: string): number | 'auto' {
  if (text.trim().toLowerCase() === 'auto') return 'auto';
  const n = Number(text);
  if (!/^\s*\d+\s*$/.test(text) || !Number.isInteger(n) || n < 1) {
    throw new UsageError(`--jobs: found '${text}', expected a whole number of at least 1, or 'auto'`);
  }
  return n;
}

/** An ISO 8601 date or date-time, normalized to `toISOString()` form. */
export function parseIsoDate(text: string): string {
  const ok = /^\d{4}-\d{2}-\d{2}([T ]\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:?\d{2})?)?$/.test(text.trim());
  const t = Date.parse(text);
  if (!ok || !Number.isFinite(t)) {
    throw new UsageError(`--creation-date: found '${text}', expected an ISO 8601 date such as 2025-01-31T12:00:00Z`);
  }
  return new Date(t).toISOString();
}
