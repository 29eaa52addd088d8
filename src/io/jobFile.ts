import path from 'node:path';
import { LineCounter, parseDocument, isMap, isScalar, type Document } from 'yaml';
import type { InputError } from '../types.js';
import { clipText } from './inputError.js';
import { parseNumberText } from './numberText.js';
import { readTrustedText, TrustedFileError } from './trustedFile.js';
import { yamlToJs } from './yamlToJs.js';
import { FREQUENCY_HZ_RANGE, inSaneRange, LEVEL_RANGE, OFFSET_RANGE } from './saneRange.js';
import { identityPatternProblem } from './identityPattern.js';
import type { CalibrationPoint, ColumnRole, JobSpec } from './types.js';
import { QUANTITIES } from '../quantity.js';
import { validateUncertainty } from '../analysis/uncertainty/uncertaintySpec.js';
import { MERGE_RULES } from '../sphere/mergeConflicts.js';

export { findJobFile, JOB_FILE_NAMES } from './findJobFile.js';

const ROLE_KEYS: Record<string, ColumnRole> = {
  theta: 'theta', phi: 'phi', azimuth: 'azimuth', elevation: 'elevation', value: 'value', value_theta: 'valueTheta',
  value_phi: 'valuePhi', power: 'power', pol: 'pol', unit: 'unit', beam: 'beam', frequency: 'frequency',
};
const TOP_KEYS = ['columns', 'identity', 'quantity', 'value_unit', 'angles', 'frequency_unit', 'header_line', 'dropout_tokens', 'calibration', 'limits', 'checks',
  'percentiles', 'coverage_thresholds', 'coverageThresholds', 'report', 'reference', 'uncertainty', 'merge_rule', 'test_info'];
const FREQ_KEYS: Record<string, number> = { frequency_hz: 1, frequency_mhz: 1e6, frequency_ghz: 1e9 };

type Path = (string | number)[];

/** Small schema checker: collects `<key path>: found …, expected …` errors with the node's position. */
class Checker {
  readonly errors: InputError[] = [];
  constructor(
    private readonly file: string,
    private readonly doc: Document,
    private readonly lc: LineCounter,
  ) {}

  fail(p: Path, found: unknown, expected: string): void {
    const node = p.length ? (this.doc.getIn(p, true) as { range?: [number, number] } | undefined) : undefined;
    const keyNode = p.length ? this.keyNodeOf(p) : undefined;
    const offset = (node && typeof node === 'object' && node.range ? node.range[0] : undefined) ?? keyNode ?? 0;
    const { line, col } = this.lc.linePos(offset);
    const keyPath = p.reduce<string>((s, k) => (typeof k === 'number' ? `${s}[${k}]` : s ? `${s}.${k}` : k), '');
    const shown = found === undefined ? 'nothing' : `'${clipText(typeof found === 'string' ? found : JSON.stringify(found))}'`;
    this.errors.push({ file: this.file, line, column: col, columnName: keyPath, message: `${this.file}:${line}:${col}: ${keyPath || '(top level)'}: found ${shown}, expected ${expected}` });
  }

  private keyNodeOf(p: Path): number | undefined {
    const parent = p.length > 1 ? this.doc.getIn(p.slice(0, -1), true) : this.doc.contents;
    if (isMap(parent)) {
      const pair = parent.items.find((it) => (it.key as { value?: unknown })?.value === p[p.length - 1]);
      return (pair?.key as { range?: [number, number] })?.range?.[0];
    }
    return undefined;
  }

  isObject(v: unknown): v is Record<string, unknown> {
    return typeof v === 'object' && v !== null && !Array.isArray(v);
  }

  object(v: unknown, p: Path, allowed?: string[]): Record<string, unknown> | null {
    if (!this.isObject(v)) {
      this.fail(p, v, 'a mapping of keys to values');
      return null;
    }
    if (allowed) for (const k of Object.keys(v)) if (!allowed.includes(k)) this.fail([...p, k], k, `one of the keys ${allowed.join(', ')}`);
    return v;
  }

  string(v: unknown, p: Path): string | undefined {
    if (v === undefined) return undefined;
    if (typeof v !== 'string' || v.trim() === '') {
      this.fail(p, v, 'a text');
      return undefined;
    }
    return v;
  }

  oneOf<T extends string>(v: unknown, p: Path, options: readonly T[]): T | undefined {
    if (v === undefined) return undefined;
    if (typeof v !== 'string' || !options.includes(v as T)) {
      this.fail(p, v, `one of ${options.join(', ')}`);
      return undefined;
    }
    return v as T;
  }

  number(v: unknown, p: Path): number | undefined {
    if (typeof v !== 'number' || !Number.isFinite(v)) {
      this.fail(p, v, 'a number');
      return undefined;
    }
    return v;
  }

