/**
 * Figures the reliability tests measure (files fuzzed, kills survived, peak memory), appended
 * as JSON lines to $SPHERECOV_FIGURES when set (scripts/soak.mjs prints them), else dropped.
 * SOAK is true under `npm run soak`, which scales the sizes up to the full ones.
 */
import { appendFileSync } from 'node:fs';

export const SOAK = process.env.SPHERECOV_SOAK === '1';

export function recordFigure(name: string, value: unknown): void {
  const file = process.env.SPHERECOV_FIGURES;
  if (file) appendFileSync(file, JSON.stringify({ name, value }) + '\n');
}
