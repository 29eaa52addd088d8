/** A header cell split into its base name and its unit. */
export interface HeaderCell {
  raw: string;
  /** Lower-case base name, spaces and dashes as '_' (e.g. 'eirp_theta'). */
  base: string;
  /** Unit in canonical spelling, or null. */
  unit: string | null;
}

const UNITS: Record<string, string> = {
  deg: 'deg',
  degree: 'deg',
  degrees: 'deg',
  '°': 'deg',
  rad: 'rad',
  radian: 'rad',
  radians: 'rad',
  dbm: 'dBm',
  dbi: 'dBi',
  db: 'dB',
  mw: 'mW',
  w: 'W',
  hz: 'Hz',
  khz: 'kHz',
  mhz: 'MHz',
  ghz: 'GHz',
};

/**
 * Split `EIRP [dBm]`, `theta (deg)`, `eirp_theta_dbm` or `Freq_GHz` into base and unit.
 * A unit is taken from brackets, or from the last `_`-separated token when it is a known unit.
 * @example parseHeaderCell('EIRP [dBm]') // { base: 'eirp', unit: 'dBm' }
 */
export function parseHeaderCell(raw: string): HeaderCell {
  let text = raw.trim().replace(/^\uFEFF/, '');
  let unit: string | null = null;
  const bracket = /^(.*?)\s*[[(]\s*([^\])]*?)\s*[\])]\s*$/.exec(text);
  if (bracket) {
    const u = UNITS[bracket[2].toLowerCase()];
    if (u) {
      unit = u;
      text = bracket[1];
    }
  }
  let base = text.toLowerCase().replace(/[\s-]+/g, '_');
  if (unit === null) {
    const m = /^(.+)_([a-z°]+)$/.exec(base);
    if (m && UNITS[m[2]]) {
      unit = UNITS[m[2]];
      base = m[1];
    }
  }
  return { raw, base, unit };
}