  numbers(v: unknown, p: Path, lo = -Infinity, hi = Infinity): number[] | undefined {
    if (v === undefined) return undefined;
    if (!Array.isArray(v)) {
      this.fail(p, v, 'a list of numbers');
      return undefined;
    }
    const out: number[] = [];
    v.forEach((x, i) => {
      const n = this.number(x, [...p, i]);
      if (n === undefined) return;
      if (n < lo || n > hi) this.fail([...p, i], x, `a number between ${lo} and ${hi}`);
      else out.push(n);
    });
    return out;
  }
}

/** A `test_info:` key: snake_case like the job file's own keys (also keeps JSON key order: no number-like keys). */
const TEST_INFO_KEY = /^[a-z][a-z0-9_]*$/;

/**
 * The `test_info:` block: one text per snake_case key, kept as written. A plain scalar keeps its
 * source text (`chamber: 007` stays '007', `date_measured: 2026-11-30` stays a text), a quoted or
 * block scalar its string; nested mappings and lists are refused (one text per key).
 */
function testInfo(c: Checker, doc: Document, v: unknown): Record<string, string> | undefined {
  const block = c.object(v, ['test_info']);
  if (!block) return undefined;
  const out: Record<string, string> = {};
  for (const k of Object.keys(block)) {
    const node = doc.getIn(['test_info', k], true);
    if (!TEST_INFO_KEY.test(k)) c.fail(['test_info', k], k, 'a key in snake_case, e.g. chamber, operator, date_measured, notes, dut_description');
    else if (!isScalar(node)) c.fail(['test_info', k], block[k], 'a text (one line, or a YAML block with |)');
    else out[k] = typeof node.value === 'string' ? node.value : (node as { source?: string }).source ?? String(node.value ?? '');
  }
  return out;
}

/**
 * Load and validate a job file (YAML or JSON). Never throws: a missing file, a syntax error or
 * a schema violation comes back as errors naming the key path and position, e.g.
 * `spherecov.yaml:9:7: calibration.table[3].offset_db: found 'x', expected a number`.
 * Keys read by other stages (limits, checks, percentiles, coverage_thresholds, report,
 * reference) are checked for their outer type and passed through.
 */
