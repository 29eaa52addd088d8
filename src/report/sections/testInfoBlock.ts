import type { TestInfo } from '../../types.js';
import { contentWidth, keyValues, MARGIN, MUTED, type Doc } from '../pdfDoc.js';

/** Labels of the keys the README names; any other snake_case key reads as its words. */
const LABELS: Record<string, string> = {
  chamber: 'Chamber',
  operator: 'Operator',
  date_measured: 'Date measured',
  dut_description: 'DUT description',
  notes: 'Notes',
};

/** The label of a `test_info:` key: `dut_description` → 'DUT description', `fixture_id` → 'Fixture id'. */
export function testInfoLabel(key: string): string {
  const words = key.replace(/_/g, ' ');
  return LABELS[key] ?? words.charAt(0).toUpperCase() + words.slice(1);
}

/**
 * The job file's test metadata on page 1 (unit report and build summary), values as written
 * (a block text keeps its line breaks; only the trailing line break of a YAML block is dropped).
 * Nothing is drawn without a `test_info:` block.
 */
export function testInfoBlock(doc: Doc, info: TestInfo | null | undefined): void {
  const entries = Object.entries(info ?? {});
  if (entries.length === 0) return;
  const w = contentWidth(doc);
  doc.font('B').fontSize(8.2).fillColor(MUTED).text('Test (from the job file, as written)', MARGIN.left, doc.y, { width: w });
  doc.y += 2;
  keyValues(doc, entries.map(([k, v]) => [testInfoLabel(k), v.replace(/\n$/, '')]), MARGIN.left, w, 100);
  doc.y += 4;
}
