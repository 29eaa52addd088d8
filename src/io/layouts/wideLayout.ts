/**
 * Wide layout: one row per direction, one value column per beam — `Beam 0 EIRP (dBm)`,
 * `Beam 1 EIRP (dBm)`, … — as spreadsheets and scripts write it; also two polarization columns
 * per beam (`Beam 0 EIRP theta (dBm)`, `Beam 0 EIRP co`, …) and a frequency per column block
 * (`28 GHz Beam 0 EIRP (dBm)`, `Beam 0 EIRP @ 28 GHz`). Beam ids (and block frequencies) come
 * from the headers; a unit or frequency column may stand beside the angles.
 */
import type { Quantity, Warning } from '../../types.js';
import { levelToDb } from './levelToDb.js';
import { warning } from '../../warnings.js';
import { roleOfName } from '../columnRoles.js';
import { addField, fieldPlan, KEY, NUM } from '../fieldPlan.js';
import { assumedFrequencyHz } from '../frequencyText.js';
import { parseHeaderCell } from '../headerCell.js';
import { polarizationBeams } from '../polarizationBeams.js';
import { ErrorList, inputError } from '../inputError.js';
import type { KeyTable } from '../keyTable.js';
import type { RowLocator } from '../rowSink.js';
import { SampleAccumulator } from '../sampleAccumulator.js';
import type { ColumnInfo, ColumnRole, JobSpec, RawBeam } from '../types.js';
import { halfPairExpected } from './longLayout.js';
import type { BeamContext, LayoutReader, LayoutSink, PlanContext, PlanFacts, PlanResult } from './layoutTypes.js';
import { angleColumns, assumedValueUnit, checkValueUnit, fail, FREQ_FACTORS, headerRoles, quantityOfFile, rolesForDetection } from './planParts.js';
import type { DropoutLog } from './dropoutLog.js';
import { RowAngles } from './rowAngles.js';

/** A header cell of the wide layout: beam id, block frequency, and the value it holds. */
export interface WideCell {
  beam: string;
  frequencyHz: number | null;
  role: 'value' | 'valueTheta' | 'valuePhi' | 'power';
  quantity?: Quantity;
  unit: string | null;
}

const FREQ_UNIT: Record<string, number> = { ghz: 1e9, mhz: 1e6 };

/**
 * Read a wide value header: a beam token (`beam 3`, `beam3`, `b3`), an optional frequency token
 * (`28 GHz`, `28.5GHz`, `@ 28 GHz`) and a value name the long layout knows (eirp, eirp_theta,
 * eis_co, power, rx_power, …), in any order; the unit in brackets or as a suffix.
 * @example wideCell('Beam 0 EIRP (dBm)') // { beam: '0', frequencyHz: null, role: 'value', quantity: 'eirp', unit: 'dBm' }
 */
export function wideCell(cell: string): WideCell | null {
  const h = parseHeaderCell(cell);
  const tokens = h.base.split(/[_@:]+/).filter((t) => t !== '');
  let beam: string | null = null;
  let frequencyHz: number | null = null;
  const rest: string[] = [];
  for (let i = 0; i < tokens.length; i++) {
    const t = tokens[i];
    const joined = /^(beam|b)(\d+)$/.exec(t);
    const f = /^(\d+(?:\.\d+)?)(ghz|mhz)$/.exec(t);
    if (beam === null && t === 'beam' && /^\d+$/.test(tokens[i + 1] ?? '')) beam = tokens[++i];
    else if (beam === null && joined) beam = joined[2];
    else if (frequencyHz === null && f) frequencyHz = Number(f[1]) * FREQ_UNIT[f[2]];
    else if (frequencyHz === null && /^\d+(\.\d+)?$/.test(t) && FREQ_UNIT[tokens[i + 1] ?? '']) frequencyHz = Number(t) * FREQ_UNIT[tokens[++i]];
    else rest.push(t);
  }
  if (beam === null || rest.length === 0) return null;
  const named = roleOfName(rest.join('_'));
  if (!named || !(named.role === 'value' || named.role === 'valueTheta' || named.role === 'valuePhi' || named.role === 'power')) return null;
  return { beam, frequencyHz, role: named.role, quantity: named.quantity, unit: h.unit };
}

/** One beam at one block frequency: its total column, or its two polarization columns. */
interface Block {
  beam: string;
  frequencyHz: number | null;
  total: number;
  first: number;
  second: number;
  /** Num slots of the value(s). */
  slotA: number;
  slotB: number;
}

export interface WidePlan extends PlanFacts {
  layout: 'wide';
  blocks: Block[];
  freqSlot: number;
  freqFactor: number | null;
  unitKey: number;
}

