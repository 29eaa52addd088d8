import type { CheckResult, UnitResult } from '../../types.js';
import { fmt, pct } from '../format.js';
import { contentWidth, heading, note, table, type Column, type Doc } from '../pdfDoc.js';

/** A check's value or limit in its own unit: % of 4π for coverage checks (margin unit 'fraction'), else dB-valued. */
export function checkValue(c: CheckResult, v: number | null, unit: string): string {
  if (v === null) return '—';
  return c.marginUnit === 'fraction' ? pct(v) : `${fmt(v)} ${unit}`;
}

const resultText = (c: CheckResult): string => (c.status === 'pass' ? '✓ pass' : c.status === 'fail' ? '✗ FAIL' : 'not evaluable');

/** One check row: name (with the failing beam of a per-beam check), value, limit, tolerance, judged-at limit, margin, result. */
function checkRow(c: CheckResult, unit: string): string[] {
  return [
    c.beam !== undefined ? `${c.name} (beam ${c.beam}${c.status === 'fail' ? ', failing' : ''})` : c.name,
    checkValue(c, c.value, unit),
    checkValue(c, c.limit, unit),
    `${fmt(c.toleranceDb)} dB`,
    checkValue(c, c.effectiveLimit, unit),
    c.margin === null ? '—' : c.marginUnit === 'fraction' ? `${fmt(100 * c.margin, 1)} pt` : `${fmt(c.margin)} dB`,
    resultText(c),
  ];
}

/** Every check with its margin; failed checks in bold; notes and the limit set's source below. */
export function checksSection(doc: Doc, r: UnitResult): void {
  if (r.checks.length === 0) return;
  heading(doc, 'Checks', 40);
  const w = contentWidth(doc);
  const cols: Column[] = [
    { header: 'Check', width: w - 382 },
    { header: 'Value', width: 68, align: 'right' },
    { header: 'Limit', width: 62, align: 'right' },
    { header: 'Test tol.', width: 50, align: 'right' },
    { header: 'Judged at', width: 62, align: 'right' },
    { header: 'Margin', width: 72, align: 'right' },
    { header: 'Result', width: 68, align: 'center' },
  ];
  table(doc, cols, r.checks.map((c) => checkRow(c, r.valueUnit)), { emphasis: (k) => r.checks[k].status === 'fail' });
  note(doc, 'Margin > 0: better than the limit relaxed by the test tolerance ("judged at"). Coverage margins are percentage points of 4π.' + (r.limitSet ? ` Limit set source: ${r.limitSet.source}.` : ''));
  for (const c of r.checks.filter((k) => k.note || k.source)) note(doc, `${c.name}: ${[c.note, c.source].filter(Boolean).join('; ')}`);
}
