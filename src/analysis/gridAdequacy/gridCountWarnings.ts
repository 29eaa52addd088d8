import type { GridKind, Quantity, Warning } from '../../types.js';
import { warning } from '../../warnings.js';

/**
 * 3GPP TS 38.521-2 Annex M.2.1.1 (PC1): beam-peak-search systematic error by number of grid
 * points, constant step / constant density (verify against the current release).
 */
export const PC1_SYSTEMATIC_ERROR = [
  { errorDb: 0.3, constantStep: 10226, constantDensity: 7000 },
  { errorDb: 0.5, constantStep: 7082, constantDensity: 4500 },
  { errorDb: 0.7, constantStep: 4902, constantDensity: 3000 },
] as const;

/** 3GPP TS 38.521-2 Annex M.2.1.3 (PC3): beam-peak-search minimum points (verify against the current release). */
export const PC3_MINIMUM = { constantStep: 1106, constantDensity: 800 } as const;

/**
 * The grid-count facts of 3GPP's FR2 beam-peak search as typed warnings, for EIRP units:
 * - power class 3 (the default when none is named): fewer than 1,106 points on a constant-step
 *   grid or 800 on a constant-density (scattered) grid → 'grid-below-pc3-minimum';
 * - power class 1: fewer points than the 0.3 dB row of the systematic-error table → one
 *   'grid-pc1-systematic-error' naming the error class the count reaches (0.5 dB, 0.7 dB, or
 *   more than 0.7 dB below 4,902 / 3,000 points).
 * A regular grid counts as constant step, a scattered one as constant density. Other classes
 * and quantities: no warning (the tables are for the transmit beam-peak search).
 * Cost O(1).
 * @example gridCountWarnings(266, 'regular', 'eirp', 3)[0].code // 'grid-below-pc3-minimum'
 */
export function gridCountWarnings(points: number, kind: GridKind, quantity: Quantity, powerClass: number | undefined): Warning[] {
  if (quantity !== 'eirp') return [];
  const step = kind === 'regular';
  const kindText = step ? 'constant-step' : 'constant-density';
  if (powerClass === 1) {
    const need = (r: (typeof PC1_SYSTEMATIC_ERROR)[number]): number => (step ? r.constantStep : r.constantDensity);
    if (points >= need(PC1_SYSTEMATIC_ERROR[0])) return [];
    const reached = PC1_SYSTEMATIC_ERROR.find((r) => points >= need(r));
    const cls = reached ? `${reached.errorDb} dB` : 'more than 0.7 dB';
    return [warning('grid-pc1-systematic-error', `${points} ${kindText} points: PC1 beam-peak-search systematic error ${cls} (TS 38.521-2 Annex M.2.1.1 table; 0.3 dB needs ${need(PC1_SYSTEMATIC_ERROR[0])} points)`)];
  }
  if (powerClass !== undefined && powerClass !== 3) return [];
  const min = step ? PC3_MINIMUM.constantStep : PC3_MINIMUM.constantDensity;
  if (points >= min) return [];
  return [warning('grid-below-pc3-minimum', `${points} ${kindText} points, fewer than the ${min} of the PC3 beam-peak-search minimum (TS 38.521-2 Annex M.2.1.3)`)];
}
