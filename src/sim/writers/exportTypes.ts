import type { SampleGrid } from '../types.js';

/** File shapes the writers produce (the layouts the readers accept, CONTRACT.md "Input folder"). */
export type ExportLayout =
  /** theta_deg,phi_deg[,beam],<value>: one row per direction (and beam). */
  | 'long'
  /** theta_deg,phi_deg[,beam],<q>_theta_<u>,<q>_phi_<u>: both polarization components. */
  | 'pol-pair'
  /** theta_deg,phi_deg[,beam],pol,<value>: one row per direction and component (theta, phi). */
  | 'pol-column'
  /** azimuth_deg,elevation_deg[,beam],<value>: el = 90 − θ, az = φ written in [−180, 180). */
  | 'az-el'
  /** One beam: header `theta_deg,<φ values…>`, one row per θ; `# quantity:` metadata line. */
  | 'matrix'
  /** theta_deg,phi_deg,Beam <id> EIRP (dBm),…: one row per direction, one column per beam. */
  | 'wide'
  /** theta_deg,phi_deg,Beam <id> EIRP theta (dBm),Beam <id> EIRP phi (dBm),…: two polarization columns per beam. */
  | 'wide-pair';

export interface ExportBeam {
  id: string;
  /** Total value per sample, dB (dBm for eirp/eis, dBi for gain). */
  valuesDb: Float64Array;
  /** θ and φ polarization components, dB; needed by pol-pair and pol-column. */
  thetaDb?: Float64Array;
  phiDb?: Float64Array;
}

export interface ExportTable {
  grid: SampleGrid;
  beams: ExportBeam[];
}

export interface ExportOptions {
  layout: ExportLayout;
  /** Value column name stem; default eirp. */
  quantity?: 'eirp' | 'eis' | 'gain';
  /** Write linear power in mW (`eirp_mw`) instead of dB; eirp/eis only. */
  linearMw?: boolean;
  delimiter?: ',' | ';' | '\t';
  /** Decimal comma in numbers; needs delimiter ';' or tab. */
  decimalComma?: boolean;
  /** Decimals of dB values (default 2); mW values keep 6 significant digits. */
  decimals?: number;
  /** Write a beam column (default: when the table holds more than one beam). */
  beamColumn?: boolean;
  /** Adds a `unit` column with this serial. */
  unit?: string;
  /** Adds a `frequency_ghz` column with this frequency. */
  frequencyHz?: number;
  /** `# key: value` lines before the header. */
  metadata?: Record<string, string>;
  lineEnding?: '\n' | '\r\n';
  /** Free-text lines written before everything else (a preamble without '#'). */
  preamble?: string[];
  /** Names of the two polarization components (pol-pair, pol-column, wide-pair); default theta, phi. */
  pairNames?: [string, string];
  /** Wide layouts: one column block per frequency (replaces the table's beams; same grid). */
  frequencyBlocks?: { frequencyHz: number; beams: ExportBeam[] }[];
}
