import type { UnitResult } from '../../types.js';
import { contentWidth, heading, table, type Doc } from '../pdfDoc.js';

/** The input files with the first 12 hex digits of their sha256. */
export function filesSection(doc: Doc, r: UnitResult): void {
  heading(doc, 'Input files', 30);
  const w = contentWidth(doc);
  table(doc, [{ header: 'File', width: w - 90 }, { header: 'sha256 (first 12)', width: 90 }], r.sources.map((f) => [f.path, f.sha256.slice(0, 12)]), { fontSize: 7.4 });
}
