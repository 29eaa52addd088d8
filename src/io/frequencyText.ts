const FACTORS: Record<string, number> = { hz: 1, khz: 1e3, mhz: 1e6, ghz: 1e9 };

/**
 * Frequency in Hz of a value without a stated unit: below 1000 it is read as GHz, below 10^6 as
 * MHz, else Hz (chamber exports use one of these three; a rule of thumb, common practice).
 * @example assumedFrequencyHz(28) // 28e9
 */
export function assumedFrequencyHz(value: number): number {
  if (value < 1e3) return value * 1e9;
  if (value < 1e6) return value * 1e6;
  return value;
}

/**
 * Parse "28 GHz", "28GHz", "28000 MHz", "2.8e10 Hz" or a bare number (unit assumed as in
 * assumedFrequencyHz). Returns null when the text is not a positive frequency.
 * @example parseFrequencyText('27.5 GHz') // 27.5e9
 */
export function parseFrequencyText(text: string): number | null {
  const m = /^\s*([+]?\d+(?:\.\d*)?(?:[eE][+-]?\d+)?)\s*(hz|khz|mhz|ghz)?\s*$/i.exec(text);
  if (!m) return null;
  const v = Number(m[1]);
  if (!(v > 0) || !Number.isFinite(v)) return null;
  return m[2] ? v * FACTORS[m[2].toLowerCase()] : assumedFrequencyHz(v);
}
