import type { z } from 'zod';
import { lazySchema, zod } from './zod.js';
import { QUANTITIES } from '../quantity.js';
import { MERGE_RULES } from '../sphere/mergeConflicts.js';
import { FREQUENCY_HZ_RANGE, LEVEL_RANGE, OFFSET_RANGE } from '../io/saneRange.js';
import { identityPatternProblem } from '../io/identityPattern.js';
import { parseNumberText } from '../io/numberText.js';
import { clipText } from '../io/inputError.js';
import type { CalibrationPoint, ColumnRole, JobSpec } from '../io/types.js';
import { num, numbers, oneOf, text, whole } from './fields.js';
import { checkSchema } from './limitSetSchema.js';
import { reportSettingsSchema } from './reportSettingsSchema.js';
import { uncertaintySchema } from './uncertaintySchema.js';
import { internalKey } from './naming.js';

/** `columns:` keys (file spelling) → the column role they map. */
const ROLE_KEYS = ['theta', 'phi', 'azimuth', 'elevation', 'value', 'value_theta', 'value_phi', 'power', 'pol', 'unit', 'beam', 'frequency'] as const;
const FREQ_SCALE = { frequency_hz: 1, frequency_mhz: 1e6, frequency_ghz: 1e9 } as const;
const ONE_FREQUENCY = 'exactly one of frequency_ghz, frequency_mhz, frequency_hz';

const header = () => text('a header name (a text)');
const pattern = () => text('a text').superRefine((s, ctx) => {
  const problem = identityPatternProblem(s);
  if (problem !== null) {
    ctx.addIssue({ code: 'custom', message: `a regular expression the linear-time RE2 engine accepts (group 1 is the value; no back-references or look-around): ${clipText(problem)}` });
  }
});

function hzOf(p: Partial<Record<keyof typeof FREQ_SCALE, number>>): number {
  const k = (Object.keys(FREQ_SCALE) as (keyof typeof FREQ_SCALE)[]).find((x) => p[x] !== undefined) as keyof typeof FREQ_SCALE;
  return (p[k] as number) * FREQ_SCALE[k];
}

