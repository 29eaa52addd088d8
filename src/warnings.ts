import type { Warning, WarningCode } from './types.js';

interface WarningInfo {
  /** Short plain-words title, used in reports. */
  title: string;
  /** What the user can do about it. */
  remedy: string;
}

/**
 * The warning catalogue. Typed as a Record over WarningCode so that a new code cannot ship
 * without its text and remedy.
 */
export const WARNINGS: Record<WarningCode, WarningInfo> = {
  'duplicate-merged': {
    title: 'Coincident directions merged',
    remedy: 'None needed: φ = 0/360 and pole samples are one direction and are counted once.',
  },
  'duplicate-differs': {
    title: 'Coincident directions with different values',
    remedy: 'Check the positioner and the export; the values were merged by power average.',
  },
  'beam-resampled': {
    title: 'Beam resampled onto the unit grid',
    remedy: 'Measure all beams on one grid to avoid interpolation error.',
  },
  'partial-sphere': {
    title: 'Partial sphere measured',
    remedy: 'Unmeasured directions count as not covered and TRP is not reported; a verdict on a partial sphere is shown as partial. Measure the region or judge only what the scan covers.',
  },
  'missing-points': {
    title: 'Grid points missing',
    remedy: 'Re-export the full grid; until then the neighbouring samples stand in for the missing directions (their cells absorbed the solid angle).',
  },
  'column-ignored': {
    title: 'Column ignored',
    remedy: 'Map the column in the job file (columns:) if it should be used.',
  },
  'unit-converted': {
    title: 'Linear values converted to dB',
    remedy: 'None needed.',
  },
  'quantity-assumed': {
    title: 'Quantity assumed',
    remedy: 'Name the quantity in the header, a "# quantity:" line, the job file or --quantity.',
  },
  'frequency-missing': {
    title: 'No frequency found',
    remedy: 'Add a freq column, a "<n>GHz" token in the file name or a "# frequency:" line.',
  },
  'calibration-applied': {
    title: 'Calibration applied',
    remedy: 'None needed; check the calibration table in the job file.',
  },
  'trp-partial-sphere': {
    title: 'TRP not computed on a partial sphere',
    remedy: 'Measure the full sphere to report TRP.',
  },
  'few-points': {
    title: 'Very few grid points',
    remedy: 'Use a finer grid; percentiles are coarse with few points.',
  },
  'beam-never-best': {
    title: 'Beam never best',
    remedy: 'Review the codebook: this beam adds nothing to the total scan pattern.',
  },
  'identity-from-path': {
    title: 'Identity taken from the file path',
    remedy: 'Add unit/beam/frequency columns or identity patterns in the job file if this is wrong.',
  },
  'angle-convention': {
    title: 'Angle convention converted',
    remedy: 'None needed.',
  },
  'scattered-grid': {
    title: 'Scattered grid',
    remedy: 'None needed: points are weighted by their spherical Voronoi cell areas.',
  },
  'dropout-samples': {
    title: 'Dropout cells read as missing samples',
    remedy: 'Re-measure the directions named; a direction missing in every beam is an unmeasured grid point (it counts as not covered), one missing in some beams only is filled from that beam\'s neighbouring samples.',
  },
  'frequency-unit-assumed': {
    title: 'Frequency unit assumed',
    remedy: 'Name the unit in the header (freq_ghz, "Frequency [MHz]") or set frequency_unit in the job file.',
  },
  'grid-below-pc3-minimum': {
    title: 'Fewer grid points than the PC3 beam-peak-search minimum',
    remedy: 'Measure at least 1,106 constant-step (7.5°) or 800 constant-density points (3GPP TS 38.521-2 Annex M.2.1.3; verify against the current release), or read the grid-adequacy estimate before trusting a marginal verdict.',
  },
  'grid-pc1-systematic-error': {
    title: 'Grid coarser than the PC1 systematic-error table allows for 0.3 dB',
    remedy: 'For a 0.3 dB beam-peak systematic error measure 10,226 constant-step (2.5°) or 7,000 constant-density points (3GPP TS 38.521-2 Annex M.2.1.1; verify against the current release).',
  },
};

/** Build a typed warning. */
export function warning(code: WarningCode, message: string, where?: { file?: string; line?: number }): Warning {
  return { code, message, ...where };
}
