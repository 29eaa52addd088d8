/**
 * Long layout: one row per direction (and beam, polarization, frequency, unit); angle columns,
 * a value column or a polarization pair (or a pol column with a total column), optional unit,
 * beam and frequency columns. CONTRACT.md "Input folder".
 */
import type { InputError, Quantity, Warning } from '../../types.js';
import { warning } from '../../warnings.js';
import { pairLabel } from '../columnRoles.js';
import { addField, fieldPlan, KEY, NUM, SKIP } from '../fieldPlan.js';
import { assumedFrequencyHz } from '../frequencyText.js';
import { inputError } from '../inputError.js';
import type { ColumnInfo, ColumnRole, JobSpec, RawBeam } from '../types.js';
import type { BeamContext, LayoutReader, LayoutSink, LongPlan, PlanContext, PlanResult } from './layoutTypes.js';
import { LongSink, type LongGroup } from './longSink.js';
import { polarizationBeams } from '../polarizationBeams.js';
import { angleColumns, assumedValueUnit, checkValueUnit, fail, FREQ_FACTORS, headerRoles, metadataQuantity, quantityOfFile, rolesForDetection, VALUE_ROLES } from './planParts.js';

const UNKNOWN_LAYOUT =
  'theta and phi (or azimuth and elevation) columns for the long layout, or a matrix header ' +
  "'theta,<phi values…>'; map columns in the job file (columns:) if the names differ";

/**
 * Understand a long-layout header: which column means what, units, quantity and angle
 * convention. As the last layout of the registry it always answers: problems come back as input
 * errors at the header line. Cost O(columns).
 */
