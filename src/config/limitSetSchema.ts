import type { z } from 'zod';
import { lazySchema, zod } from './zod.js';
import type { CheckKind, Quantity } from '../types.js';
import { QUANTITIES } from '../quantity.js';
import type { CheckDraft, LimitCheck, LimitSet } from '../limits/limitSet.js';
import { CHECK_KINDS, kindDef } from '../limits/checkKinds.js';
import { defaultCheckName, kindAllowed } from '../limits/checkSense.js';
import { frequencyRangeMhz, num, oneOf, text } from './fields.js';
import { camelizeKeys, internalKey } from './naming.js';
import { formatKeyPath } from './problems.js';
import { uncertaintySchema } from './uncertaintySchema.js';
import type { KeyPath } from './yamlSource.js';

const KIND_LIST = `one of ${CHECK_KINDS.join(', ')}`;

/** One check of a limit set (or of a job file's `checks`): the common keys and the kind's own (checkKinds.ts). */
export const checkSchema = lazySchema(() => zod().discriminatedUnion('kind', CHECK_KINDS.map((kind) => zod().strictObject({
  kind: zod().literal(kind),
  name: text().optional().describe('Unique within the set; generated from the kind when omitted'),
  tolerance_db: num('a test tolerance in dB between 0 and 30', 0, 30).optional()
    .describe('Test tolerance, dB: relaxes the limit (or the threshold of a coverage check); default 0'),
  source: text().optional().describe('Where the limit comes from (document, clause, table)'),
  ...kindDef(kind).fields(),
})) as unknown as [z.ZodObject, ...z.ZodObject[]], {
  error: (iss) => (iss.code === 'invalid_union' ? KIND_LIST : 'a check mapping with a kind'),
}));

type ParsedCheck = z.output<ReturnType<typeof checkSchema>> & { kind: CheckKind; name?: string; tolerance_db?: number; source?: string };

/** A problem of a check list that only the whole list (or the set's quantity) shows. */
interface ListProblem { path: KeyPath; found: unknown; expected: string }

/**
 * The rules over a whole check list: each kind must mean something for the quantity, and names
 * (given or defaulted from the kind) must be unique. Shared by limit sets and job-file checks.
 */
export function checkListProblems(checks: ParsedCheck[], quantity: Quantity, base: KeyPath): ListProblem[] {
  const out: ListProblem[] = [];
  const seen = new Map<string, number>();
  checks.forEach((c, i) => {
    if (!kindAllowed(c.kind, quantity)) {
      const ok = CHECK_KINDS.filter((k) => kindAllowed(k, quantity)).join(', ');
      out.push({ path: [...base, i, 'kind'], found: c.kind, expected: `a check kind that applies to ${quantity} (${ok})` });
      return;
    }
    const name = c.name ?? defaultCheckName(draftOf(c), quantity);
    const prev = seen.get(name);
    if (prev !== undefined) {
      out.push({ path: [...base, i, 'name'], found: name, expected: `a name not already used by ${formatKeyPath([...base, prev])} (give one of them a name:)` });
      return;
    }
    seen.set(name, i);
  });
  return out;
}

/** The check as code holds it (camelCase, tolerance 0 by default), before its name is settled. */
function draftOf(c: ParsedCheck): CheckDraft {
  const own = Object.fromEntries(Object.keys(kindDef(c.kind).fields()).filter((k) => (c as Record<string, unknown>)[k] !== undefined)
    .map((k) => [internalKey(k), camelizeKeys((c as Record<string, unknown>)[k])]));
  return { kind: c.kind, toleranceDb: c.tolerance_db ?? 0, ...(c.source !== undefined ? { source: c.source } : {}), ...own } as CheckDraft;
}

/** Validated checks as LimitChecks, names settled (defaults from the kind). */
export function toLimitChecks(checks: ParsedCheck[], quantity: Quantity): LimitCheck[] {
  return checks.map((c) => {
    const d = draftOf(c);
    return { ...d, name: c.name ?? defaultCheckName(d, quantity) } as LimitCheck;
  });
}

/** A limit-set file (YAML or JSON): a named list of checks for one quantity. */
export const limitSetSchema = lazySchema(() => zod().strictObject({
  name: text().describe('Name of the limit set'),
  description: text().optional(),
  source: text().optional().describe('Where the limits come from (standard, version, clause, table)'),
  quantity: oneOf(QUANTITIES),
  band: text().optional().describe("Operating band, e.g. 'n257' (informative)"),
  frequency_range_mhz: frequencyRangeMhz().optional().describe('[low, high] MHz the set applies to'),
  checks: zod().array(checkSchema(), { error: 'a list of checks' }),
  uncertainty: uncertaintySchema().optional(),
}, { error: 'a mapping with name, quantity and checks' })
  .superRefine((s, ctx) => {
    for (const p of checkListProblems(s.checks as ParsedCheck[], s.quantity, ['checks'])) {
      ctx.addIssue({ code: 'custom', path: p.path, params: { found: p.found }, message: p.expected });
    }
  })
  .transform((s): LimitSet => {
    const ls: LimitSet = {
      name: s.name, description: s.description ?? '', source: s.source ?? 'no source given', quantity: s.quantity,
      checks: toLimitChecks(s.checks as ParsedCheck[], s.quantity),
    };
    if (s.uncertainty) ls.uncertainty = s.uncertainty;
    if (s.band !== undefined) ls.band = s.band;
    if (s.frequency_range_mhz) ls.frequencyRangeMHz = [s.frequency_range_mhz[0], s.frequency_range_mhz[1]];
    return ls;
  }));

/** A list of checks (a job file's `checks`), before the quantity rules. */
export const checkListSchema = lazySchema(() => zod().array(checkSchema(), { error: 'a list of checks' }));
export type { ParsedCheck };
