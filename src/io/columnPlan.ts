import type { InputError, Quantity, ValueUnit, Warning } from '../types.js';
import { warning } from '../warnings.js';
import { parseHeaderCell } from './headerCell.js';
import { roleOfName } from './columnRoles.js';
import { inputError } from './inputError.js';
import { parseNumberText } from './numberText.js';
import type { ColumnInfo, ColumnRole, JobSpec } from './types.js';

/** Field kinds the tokenizers know: skip it, read a number, or intern a text key. */
export const SKIP = 0;
export const NUM = 1;
export const KEY = 2;

/** What both tokenizers need: per field its kind and slot (index into the row's nums/keys). */
export interface FieldPlan {
  kinds: Uint8Array;
  slots: Int32Array;
  names: string[];
  numCount: number;
  keyCount: number;
}

interface PlanBase {
  columns: ColumnInfo[];
  fields: FieldPlan;
  quantity: Quantity;
  valueUnit: ValueUnit;
  /** Unit of the values as written: dBm, dBi, mW or W. */
  fileValueUnit: 'dBm' | 'dBi' | 'mW' | 'W';
  angleConvention: 'theta-phi' | 'az-el';
  angleUnit: 'deg' | 'rad';
  /** Received power to be calibrated into EIRP. */
  power: boolean;
}

/** Long layout: num slots 0,1 = angles (θ,φ or el,az), 2(,3) = value(s), then frequency. */
export interface LongPlan extends PlanBase {
  layout: 'long';
  pairValues: boolean;
  freqSlot: number;
  /** Multiply the frequency column by this to get Hz; null when the unit was assumed per value. */
  freqFactor: number | null;
  unitKey: number;
  beamKey: number;
  polKey: number;
}

/** Matrix layout: every field is a number; field 0 the row angle, the rest values at colAngles. */
export interface MatrixPlan extends PlanBase {
  layout: 'matrix';
  colAnglesRaw: number[];
}

export type ColumnPlanResult =
  | { plan: LongPlan | MatrixPlan; warnings: Warning[]; errors: [] }
  | { plan: null; warnings: Warning[]; errors: InputError[] };

export interface PlanContext {
  file: string;
  headerLine: number;
  /** 1-based character column where each header cell starts. */
  cellCols: number[];
  headerText: string;
  decimalComma: boolean;
  metadata: Record<string, string>;
  /** Line of each metadata key. */
  metadataLines: Record<string, number>;
  job?: JobSpec;
  quantityOverride?: Quantity;
}

const VALUE_ROLES: ColumnRole[] = ['value', 'valueTheta', 'valuePhi', 'power'];
const FREQ_FACTORS: Record<string, number> = { Hz: 1, kHz: 1e3, MHz: 1e6, GHz: 1e9 };

function fail(errors: InputError[]): ColumnPlanResult {
  return { plan: null, warnings: [], errors };
}

/** Quantity and unit named by a `# quantity: eirp dBm` metadata line. */
function metadataQuantity(meta: Record<string, string>): { quantity?: Quantity; unit?: string } {
  const text = meta.quantity?.trim().toLowerCase();
  if (!text) return {};
  const [q, u] = text.split(/[\s,]+/);
  const quantity = q === 'eirp' || q === 'eis' || q === 'gain' ? q : undefined;
  const unit = u ? parseHeaderCell(`x [${u}]`).unit ?? undefined : undefined;
  return { quantity, unit };
}

/** Check the written unit against the quantity; gives the stored unit or an error text. */
function checkValueUnit(
  quantity: Quantity,
  power: boolean,
  unit: string,
): { fileUnit: 'dBm' | 'dBi' | 'mW' | 'W'; valueUnit: ValueUnit } | string {
  if (quantity === 'gain' && !power) {
    if (unit === 'dBi' || unit === 'dB') return { fileUnit: 'dBi', valueUnit: 'dBi' };
    return 'dBi for gain';
  }
  if (unit === 'dBm' || unit === 'mW' || unit === 'W') return { fileUnit: unit, valueUnit: 'dBm' };
  return `dBm, mW or W for ${power ? 'power' : quantity}`;
}