function planWide(cells: string[], ctx: PlanContext): PlanResult | null {
  const wide = cells.map(wideCell);
  if (!wide.some((w) => w !== null)) return null;
  const hr = headerRoles(cells, ctx);
  if (Array.isArray(hr)) return fail(hr);
  const { parsed, roles } = hr;
  for (let i = 0; i < roles.length; i++) if (wide[i] && roles[i] !== null) wide[i] = null; // mapped or named otherwise
  const angles = angleColumns(roles);
  if (!angles) return null;
  const col = (i: number): number => ctx.cellCols[i] ?? 1;
  const cellErr = (i: number, expected: string): PlanResult => fail([inputError(ctx.file, ctx.headerLine, col(i), cells[i].trim(), cells[i].trim(), expected)]);
  for (let i = 0; i < roles.length; i++) {
    const r = roles[i];
    if (r === 'beam') return cellErr(i, "beam ids either in a beam column (long layout) or in the value headers ('Beam 0 EIRP (dBm)', wide layout), not both");
    if (r === 'value' || r === 'valueTheta' || r === 'valuePhi' || r === 'power' || r === 'pol') {
      return cellErr(i, "value columns named per beam throughout ('Beam 0 EIRP (dBm)', wide layout), or one value column with a beam column (long layout)");
    }
    if (r !== null && roles.indexOf(r) < i) {
      return cellErr(i, `one column per role (a ${r} column is already '${cells[roles.indexOf(r)].trim()}', column ${roles.indexOf(r) + 1})`);
    }
  }

  // Blocks in header order; every value cell agrees on the quantity and the unit.
  const blocks: Block[] = [];
  const firstWide = wide.findIndex((w) => w !== null);
  const w0 = wide[firstWide]!;
  const kindOf = (w: WideCell): string => (w.role === 'power' ? 'power' : w.quantity ?? 'value');
  for (let i = 0; i < cells.length; i++) {
    const w = wide[i];
    if (!w) continue;
    if (kindOf(w) !== kindOf(w0)) return cellErr(i, `value columns of one quantity (also found '${cells[firstWide].trim()}')`);
    if (w.unit !== w0.unit) return cellErr(i, `the unit of '${cells[firstWide].trim()}' (${w0.unit ?? 'no unit'})`);
    let b = blocks.find((x) => x.beam === w.beam && x.frequencyHz === w.frequencyHz);
    if (!b) {
      b = { beam: w.beam, frequencyHz: w.frequencyHz, total: -1, first: -1, second: -1, slotA: -1, slotB: -1 };
      blocks.push(b);
    }
    const key = w.role === 'valueTheta' ? 'first' : w.role === 'valuePhi' ? 'second' : 'total';
    if (b[key] >= 0) return cellErr(i, `one column per beam, polarization and frequency (also '${cells[b[key]].trim()}', column ${b[key] + 1})`);
    b[key] = i;
  }
  for (const b of blocks) {
    if (b.total >= 0 && (b.first >= 0 || b.second >= 0)) {
      const i = Math.max(b.first, b.second);
      return cellErr(i, `either a total or two polarization columns for beam ${b.beam} (also '${cells[b.total].trim()}')`);
    }
    if (b.total < 0 && (b.first < 0 || b.second < 0)) {
      const half = b.first >= 0 ? b.first : b.second;
      return cellErr(half, halfPairExpected(parseHeaderCell(cells[half]).base));
    }
  }
  const blockFreq = blocks.some((b) => b.frequencyHz !== null);
  if (blockFreq && blocks.some((b) => b.frequencyHz === null)) {
    const i = [...blocks].find((b) => b.frequencyHz === null)!;
    const idx = i.total >= 0 ? i.total : i.first;
    return cellErr(idx, 'a frequency in every value header once one names it (e.g. \'28 GHz Beam 0 EIRP (dBm)\')');
  }
  const freqIdx = roles.indexOf('frequency');
  if (blockFreq && freqIdx >= 0) return cellErr(freqIdx, 'the frequency either in a column or in the value headers, not both');

  const warnings: Warning[] = [];
  const power = w0.role === 'power';
  let quantity: Quantity;
  if (power) {
    if (!ctx.job?.calibration) return cellErr(firstWide, 'a calibration table in the job file (calibration.table) to turn received power into EIRP');
    quantity = 'eirp';
  } else {
    const q = quantityOfFile(ctx, w0.quantity, cells[firstWide].trim(), warnings);
    if (typeof q !== 'string') return fail([q]);
    quantity = q;
  }
  const writtenUnit = w0.unit ?? ctx.job?.valueUnit ?? assumedValueUnit(quantity, power);
  const checked = checkValueUnit(quantity, power, writtenUnit);
  if (typeof checked === 'string') return fail([inputError(ctx.file, ctx.headerLine, col(firstWide), cells[firstWide].trim(), writtenUnit, checked)]);

  const fp = fieldPlan(cells.length, cells.map((c) => c.trim()));
  addField(fp, angles.a1, NUM);
  addField(fp, angles.a2, NUM);
  for (const b of blocks) {
    if (b.total >= 0) b.slotA = addField(fp, b.total, NUM, true);
    else {
      b.slotA = addField(fp, b.first, NUM, true);
      b.slotB = addField(fp, b.second, NUM, true);
    }
  }
  const freqSlot = freqIdx >= 0 ? addField(fp, freqIdx, NUM) : -1;
  let freqFactor: number | null = null;
  if (freqIdx >= 0) {
    const u = parsed[freqIdx].unit ?? ctx.job?.frequencyUnit ?? null;
    freqFactor = u ? FREQ_FACTORS[u] ?? null : null;
    if (u && freqFactor === null) return fail([inputError(ctx.file, ctx.headerLine, col(freqIdx), cells[freqIdx].trim(), u, 'a frequency unit Hz, MHz or GHz')]);
  }
  const unitIdx = roles.indexOf('unit');
  const unitKey = unitIdx >= 0 ? addField(fp, unitIdx, KEY) : -1;
  const angleUnit = ctx.job?.angles?.unit ?? (parsed[angles.a1].unit === 'rad' || parsed[angles.a2].unit === 'rad' ? 'rad' : 'deg');
  if (ctx.job?.angles?.convention && ctx.job.angles.convention !== angles.convention) {
    return fail([inputError(ctx.file, ctx.headerLine, 1, 'header', ctx.headerText,
      `${ctx.job.angles.convention === 'az-el' ? 'azimuth and elevation' : 'theta and phi'} columns (angles.convention in the job file)`)]);
  }
  const roleOf = (i: number): ColumnRole | null => {
    const w = wide[i];
    if (w) return w.role;
    return fp.kinds[i] === 0 ? null : roles[i];
  };
  const columns: ColumnInfo[] = cells.map((c, i) => ({ index: i, name: c.trim(), role: roleOf(i), unit: parsed[i].unit, ...(wide[i] ? { beam: wide[i]!.beam } : {}) }));
  for (const c of columns) if (c.role === null) warnings.push(warning('column-ignored', `column '${c.name}' not used`, { file: ctx.file }));
  const plan: WidePlan = {
    layout: 'wide', columns, fields: fp, quantity, valueUnit: checked.valueUnit, fileValueUnit: checked.fileUnit,
    angleConvention: angles.convention, angleUnit, power, blocks, freqSlot, freqFactor, unitKey,
  };
  return {
    planned: { facts: plan, info: {}, samplesPerRow: blocks.length, headerErrors: [], newSink: (s) => new WideSink(plan, s.file, s.errors, s.keys, s.dropouts) },
    warnings,
    errors: [],
  };
}

