import type { Quantity, UnitNotAnalyzed, UnitResult, ValueUnit } from '../types.js';
import type { CdfCurve } from './cdfCurve.js';
import { distinctLimitMarks } from './cdfLimitMarks.js';
import { lineStyle } from './lineStyles.js';
import type { LimitMark } from './plots.js';
import { getKeyed, unitKey, type BuildReportInput, type MapThumbnail } from './reportTypes.js';
import { valueScale, type ValueScale } from './unitMaps.js';

/** One row of the summary's units table; `number` is the key the CDF overlay's legend uses. */
export interface SummaryRow {
  number: number;
  unit: string;
  frequencyHz: number | null;
  /** The analyzed result, or null for a unit that could not be read or analyzed. */
  result: UnitResult | null;
  notAnalyzed: UnitNotAnalyzed | null;
}

/** One unit's curve on the overlay, in the style its legend entry shows. */
export interface SummaryCurve {
  row: SummaryRow & { result: UnitResult };
  curve: CdfCurve;
  color: string;
  dash: number[];
}

/** Everything summary.pdf draws, computed before any section renders. */
export interface SummaryModel {
  quantity: Quantity;
  valueUnit: ValueUnit;
  rows: SummaryRow[];
  curves: SummaryCurve[];
  limits: LimitMark[];
  /** Each analyzed unit's map thumbnail, in the units table's order. */
  thumbnails: { row: SummaryRow & { result: UnitResult }; thumbnail: MapThumbnail }[];
  /** One colour scale for every thumbnail (null without thumbnails). */
  thumbnailScale: ValueScale | null;
}

const byUnitThenFrequency = (a: SummaryRow, c: SummaryRow): number =>
  a.unit < c.unit ? -1 : a.unit > c.unit ? 1 : (a.frequencyHz ?? -1) - (c.frequencyHz ?? -1);

/** The rows of the units table, analyzed and not, sorted by unit and frequency and numbered from 1. */
function summaryRows(input: BuildReportInput): SummaryRow[] {
  const rows: SummaryRow[] = [
    ...input.units.map((u) => ({ number: 0, unit: u.unit, frequencyHz: u.frequencyHz, result: u, notAnalyzed: null })),
    ...(input.unitsNotAnalyzed ?? []).map((e) => ({ number: 0, unit: e.unit, frequencyHz: e.frequencyHz, result: null, notAnalyzed: e })),
  ];
  rows.sort(byUnitThenFrequency);
  rows.forEach((r, k) => (r.number = k + 1));
  return rows;
}

/** Smallest and largest finite value over every thumbnail ([0, 1] when none is finite). */
function thumbnailRange(thumbs: MapThumbnail[]): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const t of thumbs) for (const v of t.values) if (Number.isFinite(v)) {
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  return Number.isFinite(lo) ? [lo, hi] : [0, 1];
}

/**
 * The build summary's model: numbered rows, each analyzed unit's curve with its own line style
 * (the k-th curve drawn gets lineStyle(k)), the distinct limits, and the thumbnails on one scale.
 */
export function buildSummaryModel(input: BuildReportInput): SummaryModel {
  const quantity = input.units[0]?.quantity ?? 'eirp';
  const rows = summaryRows(input);
  const key = (u: UnitResult) => unitKey(u.unit, u.frequencyHz, u.quantity);
  const curves: SummaryCurve[] = [];
  for (const row of rows) {
    const curve = row.result ? getKeyed<CdfCurve>(input.cdfs, key(row.result)) : undefined;
    if (row.result && curve) curves.push({ row: row as SummaryCurve['row'], curve, ...lineStyle(curves.length) });
  }
  const thumbnails = rows.flatMap((row) => {
    const t = row.result ? getKeyed(input.thumbnails, key(row.result)) : undefined;
    return row.result && t ? [{ row: row as SummaryCurve['row'], thumbnail: t }] : [];
  });
  const [lo, hi] = thumbnailRange(thumbnails.map((t) => t.thumbnail));
  return {
    quantity, valueUnit: input.units[0]?.valueUnit ?? 'dBm', rows, curves, limits: distinctLimitMarks(input.units), thumbnails,
    thumbnailScale: thumbnails.length ? valueScale(lo, hi, quantity) : null,
  };
}