function fieldPlan(n: number, names: string[]): FieldPlan {
  return { kinds: new Uint8Array(n), slots: new Int32Array(n).fill(-1), names, numCount: 0, keyCount: 0 };
}

function addField(fp: FieldPlan, index: number, kind: typeof NUM | typeof KEY): number {
  fp.kinds[index] = kind;
  const slot = kind === NUM ? fp.numCount++ : fp.keyCount++;
  fp.slots[index] = slot;
  return slot;
}

/** Resolve the quantity: option > job > columns > metadata > assumed eirp (with a warning). */
function resolveQuantity(
  ctx: PlanContext,
  fromColumns: Quantity | undefined,
  columnName: string | undefined,
  warnings: Warning[],
): Quantity | InputError {
  const meta = metadataQuantity(ctx.metadata);
  if (ctx.quantityOverride) return ctx.quantityOverride;
  if (ctx.job?.quantity) return ctx.job.quantity;
  if (fromColumns && meta.quantity && meta.quantity !== fromColumns) {
    const line = ctx.metadataLines.quantity ?? 1;
    return inputError(ctx.file, line, 1, 'quantity', meta.quantity, `'${fromColumns}' to agree with column '${columnName}'`);
  }
  if (fromColumns) return fromColumns;
  if (meta.quantity) return meta.quantity;
  warnings.push(
    warning('quantity-assumed', `no quantity named; assumed eirp (dBm)`, { file: ctx.file }),
  );
  return 'eirp';
}

/**
 * Understand a header row: the layout (long or matrix), which column means what, units,
 * quantity and angle convention. Problems come back as input errors at the header line.
 * Cost O(columns).
 */
export function planColumns(cells: string[], ctx: PlanContext): ColumnPlanResult {
  const parsed = cells.map(parseHeaderCell);
  const errors: InputError[] = [];
  const warnings: Warning[] = [];
  const col = (i: number): number => ctx.cellCols[i] ?? 1;
  const headerErr = (expected: string): ColumnPlanResult =>
    fail([inputError(ctx.file, ctx.headerLine, 1, 'header', ctx.headerText, expected)]);

  // Matrix layout: first cell names the row angle, every other cell is a column angle.
  const first = parsed[0]?.base.split(/[\\/]/) ?? [];
  const rowName = first[0];
  if (cells.length >= 2 && (rowName === 'theta' || rowName === 'el' || rowName === 'elevation')) {
    const colAngles = cells.slice(1).map((c) => parseNumberText(c, ctx.decimalComma));
    if (colAngles.every((a) => typeof a === 'number')) {
      return planMatrix(cells, parsed[0].unit, rowName === 'theta' ? 'theta-phi' : 'az-el', colAngles as number[], ctx);
    }
  }

  const roles: (ColumnRole | null)[] = parsed.map((p) => roleOfName(p.base)?.role ?? null);
  const quantities: (Quantity | undefined)[] = parsed.map((p) => roleOfName(p.base)?.quantity);
  const mapped = ctx.job?.columns ?? {};
  for (const [role, name] of Object.entries(mapped) as [ColumnRole, string][]) {
    const idx = cells.findIndex((c) => c.trim().toLowerCase() === name.trim().toLowerCase());
    if (idx < 0) {
      errors.push(
        inputError(ctx.file, ctx.headerLine, 1, 'header', ctx.headerText, `a column '${name}' (columns.${role} in the job file)`),
      );
      continue;
    }
    for (let i = 0; i < roles.length; i++) if (roles[i] === role) roles[i] = null;
    roles[idx] = role;
    if (VALUE_ROLES.includes(role)) quantities[idx] = roleOfName(parsed[idx].base)?.quantity;
  }
  if (errors.length) return fail(errors);
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
  let angleConvention: 'theta-phi' | 'az-el';
  let a1: number;
  let a2: number;
  if (find('theta') >= 0 && find('phi') >= 0) {
    angleConvention = 'theta-phi';
    [a1, a2] = [find('theta'), find('phi')];
  } else if (find('azimuth') >= 0 && find('elevation') >= 0) {
    angleConvention = 'az-el';
    [a1, a2] = [find('elevation'), find('azimuth')];
  } else {
    return headerErr(
      'theta and phi (or azimuth and elevation) columns for the long layout, or a matrix header ' +
        "'theta,<phi values…>'; map columns in the job file (columns:) if the names differ",
    );
  }
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
      return fail([inputError(ctx.file, ctx.headerLine, col(half), cells[half].trim(), cells[half].trim(),
        `both polarizations (${parsed[half].base.replace(/_(theta|th|phi|ph)$/, '')}_theta and _phi), or a pol column with a total value column`)]);
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
    const q = resolveQuantity(ctx, colQuantity, cells[valueFields[0]].trim(), warnings);
    if (typeof q !== 'string') return fail([q]);
    quantity = q;
  }
  const units = valueFields.map((i) => parsed[i].unit);
  if (units.length === 2 && units[0] !== units[1]) {
    return fail([inputError(ctx.file, ctx.headerLine, col(valueFields[1]), cells[valueFields[1]].trim(), units[1] ?? 'no unit',
      `the unit of '${cells[valueFields[0]].trim()}' (${units[0] ?? 'no unit'})`)]);
  }
  const writtenUnit = units[0] ?? ctx.job?.valueUnit ?? metadataQuantity(ctx.metadata).unit ?? (quantity === 'gain' && !power ? 'dBi' : 'dBm');
  const checked = checkValueUnit(quantity, power, writtenUnit);
  if (typeof checked === 'string') {
    return fail([inputError(ctx.file, ctx.headerLine, col(valueFields[0]), cells[valueFields[0]].trim(), writtenUnit, checked)]);
  }

  const fp = fieldPlan(cells.length, cells.map((c) => c.trim()));
  addField(fp, a1, NUM);
  addField(fp, a2, NUM);
  for (const v of valueFields) addField(fp, v, NUM);
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
  return {
    plan: {
      layout: 'long', columns, fields: fp, quantity, valueUnit: checked.valueUnit, fileValueUnit: checked.fileUnit,
      angleConvention, angleUnit, power, pairValues: valueFields.length === 2, freqSlot, freqFactor, unitKey, beamKey, polKey,
    },
    warnings,
    errors: [],
  };
}