/** Per (unit, frequency-column value): one accumulator per block, and one more per pair block (its second component). */
interface RowGroup {
  unitId: number;
  freqRaw: number;
  accs: SampleAccumulator[];
  second: (SampleAccumulator | null)[];
}

/**
 * Wide rows → one sample group per beam block (and unit / frequency-column value). Angle checks
 * as in the long layout (RowAngles); linear power converted; both components of a polarization
 * pair kept and handed to polarizationBeams (one owner of how a pair combines). The first
 * block's accumulator is the template of all others, so the angles are stored once.
 */
class WideSink implements LayoutSink {
  rows = 0;
  private readonly angles: RowAngles;
  private readonly groups: RowGroup[] = [];
  private readonly byKey = new Map<string, RowGroup>();
  private last: RowGroup | null = null;
  private template: SampleAccumulator | null = null;
  private readonly values: Float64Array;
  private readonly seconds: Float64Array;

  constructor(
    private readonly plan: WidePlan,
    private readonly file: string,
    private readonly errors: ErrorList,
    private readonly keys: KeyTable,
    private readonly dropouts: DropoutLog,
  ) {
    this.angles = new RowAngles(plan.angleConvention, plan.angleUnit);
    this.values = new Float64Array(plan.blocks.length);
    this.seconds = new Float64Array(plan.blocks.length);
  }

  private err(line: number, f: number, loc: RowLocator, expected: string): void {
    this.errors.add(inputError(this.file, line, loc.col(f), this.plan.fields.names[f], loc.text(f).trim(), expected));
  }

  private field(slot: number): number {
    return this.plan.fields.slots.findIndex((s, i) => s === slot && this.plan.fields.kinds[i] === NUM);
  }

  private toDb(v: number, slot: number, line: number, loc: RowLocator): number | null {
    const db = levelToDb(v, this.plan.fileValueUnit);
    if (typeof db === 'number') return db;
    this.err(line, this.field(slot), loc, db);
    return null;
  }

