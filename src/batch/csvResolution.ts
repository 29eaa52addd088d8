/**
 * The resolution of the numbers in summary.csv and build-stats.csv (README "Outputs"): values
 * in dB (dBm, dBi, dB margins) to 0.01 dB, shares of 4π and yields to 1e-4 (0.01 percentage
 * point), angles to 0.01°, solid angles to 1e-4 sr, Cpk to 0.01, frequencies to 1 Hz.
 * 0.01 dB is well below any over-the-air measurement uncertainty (tenths of a dB and more), and
 * 1e-4 of 4π (about 1.3 msr) is below one cell of a 1° grid at the equator (about 0.3 msr
 * is the cell, so a share changes by at least 2.4e-5 per cell; 1e-4 keeps a four-cell change
 * visible). results.json keeps full precision.
 */

export const CSV_DECIMALS = { dB: 2, fraction: 4, deg: 2, sr: 4, cpk: 2, hz: 0 } as const;
export type CsvScale = keyof typeof CSV_DECIMALS;

/**
 * Round to the CSV resolution of its scale; null, undefined and non-finite values stay null.
 * -0 becomes 0. Written with the shortest round-trip form, so 13.739999999999995 → 13.74 and
 * 1.0000000000000002 → 1.
 * @example roundForCsv(13.739999999999995, 'dB') === 13.74
 */
export function roundForCsv(x: number | null | undefined, scale: CsvScale): number | null {
  if (x === null || x === undefined || !Number.isFinite(x)) return null;
  const r = Number(x.toFixed(CSV_DECIMALS[scale]));
  return r === 0 ? 0 : r;
}
