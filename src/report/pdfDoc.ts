import { PDFDocument, reportFontSources, shareLayoutCaches } from './fonts.js';
import type { ReportSettings } from './reportTypes.js';
import { CAUTION } from './caution.js';

/** A pdfkit document (typed through the module import, never pdfkit's global namespace). */
export type Doc = InstanceType<typeof PDFDocument>;

export { CAUTION } from './caution.js';

export const INK = '#1a1a1a';
export const MUTED = '#5a5a5a';
export const RULE = '#b0b0b0';
export const MARGIN = { top: 46, bottom: 58, left: 48, right: 48 };

/** A new report document: fonts embedded, fixed creation date (no other varying bytes). */
export function createDoc(settings: ReportSettings, generatedAt: string, title: string, subject: string): Doc {
  const created = new Date(settings.creationDate ?? generatedAt);
  const doc = new PDFDocument({
    size: settings.pageSize === 'Letter' ? 'LETTER' : 'A4',
    margins: MARGIN,
    bufferPages: true,
    autoFirstPage: true,
    info: {
      Title: title,
      Subject: subject,
      Author: settings.organisation || 'spherecov',
      Creator: 'spherecov',
      Producer: 'spherecov (pdfkit)',
      CreationDate: Number.isNaN(created.getTime()) ? new Date(0) : created,
    },
  });
  const fonts = reportFontSources();
  doc.registerFont('R', fonts.regular);
  doc.registerFont('B', fonts.bold);
  shareLayoutCaches(doc, ['B', 'R']);
  doc.font('R').fontSize(9).fillColor(INK);
  return doc;
}

/** Collect the document's bytes. */
export function finish(doc: Doc): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.end();
  });
}

export const contentWidth = (doc: Doc) => doc.page.width - MARGIN.left - MARGIN.right;
export const bottomY = (doc: Doc) => doc.page.height - MARGIN.bottom;

/** Start a new page unless `height` points still fit below the cursor. */
export function ensureSpace(doc: Doc, height: number): void {
  if (doc.y + height > bottomY(doc)) {
    doc.addPage();
    doc.y = MARGIN.top;
  }
}

/** A section heading with a rule under it. */
export function heading(doc: Doc, text: string, minBelow = 60): void {
  ensureSpace(doc, 24 + minBelow);
  const y = doc.y + 4;
  doc.font('B').fontSize(11.5).fillColor(INK).text(text, MARGIN.left, y, { lineBreak: false });
  doc.moveTo(MARGIN.left, y + 15).lineTo(MARGIN.left + contentWidth(doc), y + 15).lineWidth(0.6).strokeColor(RULE).stroke();
  doc.font('R').fontSize(9);
  doc.y = y + 21;
}

/** A short explanatory paragraph in muted text. */
export function note(doc: Doc, text: string, width = contentWidth(doc)): void {
  doc.font('R').fontSize(8).fillColor(MUTED).text(text, MARGIN.left, doc.y, { width });
  doc.fillColor(INK).fontSize(9);
  doc.y += 3;
}

/** Footer on every buffered page: caution, unit label, page n of N. */
export function addFooters(doc: Doc, label: string): void {
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const saved = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    const y = doc.page.height - MARGIN.bottom + 14;
    const w = contentWidth(doc);
    doc.moveTo(MARGIN.left, y - 5).lineTo(MARGIN.left + w, y - 5).lineWidth(0.5).strokeColor(RULE).stroke();
    doc.font('R').fontSize(6.8).fillColor(MUTED);
    doc.text(CAUTION, MARGIN.left, y, { width: w - 110, lineGap: 0.5 });
    doc.font('B').fontSize(7.5).fillColor(INK);
    doc.text(`page ${i - range.start + 1} of ${range.count}`, MARGIN.left + w - 105, y, { width: 105, align: 'right', lineBreak: false });
    doc.font('R').fontSize(6.8).fillColor(MUTED);
    doc.text(label, MARGIN.left + w - 160, y + 10, { width: 160, align: 'right', lineBreak: false });
    doc.page.margins.bottom = saved;
  }
}

export interface Column {
  header: string;
  width: number;
  align?: 'left' | 'right' | 'center';
}

/**
 * A ruled table that continues on the next page (repeating its header) when it runs out of room.
 * `emphasis(row)` prints a row in bold (e.g. failed checks).
 */
export function table(doc: Doc, cols: Column[], rows: string[][], opts: { fontSize?: number; emphasis?: (r: number) => boolean; x?: number } = {}): void {
  const fs = opts.fontSize ?? 8.2;
  const rowH = fs + 5.2;
  const x0 = opts.x ?? MARGIN.left;
  const total = cols.reduce((s, c) => s + c.width, 0);
  const drawHeader = () => {
    const y = doc.y;
    doc.rect(x0, y, total, rowH + 1).fill('#ececec');
    doc.font('B').fontSize(fs).fillColor(INK);
    let x = x0;
    for (const c of cols) {
      oneLine(doc, c.header, x + 3, y + 3, c.width - 6, c.align ?? 'left');
      x += c.width;
    }
    doc.y = y + rowH + 1;
  };
  ensureSpace(doc, 2 * rowH + 2);
  drawHeader();
  rows.forEach((row, r) => {
    // Long cells (check names, file paths) wrap inside their column; the row grows to fit them.
    doc.font(opts.emphasis?.(r) ? 'B' : 'R').fontSize(fs);
    const cellH = cols.map((c, k) => doc.heightOfString(row[k] ?? '', { width: c.width - 6 }));
    const h = Math.max(rowH, Math.max(...cellH) + 5.2);
    if (doc.y + h > bottomY(doc)) {
      doc.addPage();
      doc.y = MARGIN.top;
      drawHeader();
    }
    const y = doc.y;
    if (r % 2 === 1) doc.rect(x0, y, total, h).fill('#f7f7f7');
    doc.font(opts.emphasis?.(r) ? 'B' : 'R').fontSize(fs).fillColor(INK);
    let x = x0;
    cols.forEach((c, k) => {
      doc.text(row[k] ?? '', x + 3, y + 2.6, { width: c.width - 6, align: c.align ?? 'left' });
      x += c.width;
    });
    doc.y = y + h;
  });
  doc.moveTo(x0, doc.y).lineTo(x0 + total, doc.y).lineWidth(0.5).strokeColor(RULE).stroke();
  doc.font('R').fontSize(9);
  doc.y += 6;
}

/** Two-column key/value list. */
export function keyValues(doc: Doc, pairs: [string, string][], x: number, width: number, keyWidth = 110): void {
  for (const [k, v] of pairs) {
    const y = doc.y;
    doc.font('B').fontSize(8.2).fillColor(MUTED).text(k, x, y, { width: keyWidth - 4, lineBreak: false, ellipsis: true });
    doc.font('R').fontSize(8.2).fillColor(INK).text(v, x + keyWidth, y, { width: width - keyWidth });
    doc.y = Math.max(doc.y, y + 11.5);
  }
}

/**
 * Text on one line inside `width`, cut with an ellipsis when longer. pdfkit wraps any text given
 * a width (lineBreak: false does not stop it); a height under two lines makes it cut instead.
 */
export function oneLine(doc: Doc, text: string, x: number, y: number, width: number, align: 'left' | 'right' | 'center' = 'left'): void {
  doc.text(text, x, y, { width, height: doc.currentLineHeight(true) * 1.5, ellipsis: true, align });
}