export function loadJobFile(filePath: string): { job: JobSpec | null; errors: InputError[] } {
  const file = path.basename(filePath);
  let text: string;
  try {
    text = readTrustedText(filePath, 'job file', file);
  } catch (e) {
    if (e instanceof TrustedFileError) return { job: null, errors: [{ file, message: e.message }] };
    throw e;
  }
  const lc = new LineCounter();
  const doc = parseDocument(text.replace(/^\uFEFF/, ''), { lineCounter: lc, prettyErrors: false });
  if (doc.errors.length) {
    const e = doc.errors[0];
    const { line, col } = lc.linePos(e.pos[0]);
    const near = text.slice(e.pos[0], e.pos[0] + 20).split('\n')[0];
    return { job: null, errors: [{ file, line, column: col, message: `${file}:${line}:${col}: syntax: found '${clipText(near)}', expected valid ${filePath.endsWith('.json') ? 'JSON' : 'YAML'} (${e.code})` }] };
  }
  const c = new Checker(file, doc, lc);
  const root = yamlToJs(doc, file);
  if (root instanceof Error) return { job: null, errors: [{ file, message: root.message }] };
  if (root === null || root === undefined) return { job: { source: path.resolve(filePath) }, errors: [] };
  const top = c.object(root, [], TOP_KEYS);
  if (!top) return { job: null, errors: c.errors };
  const job: JobSpec = { source: path.resolve(filePath) };

  if (top.columns !== undefined) {
    const cols = c.object(top.columns, ['columns'], Object.keys(ROLE_KEYS));
    if (cols) {
      job.columns = {};
      for (const [k, v] of Object.entries(cols)) {
        const s = c.string(v, ['columns', k]);
        if (s && ROLE_KEYS[k]) job.columns[ROLE_KEYS[k]] = s;
      }
    }
  }
  if (top.identity !== undefined) {
    const id = c.object(top.identity, ['identity'], ['unit', 'beam', 'frequency_ghz']);
    if (id) {
      job.identity = {};
      for (const k of ['unit', 'beam', 'frequency_ghz'] as const) {
        const s = c.string(id[k], ['identity', k]);
        if (s === undefined) continue;
        const problem = identityPatternProblem(s);
        if (problem !== null) {
          c.fail(['identity', k], s, `a regular expression the linear-time RE2 engine accepts (group 1 is the value; no back-references or look-around): ${clipText(problem)}`);
          continue;
        }
        job.identity[k === 'frequency_ghz' ? 'frequencyGhz' : k] = s;
      }
    }
  }
  job.quantity = c.oneOf(top.quantity, ['quantity'], QUANTITIES);
  job.valueUnit = c.oneOf(top.value_unit, ['value_unit'], ['dBm', 'dBi', 'mW', 'W'] as const);
  job.frequencyUnit = c.oneOf(top.frequency_unit, ['frequency_unit'], ['Hz', 'MHz', 'GHz'] as const);
  job.mergeRule = c.oneOf(top.merge_rule, ['merge_rule'], MERGE_RULES);
  if (top.dropout_tokens !== undefined) {
    const list = top.dropout_tokens;
    if (!Array.isArray(list)) c.fail(['dropout_tokens'], list, "a list of cell texts read as missing samples, e.g. [OVLD, NaN, '--', '']");
    else {
      const tokens: string[] = [];
      list.forEach((x, i) => {
        if (typeof x !== 'string') c.fail(['dropout_tokens', i], x, 'a text such as OVLD (numbers are read as values, never as dropouts)');
        else if (typeof parseNumberText(x, true) === 'number') c.fail(['dropout_tokens', i], x, 'a text that is not a number (numbers are read as values, never as dropouts)');
        else tokens.push(x);
      });
      job.dropoutTokens = tokens;
    }
  }
  if (top.header_line !== undefined) {
    const n = c.number(top.header_line, ['header_line']);
    if (n !== undefined && !(Number.isInteger(n) && n >= 1)) c.fail(['header_line'], top.header_line, 'a line number (1 or more)');
    else job.headerLine = n;
  }
  if (top.angles !== undefined) {
    const a = c.object(top.angles, ['angles'], ['convention', 'unit']);
    if (a) job.angles = { convention: c.oneOf(a.convention, ['angles', 'convention'], ['theta-phi', 'az-el'] as const), unit: c.oneOf(a.unit, ['angles', 'unit'], ['deg', 'rad'] as const) };
  }
  if (top.calibration !== undefined) {
    const cal = c.object(top.calibration, ['calibration'], ['table']);
    if (cal) {
      const table = cal.table;
      if (!Array.isArray(table) || table.length === 0) c.fail(['calibration', 'table'], table, 'a list of {frequency_ghz, offset_db} entries');
      else {
        const points: CalibrationPoint[] = [];
        table.forEach((row, i) => {
          const p: Path = ['calibration', 'table', i];
          const o = c.object(row, p, [...Object.keys(FREQ_KEYS), 'offset_db']);
          if (!o) return;
          const fk = Object.keys(FREQ_KEYS).filter((k) => k in o);
          if (fk.length !== 1) {
            c.fail(p, row, 'exactly one of frequency_ghz, frequency_mhz, frequency_hz');
            return;
          }
          const f = c.number(o[fk[0]], [...p, fk[0]]);
          const off = c.number(o.offset_db, [...p, 'offset_db']);
          if (f !== undefined && !inSaneRange(f * FREQ_KEYS[fk[0]], FREQUENCY_HZ_RANGE)) c.fail([...p, fk[0]], o[fk[0]], FREQUENCY_HZ_RANGE.expected);
          else if (off !== undefined && !inSaneRange(off, OFFSET_RANGE)) c.fail([...p, 'offset_db'], o.offset_db, OFFSET_RANGE.expected);
          else if (f !== undefined && off !== undefined) points.push({ frequencyHz: f * FREQ_KEYS[fk[0]], offsetDb: off });
        });
        points.sort((a, b) => a.frequencyHz - b.frequencyHz);
        for (let i = 1; i < points.length; i++) {
          if (points[i].frequencyHz === points[i - 1].frequencyHz) c.fail(['calibration', 'table'], `${points[i].frequencyHz / 1e9} GHz twice`, 'each frequency once');
        }
        job.calibration = { table: points };
      }
    }
  }
  if (top.limits !== undefined) job.limits = c.string(top.limits, ['limits']);
  if (top.checks !== undefined) {
    if (!Array.isArray(top.checks)) c.fail(['checks'], top.checks, 'a list of check entries');
    else {
      top.checks.forEach((x, i) => {
        if (!c.isObject(x)) c.fail(['checks', i], x, 'a mapping (a check entry)');
      });
      job.checks = top.checks.filter((x) => c.isObject(x)) as Record<string, unknown>[];
    }
  }
  job.percentiles = c.numbers(top.percentiles, ['percentiles'], 0, 100);
  const ctKey = top.coverage_thresholds !== undefined ? 'coverage_thresholds' : 'coverageThresholds';
  job.coverageThresholds = c.numbers(top[ctKey], [ctKey], LEVEL_RANGE.lo, LEVEL_RANGE.hi);
  if (top.report !== undefined) {
    const r = c.object(top.report, ['report']);
    if (r) job.report = r;
  }
  if (top.reference !== undefined) job.reference = c.string(top.reference, ['reference']);
  if (top.uncertainty !== undefined) {
    const spec = validateUncertainty(top.uncertainty, ['uncertainty'], (p, found, expected) => c.fail(p, found, expected));
    if (spec) job.uncertainty = spec;
  }
  if (top.test_info !== undefined) job.testInfo = testInfo(c, doc, top.test_info);
  for (const k of Object.keys(job) as (keyof JobSpec)[]) if (job[k] === undefined) delete job[k];
  return c.errors.length ? { job: null, errors: c.errors } : { job, errors: [] };
}