export function planLong(cells: string[], ctx: PlanContext): PlanResult {
  const warnings: Warning[] = [];
  const col = (i: number): number => ctx.cellCols[i] ?? 1;
  const headerErr = (expected: string): PlanResult => fail([inputError(ctx.file, ctx.headerLine, 1, 'header', ctx.headerText, expected)]);
  const hr = headerRoles(cells, ctx);
  if (Array.isArray(hr)) return fail(hr);
  const { parsed, roles, quantities } = hr;
  // One column per role: with two θ (or beam, …) columns any choice would be a guess.
  for (let i = 0; i < roles.length; i++) {
    const role = roles[i];
    if (role === null || role === 'value' || role === 'power') continue;
    const first = roles.indexOf(role);
    if (first < i) {
      const name = cells[i].trim();
      return fail([inputError(ctx.file, ctx.headerLine, col(i), name, name, `one column per role (a ${role} column is already '${cells[first].trim()}', column ${first + 1})`)]);
    }
  }

  const find = (role: ColumnRole): number => roles.indexOf(role);
  const angles = angleColumns(roles);
  if (!angles) return headerErr(UNKNOWN_LAYOUT);
  const { convention: angleConvention, a1, a2 } = angles;
  const angleUnit = ctx.job?.angles?.unit ?? (parsed[a1].unit === 'rad' || parsed[a2].unit === 'rad' ? 'rad' : 'deg');
  if (ctx.job?.angles?.convention && ctx.job.angles.convention !== angleConvention) {
    return headerErr(`${ctx.job.angles.convention === 'az-el' ? 'azimuth and elevation' : 'theta and phi'} columns (angles.convention in the job file)`);
  }

  // Value columns: a total, or a θ/φ polarization pair, or received power.
  const total = roles.map((r, i) => (r === 'value' || r === 'power' ? i : -1)).filter((i) => i >= 0);
  const pairT = find('valueTheta');
  const pairP = find('valuePhi');
  let valueFields: number[];
  if (total.length > 1) {
    const [i, j] = total;
    const qOf = (k: number): string => (roles[k] === 'power' ? 'power' : quantities[k] ?? 'value');
    const expected = qOf(i) !== qOf(j)
      ? `value columns of one quantity (found ${qOf(i)} in '${cells[i].trim()}' and ${qOf(j)} here; keep one or map it with columns.value in the job file)`
      : `one value column (also found '${cells[i].trim()}'; map one with columns.value in the job file)`;
    return fail([inputError(ctx.file, ctx.headerLine, col(j), cells[j].trim(), cells[j].trim(), expected)]);
  } else if (total.length === 1) {
    valueFields = [total[0]];
  } else if (pairT >= 0 && pairP >= 0) {
    valueFields = [pairT, pairP];
  } else {
    const half = pairT >= 0 ? pairT : pairP;
    if (half >= 0) {
      return fail([inputError(ctx.file, ctx.headerLine, col(half), cells[half].trim(), cells[half].trim(), halfPairExpected(parsed[half].base))]);
    }
    return headerErr('a value column (eirp, gain, eis, power, or an eirp_theta + eirp_phi pair)');
  }
  // Every value-like column must agree on the quantity, used or not.
  const valueLike = roles.map((r, i) => (r && VALUE_ROLES.includes(r) ? i : -1)).filter((i) => i >= 0);
  for (const i of valueLike) {
    const qi = roles[i] === 'power' ? 'power' : quantities[i];
    const q0 = roles[valueFields[0]] === 'power' ? 'power' : quantities[valueFields[0]];
    if (qi && q0 && qi !== q0) {
      const other = cells[valueFields[0]].trim();
      return fail([inputError(ctx.file, ctx.headerLine, col(i), cells[i].trim(), cells[i].trim(),
        `value columns of one quantity (also found '${other}'; keep one or map it with columns.value in the job file)`)]);
    }
  }
  for (const i of valueLike) {
    if (!valueFields.includes(i)) {
      warnings.push(warning('column-ignored', `column '${cells[i].trim()}' ignored (a total value column is used)`, { file: ctx.file }));
      roles[i] = null;
    }
  }
  const power = roles[valueFields[0]] === 'power';
  const colQuantity = power ? 'eirp' : quantities[valueFields[0]];
  let quantity: Quantity;
  if (power) {
    if (!ctx.job?.calibration) {
      return fail([inputError(ctx.file, ctx.headerLine, col(valueFields[0]), cells[valueFields[0]].trim(), cells[valueFields[0]].trim(),
        'a calibration table in the job file (calibration.table) to turn received power into EIRP')]);
    }
    quantity = 'eirp';
  } else {
    const q = quantityOfFile(ctx, colQuantity, cells[valueFields[0]].trim(), warnings);
    if (typeof q !== 'string') return fail([q]);
    quantity = q;
  }
  const units = valueFields.map((i) => parsed[i].unit);
  if (units.length === 2 && units[0] !== units[1]) {
    return fail([inputError(ctx.file, ctx.headerLine, col(valueFields[1]), cells[valueFields[1]].trim(), units[1] ?? 'no unit',
      `the unit of '${cells[valueFields[0]].trim()}' (${units[0] ?? 'no unit'})`)]);
  }
  const writtenUnit = units[0] ?? ctx.job?.valueUnit ?? metadataQuantity(ctx.metadata).unit ?? assumedValueUnit(quantity, power);
  const checked = checkValueUnit(quantity, power, writtenUnit);
  if (typeof checked === 'string') {
    return fail([inputError(ctx.file, ctx.headerLine, col(valueFields[0]), cells[valueFields[0]].trim(), writtenUnit, checked)]);
  }

  const fp = fieldPlan(cells.length, cells.map((c) => c.trim()));
  addField(fp, a1, NUM);
  addField(fp, a2, NUM);
  for (const v of valueFields) addField(fp, v, NUM, true);
  const freqIdx = find('frequency');
  const freqSlot = freqIdx >= 0 ? addField(fp, freqIdx, NUM) : -1;
  const keyOf = (role: ColumnRole): number => (find(role) >= 0 ? addField(fp, find(role), KEY) : -1);
  const unitKey = keyOf('unit');
  const beamKey = keyOf('beam');
  const polKey = keyOf('pol');
  if (polKey >= 0 && valueFields.length === 2) {
    return fail([inputError(ctx.file, ctx.headerLine, col(find('pol')), cells[find('pol')].trim(), cells[find('pol')].trim(),
      'either a pol column or a _theta/_phi value pair, not both')]);
  }
  let freqFactor: number | null = null;
  if (freqIdx >= 0) {
    const u = parsed[freqIdx].unit ?? ctx.job?.frequencyUnit ?? null;
    freqFactor = u ? FREQ_FACTORS[u] ?? null : null;
    if (u && freqFactor === null) {
      return fail([inputError(ctx.file, ctx.headerLine, col(freqIdx), cells[freqIdx].trim(), u, 'a frequency unit Hz, MHz or GHz')]);
    }
  }

  const columns: ColumnInfo[] = cells.map((c, i) => ({ index: i, name: c.trim(), role: fp.kinds[i] === SKIP ? null : roles[i], unit: parsed[i].unit }));
  for (const c of columns) {
    if (c.role === null && !valueLike.includes(c.index)) {
      warnings.push(warning('column-ignored', `column '${c.name}' not used`, { file: ctx.file }));
    }
  }
  const plan: LongPlan = {
    layout: 'long', columns, fields: fp, quantity, valueUnit: checked.valueUnit, fileValueUnit: checked.fileUnit,
    angleConvention, angleUnit, power, pairValues: valueFields.length === 2, freqSlot, freqFactor, unitKey, beamKey, polKey,
  };
  return {
    planned: { facts: plan, info: {}, samplesPerRow: 1, headerErrors: [], newSink: (s) => new LongLayoutSink(plan, s.file, s.errors, s.keys, s.dropouts, s.sharedValues === true) },
    warnings,
    errors: [],
  };
}