function planMatrix(
  cells: string[],
  unit: string | null,
  angleConvention: 'theta-phi' | 'az-el',
  colAngles: number[],
  ctx: PlanContext,
): ColumnPlanResult {
  const warnings: Warning[] = [];
  const q = resolveQuantity(ctx, undefined, undefined, warnings);
  if (typeof q !== 'string') return fail([q]);
  const writtenUnit = ctx.job?.valueUnit ?? metadataQuantity(ctx.metadata).unit ?? (q === 'gain' ? 'dBi' : 'dBm');
  const checked = checkValueUnit(q, false, writtenUnit);
  if (typeof checked === 'string') {
    const line = ctx.metadataLines.quantity ?? ctx.headerLine;
    return fail([inputError(ctx.file, line, 1, 'quantity', writtenUnit, checked)]);
  }
  const fp = fieldPlan(cells.length, cells.map((c, i) => (i === 0 ? c.trim() : `${angleConvention === 'az-el' ? 'az' : 'phi'}=${c.trim()}`)));
  for (let i = 0; i < cells.length; i++) addField(fp, i, NUM);
  const angleUnit = ctx.job?.angles?.unit ?? (unit === 'rad' ? 'rad' : 'deg');
  const columns: ColumnInfo[] = cells.map((c, i) => ({ index: i, name: c.trim(), role: i === 0 ? 'matrix-angle' : 'value', unit: i === 0 ? unit : null }));
  return {
    plan: {
      layout: 'matrix', columns, fields: fp, quantity: q, valueUnit: checked.valueUnit, fileValueUnit: checked.fileUnit,
      angleConvention, angleUnit, power: false, colAnglesRaw: colAngles,
    },
    warnings,
    errors: [],
  };
}
