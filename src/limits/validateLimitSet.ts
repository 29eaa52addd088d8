import { clipText } from '../io/inputError.js';
import { LEVEL_RANGE } from '../io/saneRange.js';
import type { CheckKind, InputError, Quantity } from '../types.js';
import type { CheckDraft, LimitCheck, LimitSet } from './limitSet.js';
import { CHECK_KINDS, kindDef, type FieldReader } from './checkKinds.js';
import { defaultCheckName, kindAllowed } from './checkSense.js';
import { QUANTITIES } from '../quantity.js';
import { validateUncertainty } from '../analysis/uncertainty/uncertaintySpec.js';

/** Key path inside a parsed file, e.g. ['checks', 2, 'limit']. */
export type KeyPath = (string | number)[];
/** Maps a key path to its position in the source text (1-based), when known. */
export type Locate = (path: KeyPath, atKey?: boolean) => { line: number; column: number } | undefined;

/** Stands for "the key itself is wrong" in error messages (points at the key, not its value). */
export const UNKNOWN_KEY = Symbol('unknown key');

const TOP_KEYS = ['name', 'description', 'source', 'quantity', 'band', 'frequencyRangeMHz', 'checks', 'uncertainty'];
const COMMON_KEYS = ['kind', 'name', 'toleranceDb', 'source'];
/** 'checks[2].limit' from ['checks', 2, 'limit']. */
export function formatKeyPath(path: KeyPath): string {
  return path.map((k, i) => (typeof k === 'number' ? `[${k}]` : i === 0 ? k : `.${k}`)).join('');
}

function describeFound(v: unknown): string {
  if (v === UNKNOWN_KEY) return 'an unknown key';
  if (v === undefined) return 'nothing';
  if (v === null) return "'null'";
  if (Array.isArray(v)) return 'a list';
  if (typeof v === 'object') return 'a mapping';
  // Clipped: a file that is not a limit set at all (a password file, an environment dump) is
  // never echoed whole.
  return `'${clipText(String(v))}'`;
}

/**
 * Our own small schema checker for limit sets (parsed YAML/JSON → LimitSet). Strict: unknown
 * keys are errors, because a misspelt `toleranceDb` silently ignored would change a verdict.
 * Every error names the file and the key path, in the project's grammar:
 * `<file>:<line>:<col>: checks[2].limit: found 'abc', expected a number`.
 *
 * Cost O(keys). Never throws on bad input; returns errors instead.
 * @example validateLimitSet({ name: 'x', quantity: 'eirp', checks: [] }, 'x.yaml').errors // []
 */
export function validateLimitSet(raw: unknown, file: string, locate: Locate = () => undefined):
  { limitSet: LimitSet | null; errors: InputError[] } {
  const errors: InputError[] = [];
  const fail = errorSink(file, locate, errors);
  if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) {
    fail([], raw, 'a mapping with name, quantity and checks');
    return { limitSet: null, errors };
  }
  const top = raw as Record<string, unknown>;
  for (const k of Object.keys(top)) if (!TOP_KEYS.includes(k)) fail([k], UNKNOWN_KEY, `one of ${TOP_KEYS.join(', ')}`);
  const name = str(top, ['name'], true, fail);
  const description = str(top, ['description'], false, fail) ?? '';
  const source = str(top, ['source'], false, fail) ?? 'no source given';
  const band = str(top, ['band'], false, fail);
  const quantity = top.quantity as Quantity;
  if (!QUANTITIES.includes(quantity)) fail(['quantity'], top.quantity, 'one of eirp, eis, gain');
  let frequencyRangeMHz: [number, number] | undefined;
  if (top.frequencyRangeMHz !== undefined) {
    const r = top.frequencyRangeMHz;
    if (Array.isArray(r) && r.length === 2 && r.every(isNum) && r[0] < r[1]) frequencyRangeMHz = [r[0], r[1]];
    else fail(['frequencyRangeMHz'], r, 'a list [low, high] of two numbers in MHz, low < high');
  }
  const checks: LimitCheck[] = [];
  if (!Array.isArray(top.checks)) fail(['checks'], top.checks, 'a list of checks');
  else {
    const q = QUANTITIES.includes(quantity) ? quantity : 'eirp';
    checks.push(...validateChecks(top.checks, ['checks'], q, fail));
  }
  const uncertainty = top.uncertainty === undefined ? undefined : validateUncertainty(top.uncertainty, ['uncertainty'], fail);
  if (errors.length > 0 || name === undefined) return { limitSet: null, errors };
  const ls: LimitSet = { name, description, source, quantity, checks };
  if (uncertainty) ls.uncertainty = uncertainty;
  if (band !== undefined) ls.band = band;
  if (frequencyRangeMHz) ls.frequencyRangeMHz = frequencyRangeMHz;
  return { limitSet: ls, errors };
}

export type Fail = (path: KeyPath, found: unknown, expected: string) => void;

