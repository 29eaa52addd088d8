import { fmt, fmtFrequencyShort } from '../format.js';
import { contentWidth, heading, note, table, type Column, type Doc } from '../pdfDoc.js';
import { errorLocation, errorMessage, verdictWord, worstMarginText } from '../unitStatus.js';
import type { SummaryRow } from '../buildReportModel.js';

/** The cells of one row: an analyzed unit, or one that could not be read (verdict ERROR). */
function rowCells(row: SummaryRow): string[] {
  const u = row.result;
  if (!u) {
    const e = row.notAnalyzed!;
    return [`${row.number}`, e.unit, fmtFrequencyShort(e.frequencyHz), 'ERROR', '—', `not analyzed: ${errorLocation(e.error)}`, '—', '—'];
  }
  return [
    `${row.number}`, row.name, fmtFrequencyShort(u.frequencyHz), verdictWord(u.verdict),
    `${u.checks.filter((c) => c.status === 'pass').length} / ${u.checks.length}`, u.worstCheck?.name ?? '—', worstMarginText(u),
    u.grid.fullSphere ? 'full' : `partial: ${fmt((100 * u.solidAngleSr) / (4 * Math.PI), 1)} % measured`,
  ];
}

/** Every unit of the build, numbered (the CDF overlay's legend uses the numbers), failed and errored rows in bold. */
export function summaryUnits(doc: Doc, rows: SummaryRow[]): void {
  heading(doc, 'Units', 40);
  const w = contentWidth(doc);
  const cols: Column[] = [
    { header: '#', width: 20, align: 'right' },
    { header: 'Unit', width: w - 434 }, { header: 'Freq.', width: 46 }, { header: 'Verdict', width: 64 },
    { header: 'Passed', width: 40, align: 'right' }, { header: 'Worst check', width: 106 }, { header: 'Worst margin', width: 82, align: 'right' },
    { header: 'Sphere', width: 76 },
  ];
  table(doc, cols, rows.map(rowCells), { emphasis: (k) => rows[k].result === null || rows[k].result!.verdict === 'fail' });
  for (const e of rows.flatMap((r) => (r.notAnalyzed ? [r.notAnalyzed] : []))) {
    note(doc, `${e.unit} could not be read or analyzed: ${errorLocation(e.error)}: ${errorMessage(e.error)}` + (e.errorCount > 1 ? ` (${e.errorCount} errors in its files; all in results.json).` : '.'));
  }
  note(doc, 'Verdict: PASS every check passed; FAIL a check failed; NOT JUDGED no limit set, or a check could not be evaluated; ERROR the unit could not be read or analyzed (it counts in the build, never as passed). Worst margin: dB, or percentage points (pt) of 4π for a coverage check. #: the key of the CDF overlay.');
}
