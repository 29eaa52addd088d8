import { isLowerBetter } from '../../quantity.js';
import { formatMetric, metricLabel, metricsOfUnit, rowMetrics } from '../../metrics/catalogue.js';
import { divergingAt } from '../colorMap.js';
import { drawBoundaries, drawColorBar, drawMapFrame } from '../drawMap.js';
import { contentWidth, heading, note, table, type Column, type Doc } from '../pdfDoc.js';
import type { ReportSettings } from '../reportTypes.js';
import { DELTA_OUTLINE_DB, type UnitMaps } from '../unitMaps.js';
import type { UnitReportModel } from '../unitReportModel.js';
import { mapBoxFor } from './mapBox.js';

/** A list of (name, value) pairs set in three side-by-side column pairs to save space. */
function pairedTable(doc: Doc, entries: string[][], headers: [string, string]): void {
  const per = 3;
  const w = contentWidth(doc);
  const cols: Column[] = [];
  for (let k = 0; k < per; k++) cols.push({ header: headers[0], width: w / per - 62 }, { header: 'Δ', width: 62, align: 'right' });
  const rows: string[][] = [];
  const n = Math.ceil(entries.length / per);
  for (let r = 0; r < n; r++) rows.push([0, 1, 2].flatMap((k) => entries[r + k * n] ?? ['', '']));
  table(doc, cols, rows, { fontSize: 7.2 });
}

/** This unit's TSP minus the reference unit's, per direction, on a diverging map. */
function differenceMap(doc: Doc, model: UnitReportModel, maps: UnitMaps & { deltaPng: Buffer }, s: ReportSettings): void {
  const box = mapBoxFor(doc, 200);
  drawMapFrame(doc, box, maps.deltaPng, s.mapCenterPhiDeg);
  drawBoundaries(doc, box, maps.deltaEdges, maps.raster.width, maps.raster.height, '#444444', 0.5);
  const d = maps.deltaMaxDb;
  drawColorBar(doc, box.x + box.w + 26, box.y + 6, box.h - 12, divergingAt, [-d, -d / 2, 0, d / 2, d].map((v) => ({ t: 0.5 + v / (2 * d), value: v })), d / 2, 'Δ dB');
  doc.y = box.y + box.h + 14;
  const sense = isLowerBetter(model.result.quantity) ? 'For EIS a negative difference is better.' : 'Positive: this unit is stronger.';
  note(doc, `This unit's total scan pattern minus the reference's, per direction (same projection). ${sense} Outlined: directions where the difference exceeds ±${DELTA_OUTLINE_DB} dB (about the repeatability of an over-the-air measurement).`);
}

/** The difference to the reference unit: the map (when the reference's pattern was at hand) and every metric's delta, labelled from the catalogue. */
export function referenceSection(doc: Doc, model: UnitReportModel, maps: UnitMaps, s: ReportSettings): void {
  const r = model.result;
  const ref = r.reference;
  if (!ref) return;
  heading(doc, `Difference from the reference unit ${ref.unit}`, maps.deltaPng ? 300 : 60);
  if (maps.deltaPng) differenceMap(doc, model, maps as UnitMaps & { deltaPng: Buffer }, s);
  const entries = rowMetrics(metricsOfUnit(r)).filter(({ key }) => key in ref.deltas)
    .map(({ metric, key }) => [metricLabel(metric, r.valueUnit), formatMetric(metric, ref.deltas[key], 'delta')]);
  pairedTable(doc, entries, ['Metric', 'Δ (this − reference)']);
}