/** A `fail` callback that appends InputErrors in the project's grammar to `errors`. */
export function errorSink(file: string, locate: Locate, errors: InputError[]): Fail {
  return (path, found, expected) => {
    const key = formatKeyPath(path);
    const at = locate(path, found === UNKNOWN_KEY);
    errors.push({
      file, ...(at ? { line: at.line, column: at.column } : {}), columnName: key,
      message: `${key || '(top level)'}: found ${describeFound(found)}, expected ${expected}`,
    });
  };
}

/**
 * Validate a job file's extra (programme) checks, e.g. its `limits.extraChecks` list, for
 * mergeLimitSets. `basePath` is where the list sits in the job file, for the error key paths.
 * @example validateExtraChecks([{ kind: 'min-peak', limit: 24 }], 'job.yaml', 'eirp').errors // []
 */
export function validateExtraChecks(raw: unknown, file: string, quantity: Quantity,
  basePath: KeyPath = ['limits', 'extraChecks'], locate: Locate = () => undefined): { checks: LimitCheck[]; errors: InputError[] } {
  const errors: InputError[] = [];
  const fail = errorSink(file, locate, errors);
  if (!Array.isArray(raw)) {
    fail(basePath, raw, 'a list of checks');
    return { checks: [], errors };
  }
  const checks = validateChecks(raw, basePath, quantity, fail);
  return { checks: errors.length ? [] : checks, errors };
}

function isNum(v: unknown): v is number {
  return typeof v === 'number' && Number.isFinite(v);
}

function str(o: Record<string, unknown>, path: KeyPath, required: boolean, fail: Fail): string | undefined {
  const v = o[path[path.length - 1] as string];
  if (v === undefined && !required) return undefined;
  if (typeof v === 'string' && v.trim() !== '') return v;
  fail(path, v, 'a non-empty text');
  return undefined;
}

function num(o: Record<string, unknown>, path: KeyPath, fail: Fail, lo = -Infinity, hi = Infinity, what = 'a number'): number {
  const v = o[path[path.length - 1] as string];
  if (isNum(v) && v >= lo && v <= hi) return v;
  fail(path, v, what);
  return NaN;
}

/**
 * Validate a list of raw checks (also used for a job file's extra programme checks). Names
 * default from the kind; duplicates are errors. Returns the valid checks; errors go to `fail`.
 */
export function validateChecks(rawChecks: unknown[], base: KeyPath, quantity: Quantity, fail: Fail): LimitCheck[] {
  const out: LimitCheck[] = [];
  const seen = new Map<string, number>();
  rawChecks.forEach((rc, i) => {
    const p = [...base, i];
    if (rc === null || typeof rc !== 'object' || Array.isArray(rc)) return fail(p, rc, 'a check mapping with a kind');
    const c = rc as Record<string, unknown>;
    const kind = c.kind as CheckKind;
    if (!CHECK_KINDS.includes(kind)) return fail([...p, 'kind'], c.kind, `one of ${CHECK_KINDS.join(', ')}`);
    if (!kindAllowed(kind, quantity)) {
      const ok = CHECK_KINDS.filter((k) => kindAllowed(k, quantity)).join(', ');
      return fail([...p, 'kind'], kind, `a check kind that applies to ${quantity} (${ok})`);
    }
    const def = kindDef(kind);
    const allowed = [...COMMON_KEYS, ...def.keys];
    for (const k of Object.keys(c)) if (!allowed.includes(k)) fail([...p, k], UNKNOWN_KEY, `one of ${allowed.join(', ')} for kind ${kind}`);
    const before = out.length;
    const toleranceDb = c.toleranceDb === undefined ? 0
      : num(c, [...p, 'toleranceDb'], fail, 0, 30, 'a test tolerance in dB between 0 and 30');
    const common = { toleranceDb, ...(c.source !== undefined ? { source: str(c, [...p, 'source'], true, fail) } : {}) };
    const read: FieldReader = {
      // A number a kind leaves unbounded is a level (a limit, a threshold): finite and inside the
      // sane level range (io/saneRange.ts), so no limit can turn into ±Infinity downstream.
      num: (key, lo, hi, what) => num(c, [...p, key], fail, lo ?? LEVEL_RANGE.lo, hi ?? LEVEL_RANGE.hi, what ?? LEVEL_RANGE.expected),
      raw: (key) => c[key],
      fail: (key, found, expected) => fail([...p, key], found, expected),
    };
    const check = { kind, ...common, ...def.validate(read) } as CheckDraft;
    const name = c.name === undefined ? defaultCheckName(check, quantity) : str(c, [...p, 'name'], true, fail);
    if (name === undefined) return;
    const prev = seen.get(name);
    if (prev !== undefined) return fail([...p, 'name'], name, `a name not already used by ${formatKeyPath([...base, prev])} (give one of them a name:)`);
    seen.set(name, i);
    if (hasNaN(check)) return;
    if (out.length === before) out.push({ ...check, name } as LimitCheck);
  });
  return out;
}

function hasNaN(c: object): boolean {
  return Object.values(c).some((v) => typeof v === 'number' && Number.isNaN(v));
}
