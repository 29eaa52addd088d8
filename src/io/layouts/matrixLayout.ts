/**
 * Matrix layout: the header's first cell names the row angle (θ or el), the other cells are
 * column-angle values (φ or az); each row starts with its row angle; one beam a file; the
 * quantity from a `# quantity: eirp dBm` line, the job file or the option. CONTRACT.md "Matrix layout".
 */
import type { InputError, Warning } from '../../types.js';
import { addField, fieldPlan, NUM } from '../fieldPlan.js';
import { parseHeaderCell } from '../headerCell.js';
import { inputError } from '../inputError.js';
import { parseNumberText } from '../numberText.js';
import type { ColumnInfo, RawBeam } from '../types.js';
import type { BeamContext, LayoutReader, LayoutSink, MatrixPlan, PlanContext, PlanResult } from './layoutTypes.js';
import { MatrixSink } from './matrixSink.js';
import { assumedValueUnit, checkValueUnit, fail, metadataQuantity, quantityOfFile } from './planParts.js';

/** Row-angle name of a matrix corner cell ('theta', 'el', 'elevation', also 'theta\\phi'), or null. */
function cornerName(cell: string): 'theta' | 'el' | 'elevation' | null {
  const name = parseHeaderCell(cell).base.split(/[\\/]/)[0];
  return name === 'theta' || name === 'el' || name === 'elevation' ? name : null;
}

/** Column angles of a matrix header, or null when a cell is not a number. */
function columnAngles(cells: string[], decimalComma: boolean): number[] | null {
  const a = cells.slice(1).map((c) => parseNumberText(c, decimalComma));
  return a.every((x) => typeof x === 'number') ? (a as number[]) : null;
}

function planMatrix(cells: string[], ctx: PlanContext): PlanResult | null {
  const rowName = cornerName(cells[0] ?? '');
  if (cells.length < 2 || rowName === null) return null;
  const colAngles = columnAngles(cells, ctx.decimalComma);
  if (colAngles === null) return null;
  const angleConvention = rowName === 'theta' ? 'theta-phi' : 'az-el';
  const unit = parseHeaderCell(cells[0]).unit;
  const warnings: Warning[] = [];
  const q = quantityOfFile(ctx, undefined, undefined, warnings);
  if (typeof q !== 'string') return fail([q]);
  const writtenUnit = ctx.job?.valueUnit ?? metadataQuantity(ctx.metadata).unit ?? assumedValueUnit(q, false);
  const checked = checkValueUnit(q, false, writtenUnit);
  if (typeof checked === 'string') {
    const line = ctx.metadataLines.quantity ?? ctx.headerLine;
    return fail([inputError(ctx.file, line, 1, 'quantity', writtenUnit, checked)]);
  }
  const fp = fieldPlan(cells.length, cells.map((c, i) => (i === 0 ? c.trim() : `${angleConvention === 'az-el' ? 'az' : 'phi'}=${c.trim()}`)));
  for (let i = 0; i < cells.length; i++) addField(fp, i, NUM, i > 0);
  const angleUnit = ctx.job?.angles?.unit ?? (unit === 'rad' ? 'rad' : 'deg');
  const columns: ColumnInfo[] = cells.map((c, i) => ({ index: i, name: c.trim(), role: i === 0 ? 'matrix-angle' : 'value', unit: i === 0 ? unit : null }));
  const plan: MatrixPlan = {
    layout: 'matrix', columns, fields: fp, quantity: q, valueUnit: checked.valueUnit, fileValueUnit: checked.fileUnit,
    angleConvention, angleUnit, power: false, colAnglesRaw: colAngles,
  };
  return {
    planned: {
      facts: plan, info: { matrixColumnsDeg: colAngles }, samplesPerRow: colAngles.length, headerErrors: columnErrors(plan, cells, ctx),
      newSink: (s) => new MatrixLayoutSink(plan, s.file, s.errors, s.firstDataLine, s.dropouts),
    },
    warnings,
    errors: [],
  };
}

/** Column angles outside −180…360° (after a radian conversion), located at their header cells. */
function columnErrors(plan: MatrixPlan, cells: string[], ctx: PlanContext): InputError[] {
  const f = plan.angleUnit === 'rad' ? 180 / Math.PI : 1;
  const out: InputError[] = [];
  plan.colAnglesRaw.forEach((a, i) => {
    const deg = a * f;
    if (!(deg >= -180 - 1e-9 && deg <= 360 + 1e-9)) {
      const what = plan.angleConvention === 'az-el' ? 'azimuth' : 'phi';
      out.push(inputError(ctx.file, ctx.headerLine, ctx.cellCols[i + 1], 'header', cells[i + 1].trim(), `${what} between -180 and 360 degrees`));
    }
  });
  return out;
}

class MatrixLayoutSink extends MatrixSink implements LayoutSink {
  beams(ctx: BeamContext): { beams: RawBeam[] } {
    return { beams: [{ ...ctx.base, unit: ctx.fileUnit, beam: ctx.fileBeam, frequencyHz: ctx.fileFreqHz, ...this.acc.finish(), firstLine: this.acc.firstLine }] };
  }
}

/** The matrix layout: recognized by its corner cell and numeric column headers. */
export const matrixLayout: LayoutReader = {
  name: 'matrix',
  isHeader(cells: string[]): boolean {
    return cells.length >= 2 && cornerName(cells[0]) !== null && columnAngles(cells, true) !== null;
  },
  plan: planMatrix,
};
