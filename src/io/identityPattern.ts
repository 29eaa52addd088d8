/**
 * Job-file identity patterns (`identity.unit`, `identity.beam`, `identity.frequency_ghz`) run on
 * the RE2 engine (re2js), whose matching time is linear in the length of the path: a pattern
 * such as `^(a+)+$` cannot make a run hang on a long folder name, as it can with a backtracking
 * engine. RE2 refuses the few constructs that need backtracking (back-references like `\1`,
 * look-around like `(?=…)` / `(?<=…)`); such a pattern is a job-file error with its key path.
 * The syntax is otherwise the familiar one (classes, groups, `\d`, `\s`, anchors, `(?i)`).
 */
import type { RE2JS } from 're2js';
import { lazyPackage } from '../lazyPackage.js';

/** re2js loads with the first job file that names a pattern (src/lazyPackage.ts). */
const re2js = lazyPackage<typeof import('re2js')>('re2js');
const compiled = new Map<string, RE2JS>();

/**
 * Why RE2 refuses `pattern`, or null when it compiles.
 * @example identityPatternProblem('(a)\\1') // "invalid escape sequence: `\\1`"
 */
export function identityPatternProblem(pattern: string): string | null {
  try {
    compile(pattern);
    return null;
  } catch (e) {
    return (e as Error).message.replace(/^error parsing regexp: /, '');
  }
}

function compile(pattern: string): RE2JS {
  let re = compiled.get(pattern);
  if (!re) {
    re = re2js().RE2JS.compile(pattern);
    compiled.set(pattern, re);
  }
  return re;
}

/**
 * The first capture group of `pattern` in `text` (the whole match when the pattern has no
 * group), trimmed; null when it does not match or captures only blanks.
 * Cost: O(pattern length × text length) at worst (RE2's guarantee), no backtracking.
 * @throws the engine's syntax error for a pattern identityPatternProblem refuses
 * @example identityCapture('(?:^|/)(PX-\\d+)', 'b/PX-01/x.csv') === 'PX-01'
 */
export function identityCapture(pattern: string, text: string): string | null {
  const m = compile(pattern).matcher(text);
  if (!m.find()) return null;
  const g = m.groupCount() >= 1 ? m.group(1) : m.group(0);
  return (g ?? m.group(0) ?? '').trim() || null;
}