  row(line: number, nums: Float64Array, keys: Int32Array, loc: RowLocator): void {
    const p = this.plan;
    const bad = this.angles.read(nums[0], nums[1]);
    if (bad !== 0) {
      this.err(line, this.field(bad - 1), loc, this.angles.expected(bad));
      return;
    }
    let freqRaw = NaN;
    if (p.freqSlot >= 0) {
      freqRaw = nums[p.freqSlot];
      if (!(freqRaw > 0)) {
        this.err(line, this.field(p.freqSlot), loc, 'a positive frequency');
        return;
      }
    }
    const unitId = p.unitKey >= 0 ? keys[p.unitKey] : -1;
    const values = this.values;
    const seconds = this.seconds;
    for (let k = 0; k < p.blocks.length; k++) {
      const b = p.blocks[k];
      if (nums[b.slotA] !== nums[b.slotA] || (b.slotB >= 0 && nums[b.slotB] !== nums[b.slotB])) {
        const missing = nums[b.slotA] !== nums[b.slotA] ? b.slotA : b.slotB;
        this.dropouts.add(line, p.fields.names[this.field(missing)], this.angles.thetaDeg, this.angles.phiDeg);
        values[k] = NaN; // missing sample of this beam
        continue;
      }
      const v = this.toDb(nums[b.slotA], b.slotA, line, loc);
      if (v === null) return;
      if (b.slotB >= 0) {
        const w = this.toDb(nums[b.slotB], b.slotB, line, loc);
        if (w === null) return;
        seconds[k] = w;
      }
      values[k] = v;
    }
    let g = this.last;
    if (g === null || g.unitId !== unitId || !(g.freqRaw === freqRaw || (freqRaw !== freqRaw && g.freqRaw !== g.freqRaw))) {
      g = this.group(unitId, freqRaw, line);
      this.last = g;
    }
    const t = this.angles.thetaDeg;
    const f = this.angles.phiDeg;
    for (let k = 0; k < values.length; k++) {
      if (values[k] !== values[k]) continue;
      g.accs[k].push(t, f, values[k]);
      g.second[k]?.push(t, f, seconds[k]);
    }
    this.rows++;
  }

  private group(unitId: number, freqRaw: number, line: number): RowGroup {
    const key = `${unitId}|${freqRaw}`;
    let g = this.byKey.get(key);
    if (!g) {
      const accs = this.plan.blocks.map(() => {
        const acc = new SampleAccumulator(this.template, line);
        this.template ??= acc;
        return acc;
      });
      const second = this.plan.blocks.map((b) => (b.slotB >= 0 ? new SampleAccumulator(this.template, line) : null));
      g = { unitId, freqRaw, accs, second };
      this.groups.push(g);
      this.byKey.set(key, g);
    }
    return g;
  }

  beams(ctx: BeamContext): { beams: RawBeam[] } {
    const p = this.plan;
    ctx.identity.beam = 'column';
    if (p.unitKey >= 0) ctx.identity.unit = 'column';
    if (p.freqSlot >= 0 || p.blocks.some((b) => b.frequencyHz !== null)) ctx.identity.frequency = 'column';
    let assumed = false;
    const beams: RawBeam[] = [];
    for (const g of this.groups) {
      let freqHz = ctx.fileFreqHz;
      if (p.freqSlot >= 0) {
        if (p.freqFactor !== null) freqHz = g.freqRaw * p.freqFactor;
        else {
          assumed = true;
          freqHz = assumedFrequencyHz(g.freqRaw);
        }
      }
      p.blocks.forEach((b, k) => {
        const acc = g.accs[k];
        const { thetaDeg, phiDeg, values } = acc.finish();
        const base = {
          ...ctx.base, unit: g.unitId >= 0 ? this.keys.names[p.unitKey][g.unitId] : ctx.fileUnit, beam: b.beam,
          frequencyHz: b.frequencyHz ?? freqHz, thetaDeg, phiDeg, firstLine: acc.firstLine,
        };
        const second = g.second[k];
        beams.push(...(second ? polarizationBeams(base, values, second.finish().values) : [{ ...base, values }]));
      });
    }
    if (assumed) {
      ctx.warnings.push(warning('frequency-unit-assumed', `frequency column without a unit; values below 1000 read as GHz, below 10^6 as MHz, else Hz`, { file: this.file }));
    }
    return { beams };
  }
}

/** The wide layout: angle columns and value columns that name their beam. */
export const wideLayout: LayoutReader = {
  name: 'wide',
  isHeader(cells: string[], job?: JobSpec): boolean {
    return angleColumns(rolesForDetection(cells, job)) !== null && cells.some((c) => wideCell(c) !== null);
  },
  plan: planWide,
};
