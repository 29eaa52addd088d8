import type { z } from 'zod';
import type { InputError } from '../types.js';
import { clipText } from '../io/inputError.js';
import type { KeyPath, Locate } from './yamlSource.js';

/** 'checks[2].limit' from ['checks', 2, 'limit']. */
export function formatKeyPath(path: readonly PropertyKey[]): string {
  return path.map((k, i) => (typeof k === 'number' ? `[${k}]` : i === 0 ? String(k) : `.${String(k)}`)).join('');
}

/** Stands for "the key itself is wrong" (an unknown key): the message points at the key. */
export const UNKNOWN_KEY = Symbol('unknown key');

/** How a found value is shown: clipped (a file that is not a configuration at all is never echoed whole). */
export function describeFound(v: unknown): string {
  if (v === UNKNOWN_KEY) return 'an unknown key';
  if (v === undefined) return 'nothing';
  if (v === null) return "'null'";
  if (Array.isArray(v)) return 'a list';
  if (typeof v === 'object') return 'a mapping';
  return `'${clipText(String(v))}'`;
}

/**
 * One configuration problem as the project's InputError:
 * `<file>:<line>:<col>: <key path>: found '<text>', expected <what>` (the position is left out
 * when the data did not come from a file, e.g. settings built in code).
 */
export function configError(file: string, locate: Locate, path: KeyPath, found: unknown, expected: string, atKey = false): InputError {
  const key = formatKeyPath(path);
  const pos = locate(path, atKey || found === UNKNOWN_KEY);
  const where = pos ? `${file}:${pos.line}:${pos.column}` : file;
  return {
    file, ...(pos ? { line: pos.line, column: pos.column } : {}), columnName: key,
    message: `${where}: ${key || '(top level)'}: found ${describeFound(found)}, expected ${expected}`,
  };
}

/** Edit distance (Levenshtein), for naming the closest known key. */
function distance(a: string, b: string): number {
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const cur = [i];
    for (let j = 1; j <= b.length; j++) cur[j] = Math.min(prev[j] + 1, cur[j - 1] + 1, prev[j - 1] + (a[i - 1] === b[j - 1] ? 0 : 1));
    prev = cur;
  }
  return prev[b.length];
}

/**
 * What an unknown key should have been: the closest known key (smallest edit distance, case and
 * `_`/`-` ignored; the first listed on a tie) and the list of keys known there; the list first
 * when no known key is close (more than half the letters, and more than 2, differ).
 * @example unknownKeyExpected('tolerance', ['kind', 'tolerance_db']) // "tolerance_db (the closest known key; known here: kind, tolerance_db)"
 */
export function unknownKeyExpected(key: string, known: readonly string[]): string {
  if (known.length === 0) return 'no key here';
  const norm = (s: string) => s.toLowerCase().replace(/[_-]/g, '');
  let best = known[0];
  let bestD = Infinity;
  for (const k of known) {
    const d = distance(norm(key), norm(k));
    if (d < bestD) [best, bestD] = [k, d];
  }
  // A key far from every known one (more than half its letters differ) is no typo of one: the list first.
  if (bestD > Math.max(2, Math.floor(norm(key).length / 2))) return `one of the keys known here: ${known.join(', ')} (the closest is ${best})`;
  return `${best} (the closest known key; known here: ${known.join(', ')})`;
}

/** The value at a key path of plain data (undefined when the path does not exist). */
export function valueAt(data: unknown, path: readonly PropertyKey[]): unknown {
  let v = data;
  for (const k of path) {
    if (v === null || typeof v !== 'object') return undefined;
    v = (v as Record<PropertyKey, unknown>)[k];
  }
  return v;
}

const TYPE_WORDS: Record<string, string> = {
  number: 'a number', string: 'a text', array: 'a list', object: 'a mapping of keys to values', boolean: 'true or false',
  int: 'a whole number', null: 'null',
};

/**
 * The "expected …" words for a zod issue raised by a schema that set no message of its own (the
 * schemas in src/config set their own for every field a user writes; this is the safety net).
 */
export function fallbackExpected(issue: z.core.$ZodRawIssue): string {
  switch (issue.code) {
    case 'invalid_type': return TYPE_WORDS[issue.expected] ?? `a ${issue.expected}`;
    case 'invalid_value': return `one of ${issue.values.map(String).join(', ')}`;
    case 'too_small': return issue.origin === 'array' ? `a list of at least ${issue.minimum} entries` : issue.origin === 'string' ? 'a non-empty text' : `a number of at least ${issue.minimum}`;
    case 'too_big': return issue.origin === 'array' ? `a list of at most ${issue.maximum} entries` : `a number of at most ${issue.maximum}`;
    case 'invalid_union': return 'one of the forms this key takes';
    default: return 'a valid value';
  }
}