/** The job file (spherecov.yaml in the input folder, or --job): every key optional. */
export const jobFileSchema = lazySchema(() => {
  const calibrationPoint = zod().strictObject({
    frequency_ghz: num('a number').optional(),
    frequency_mhz: num('a number').optional(),
    frequency_hz: num('a number').optional(),
    offset_db: num(OFFSET_RANGE.expected, OFFSET_RANGE.lo, OFFSET_RANGE.hi).describe('Added to received power (dBm) to give EIRP (dBm)'),
  }, { error: 'a mapping {frequency_ghz, offset_db}' }).superRefine((o, ctx) => {
    const keys = (Object.keys(FREQ_SCALE) as (keyof typeof FREQ_SCALE)[]).filter((k) => o[k] !== undefined);
    if (keys.length !== 1) ctx.addIssue({ code: 'custom', path: [], params: { found: o }, message: ONE_FREQUENCY });
    else if ((o[keys[0]] as number) * FREQ_SCALE[keys[0]] <= 0 || (o[keys[0]] as number) * FREQ_SCALE[keys[0]] > FREQUENCY_HZ_RANGE.hi) {
      ctx.addIssue({ code: 'custom', path: [keys[0]], message: FREQUENCY_HZ_RANGE.expected });
    }
  });

  const calibration = zod().strictObject({
    table: zod().array(calibrationPoint, { error: 'a list of {frequency_ghz, offset_db} entries' })
      .min(1, { error: 'a list of {frequency_ghz, offset_db} entries' }),
  }, { error: 'a mapping with a table' }).superRefine((c, ctx) => {
    const hz = c.table.map(hzOf).sort((a, b) => a - b);
    for (let i = 1; i < hz.length; i++) {
      if (hz[i] === hz[i - 1]) ctx.addIssue({ code: 'custom', path: ['table'], params: { found: `${hz[i] / 1e9} GHz twice` }, message: 'each frequency once' });
    }
  });


  /** A `test_info:` key: snake_case like the job file's own keys (also keeps JSON key order: no number-like keys). */
  const TEST_INFO_KEY = /^[a-z][a-z0-9_]*$/;
  const TEST_INFO_KEY_WORDS = 'a key in snake_case, e.g. chamber, operator, date_measured, notes, dut_description';

  const DROPOUT = 'a text that is not a number (numbers are read as values, never as dropouts)';

  const jobFile = zod().strictObject({
    columns: zod().strictObject(Object.fromEntries(ROLE_KEYS.map((k) => [k, header().optional()])) as Record<(typeof ROLE_KEYS)[number], z.ZodOptional<ReturnType<typeof header>>>,
      { error: 'a mapping of column roles to header names' }).optional()
      .describe('Role → header name (case-insensitive), when the headers do not say'),
    identity: zod().strictObject({ unit: pattern().optional(), beam: pattern().optional(), frequency_ghz: pattern().optional() },
      { error: 'a mapping of unit, beam, frequency_ghz to regular expressions' }).optional()
      .describe('Regular expressions on the path below the input folder (group 1 is the value)'),
    quantity: oneOf(QUANTITIES).optional().describe('What the values are, when headers and metadata do not say'),
    value_unit: oneOf(['dBm', 'dBi', 'mW', 'W']).optional().describe('Unit of value columns without one in the header'),
    angles: zod().strictObject({ convention: oneOf(['theta-phi', 'az-el']).optional(), unit: oneOf(['deg', 'rad']).optional() },
      { error: 'a mapping with convention and unit' }).optional(),
    frequency_unit: oneOf(['Hz', 'MHz', 'GHz']).optional().describe('Unit of a frequency column without one in its header'),
    header_line: whole('a line number (1 or more)', 1).optional().describe('1-based line of the header row (below a free-text preamble)'),
    dropout_tokens: zod().array(zod().string({ error: 'a text such as OVLD (numbers are read as values, never as dropouts)' })
      .refine((x) => typeof parseNumberText(x, true) !== 'number', { error: DROPOUT }),
    { error: "a list of cell texts read as missing samples, e.g. [OVLD, NaN, '--', '']" }).optional()
      .describe('Cell texts read as missing samples in value columns (case-insensitive; "" is an empty cell)'),
    merge_rule: oneOf(MERGE_RULES as unknown as ['power-average', 'first', 'last', 'refuse']).optional()
      .describe('How samples of one direction are merged (φ seam, poles, repeats)'),
    calibration: calibration.optional().describe('Received power + offset = EIRP; linear in frequency, never extrapolated'),
    limits: text('a limit-set file or a shipped profile name').optional(),
    checks: zod().array(checkSchema(), { error: 'a list of check entries' }).optional().describe('Programme checks added to the limit set'),
    percentiles: numbers('a number between 0 and 100', 0, 100).optional(),
    coverage_thresholds: numbers(LEVEL_RANGE.expected, LEVEL_RANGE.lo, LEVEL_RANGE.hi).optional(),
    report: reportSettingsSchema().optional(),
    reference: text('a unit of the build').optional(),
    uncertainty: uncertaintySchema().optional(),
    test_info: zod().record(zod().string().regex(TEST_INFO_KEY, { error: TEST_INFO_KEY_WORDS }),
      zod().string({ error: 'a text (one line, or a YAML block with |)' }),
      { error: (iss) => (iss.code === 'invalid_key' ? TEST_INFO_KEY_WORDS : 'a mapping of keys to values') }).optional()
      .describe('Test metadata, kept as written (chamber, operator, date_measured, dut_description, notes, or any snake_case key): page 1 of every report and results.json testInfo'),
  }, { error: 'a mapping of keys to values' })
    .transform((j): Omit<JobSpec, 'source'> => {
      const job: Omit<JobSpec, 'source'> = {};
      if (j.columns) {
        job.columns = {};
        for (const [k, v] of Object.entries(j.columns)) if (v !== undefined) job.columns[internalKey(k) as ColumnRole] = v;
      }
      if (j.identity) {
        job.identity = {};
        if (j.identity.unit !== undefined) job.identity.unit = j.identity.unit;
        if (j.identity.beam !== undefined) job.identity.beam = j.identity.beam;
        if (j.identity.frequency_ghz !== undefined) job.identity.frequencyGhz = j.identity.frequency_ghz;
      }
      job.quantity = j.quantity;
      job.valueUnit = j.value_unit;
      job.frequencyUnit = j.frequency_unit;
      job.mergeRule = j.merge_rule;
      job.dropoutTokens = j.dropout_tokens;
      job.headerLine = j.header_line;
      if (j.angles) job.angles = { convention: j.angles.convention, unit: j.angles.unit };
      if (j.calibration) {
        const table: CalibrationPoint[] = j.calibration.table.map((p) => ({ frequencyHz: hzOf(p), offsetDb: p.offset_db }));
        job.calibration = { table: table.sort((a, b) => a.frequencyHz - b.frequencyHz) };
      }
      job.limits = j.limits;
      job.checks = j.checks as Record<string, unknown>[] | undefined;
      job.percentiles = j.percentiles;
      job.coverageThresholds = j.coverage_thresholds;
      job.report = j.report as Record<string, unknown> | undefined;
      job.reference = j.reference;
      job.uncertainty = j.uncertainty;
      job.testInfo = j.test_info;
      for (const k of Object.keys(job) as (keyof typeof job)[]) if (job[k] === undefined) delete job[k];
      return job;
    });
  return jobFile;
});
