import { LINE_COLORS } from './colorMap.js';

/** Dash patterns (on, off … in points) combined with the line colours: solid, dashed, dotted, dash-dot. */
export const DASH_PATTERNS: number[][] = [[], [5, 2], [1.2, 1.6], [6, 2, 1.2, 2]];

/** Distinct styles before they repeat: every colour with every dash pattern. */
export const DISTINCT_LINE_STYLES = LINE_COLORS.length * DASH_PATTERNS.length;

/**
 * The style of the k-th overlaid curve (0-based): colours cycle first, then the dash pattern
 * changes, so the first 8 curves are solid and differ by colour, the next 8 are dashed, and so on;
 * styles repeat after DISTINCT_LINE_STYLES (32) curves (the legend's numbers still tell them apart).
 */
export function lineStyle(k: number): { color: string; dash: number[] } {
  const i = ((k % DISTINCT_LINE_STYLES) + DISTINCT_LINE_STYLES) % DISTINCT_LINE_STYLES;
  return { color: LINE_COLORS[i % LINE_COLORS.length], dash: DASH_PATTERNS[Math.floor(i / LINE_COLORS.length)] };
}
