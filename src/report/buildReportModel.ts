import type { Quantity, UnitNotAnalyzed, UnitResult, ValueUnit } from '../types.js';
import { QUANTITIES, quantityLabel, quantityUnit } from '../quantity.js';
import type { CdfCurve } from './cdfCurve.js';
import { distinctLimitMarks } from './cdfLimitMarks.js';
import { lineStyle } from './lineStyles.js';
import type { LimitMark } from './plots.js';
import { getKeyed, unitKey, type BuildReportInput, type MapThumbnail } from './reportTypes.js';
import { valueScale, type ValueScale } from './valueScale.js';

/** One row of the summary's units table; `number` is the key the CDF overlay's legend uses. */
export interface SummaryRow {
  number: number;
  unit: string;
  /** The unit as the key and titles name it: with its quantity when the build mixes quantities (a unit measured both ways). */
  name: string;
  frequencyHz: number | null;
  /** The analyzed result, or null for a unit that could not be read or analyzed. */
  result: UnitResult | null;
  notAnalyzed: UnitNotAnalyzed | null;
}

type AnalyzedRow = SummaryRow & { result: UnitResult };

/** One unit's curve on the overlay, in the style its legend entry shows. */
export interface SummaryCurve {
  row: AnalyzedRow;
  curve: CdfCurve;
  color: string;
  dash: number[];
}

/** The units of one quantity: their own overlay (CDF or CCDF, their limits) and thumbnails on their own colour scale. */
export interface QuantityGroup {
  quantity: Quantity;
  valueUnit: ValueUnit;
  curves: SummaryCurve[];
  limits: LimitMark[];
  thumbnails: { row: AnalyzedRow; thumbnail: MapThumbnail }[];
  /** One colour scale for the group's thumbnails (null without thumbnails). */
  thumbnailScale: ValueScale | null;
}

/** Everything summary.pdf draws, computed before any section renders. */
export interface SummaryModel {
  /** The quantities in the build, in QUANTITIES order (eirp first when there are no units). */
  quantities: Quantity[];
  rows: SummaryRow[];
  groups: QuantityGroup[];
}

const byUnitThenFrequency = (a: SummaryRow, c: SummaryRow): number =>
  a.unit < c.unit ? -1 : a.unit > c.unit ? 1 : (a.frequencyHz ?? -1) - (c.frequencyHz ?? -1);

/** The rows of the units table, analyzed and not, sorted by unit and frequency and numbered from 1. */
function summaryRows(input: BuildReportInput, mixed: boolean): SummaryRow[] {
  const rows: SummaryRow[] = [
    ...input.units.map((u) => ({ number: 0, unit: u.unit, name: mixed ? `${u.unit} (${quantityLabel(u.quantity)})` : u.unit, frequencyHz: u.frequencyHz, result: u, notAnalyzed: null })),
    ...(input.unitsNotAnalyzed ?? []).map((e) => ({ number: 0, unit: e.unit, name: e.unit, frequencyHz: e.frequencyHz, result: null, notAnalyzed: e })),
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

/** One quantity's overlay curves (the k-th gets lineStyle(k)), limits and thumbnails on one scale. */
function quantityGroup(input: BuildReportInput, rows: SummaryRow[], quantity: Quantity): QuantityGroup {
  const own = rows.filter((r): r is AnalyzedRow => r.result !== null && r.result.quantity === quantity);
  const key = (u: UnitResult) => unitKey(u.unit, u.frequencyHz, u.quantity);
  const curves: SummaryCurve[] = [];
  for (const row of own) {
    const curve = getKeyed<CdfCurve>(input.cdfs, key(row.result));
    if (curve) curves.push({ row, curve, ...lineStyle(curves.length) });
  }
  const thumbnails = own.flatMap((row) => {
    const t = getKeyed(input.thumbnails, key(row.result));
    return t ? [{ row, thumbnail: t }] : [];
  });
  const [lo, hi] = thumbnailRange(thumbnails.map((t) => t.thumbnail));
  return {
    quantity, valueUnit: own[0]?.result.valueUnit ?? quantityUnit(quantity), curves,
    limits: distinctLimitMarks(own.map((r) => r.result)), thumbnails,
    thumbnailScale: thumbnails.length ? valueScale(lo, hi, quantity) : null,
  };
}

/**
 * The build summary's model: numbered rows and, per quantity in the build (a unit measured both
 * ways has an EIRP and an EIS result), its own overlay and thumbnails, since EIRP and EIS share
 * neither an axis sense nor a colour scale.
 */
export function buildSummaryModel(input: BuildReportInput): SummaryModel {
  const present = new Set(input.units.map((u) => u.quantity));
  const quantities = QUANTITIES.filter((q) => present.has(q));
  if (quantities.length === 0) quantities.push('eirp');
  const rows = summaryRows(input, quantities.length > 1);
  return { quantities, rows, groups: quantities.map((q) => quantityGroup(input, rows, q)) };
}
