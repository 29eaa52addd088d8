/**
 * The export layouts spherecov reads, in the order they are tried on a header. Adding a
 * layout: write its LayoutReader (one file, plus its sink) and list it here; the reader,
 * inspect and both parser paths need no change. The long layout comes last: it plans any
 * header or explains what it expected.
 */
import type { JobSpec } from '../types.js';
import type { LayoutReader, PlanContext, PlanResult } from './layoutTypes.js';
import { longLayout } from './longLayout.js';
import { matrixLayout } from './matrixLayout.js';
import { wideLayout } from './wideLayout.js';

export const LAYOUTS: readonly LayoutReader[] = [matrixLayout, wideLayout, longLayout];

/** Plan a header with the first layout that recognizes it (the long layout always answers). */
export function planLayout(cells: string[], ctx: PlanContext): PlanResult {
  for (const layout of LAYOUTS) {
    const r = layout.plan(cells, ctx);
    if (r) return r;
  }
  throw new Error('unreachable: the long layout plans every header');
}

/** Does this row look like the header of some layout (preamble detection)? */
export function isLayoutHeader(cells: string[], job?: JobSpec): boolean {
  return LAYOUTS.some((l) => l.isHeader(cells, job));
}