/** The long layout's sink: LongSink's groups → raw beams (identity columns, pol column pairs). */
class LongLayoutSink extends LongSink implements LayoutSink {
  beams(ctx: BeamContext): { beams: RawBeam[] } | { errors: InputError[] } {
    const plan = this.plan;
    if (plan.unitKey >= 0) ctx.identity.unit = 'column';
    if (plan.beamKey >= 0) ctx.identity.beam = 'column';
    if (plan.freqSlot >= 0) ctx.identity.frequency = 'column';
    return longBeams(this.finish(), plan, this, ctx);
  }
}

function longBeams(groups: LongGroup[], plan: LongPlan, sink: LongSink, ctx: BeamContext): { beams: RawBeam[] } | { errors: InputError[] } {
  const { file, keys } = ctx;
  let assumed = false;
  const freqOf = (raw: number): number | null => {
    if (plan.freqSlot < 0) return ctx.fileFreqHz;
    if (plan.freqFactor !== null) return raw * plan.freqFactor;
    assumed = true;
    return assumedFrequencyHz(raw);
  };
  const identityOf = (g: LongGroup): Omit<RawBeam, 'values'> => ({
    ...ctx.base,
    unit: g.unitId >= 0 ? keys.names[plan.unitKey][g.unitId] : ctx.fileUnit,
    beam: g.beamId >= 0 ? keys.names[plan.beamKey][g.beamId] : ctx.fileBeam,
    frequencyHz: freqOf(g.freqRaw),
    thetaDeg: g.thetaDeg, phiDeg: g.phiDeg, firstLine: g.firstLine,
  });
  const make = (g: LongGroup, values: Float64Array): RawBeam => ({ ...identityOf(g), values });
  const beams: RawBeam[] = [];
  if (plan.polKey < 0) {
    // A θ/φ value-column pair: the components become beams by quantity (polarizationBeams).
    for (const g of groups) beams.push(...(g.valuesPhi ? polarizationBeams(identityOf(g), g.values, g.valuesPhi) : [make(g, g.values)]));
  } else {
    // Long-form polarization: pair the theta and phi groups of each (unit, beam, frequency).
    const pairs = new Map<string, [LongGroup | null, LongGroup | null]>();
    for (const g of groups) {
      const k = `${g.unitId}|${g.beamId}|${g.freqRaw}`;
      const pair = pairs.get(k) ?? [null, null];
      pair[sink.polKind(g.polId)] = g;
      pairs.set(k, pair);
    }
    const errors: InputError[] = [];
    const polCol = plan.columns.find((c) => c.role === 'pol')!;
    for (const [t, p] of pairs.values()) {
      const one = (t ?? p)!;
      if (!t || !p || !sameDirections(t, p)) {
        const beam = make(one, one.values).beam;
        const found = !t || !p ? `only ${t ? 'theta' : 'phi'} rows for beam '${beam}'` : `theta and phi rows of beam '${beam}' at different directions`;
        errors.push(inputError(file, one.firstLine, 1, polCol.name, found, 'a theta and a phi row for every direction, in the same order', true));
        continue;
      }
      beams.push(...polarizationBeams(identityOf(t), t.values, p.values));
    }
    if (errors.length) return { errors };
  }
  if (assumed) {
    ctx.warnings.push(warning('frequency-unit-assumed', `frequency column without a unit; values below 1000 read as GHz, below 10^6 as MHz, else Hz`, { file }));
  }
  return { beams };
}

/** "expected" text for one component of a polarization pair without its partner. */
export function halfPairExpected(base: string): string {
  if (/^e_?(theta|phi|θ|φ)$/.test(base)) return 'both field components (Etheta and Ephi), or a pol column with a total value column';
  const m = /^(.*?)_?([a-zθφ]+)$/.exec(base);
  const comp = m ? m[2] : base;
  const label = pairLabel(comp);
  const stem = m && m[1] ? m[1] : base;
  const [a, b] = label.split('/');
  return label === 'theta/phi'
    ? `both polarizations (${stem}_theta and _phi), or a pol column with a total value column`
    : `both polarizations (${stem}_${a} and _${b}), or a pol column with a total value column`;
}

function sameDirections(a: LongGroup, b: LongGroup): boolean {
  if (a.thetaDeg === b.thetaDeg && a.phiDeg === b.phiDeg) return true;
  if (a.thetaDeg.length !== b.thetaDeg.length) return false;
  for (let i = 0; i < a.thetaDeg.length; i++) if (a.thetaDeg[i] !== b.thetaDeg[i] || a.phiDeg[i] !== b.phiDeg[i]) return false;
  return true;
}

/** The long layout: the registry's last resort, which always plans or explains. */
export const longLayout: LayoutReader = {
  name: 'long',
  isHeader(cells: string[], job?: JobSpec): boolean {
    const roles = rolesForDetection(cells, job);
    return angleColumns(roles) !== null && roles.some((r) => r !== null && VALUE_ROLES.includes(r));
  },
  plan: planLong,
};
