import { angularDistanceDeg } from '../sphere/direction.js';
import type { BeamMetrics } from '../types.js';

export interface BeamDrift {
  beam: string;
  /** Largest great-circle angle between the beam's peak directions at any two frequencies, degrees. */
  driftDeg: number;
  /** driftDeg > maxDriftDeg. */
  flagged: boolean;
  /** Frequencies at which the beam was measured. */
  frequencies: number;
  /** The two frequencies (Hz, ascending) that span driftDeg; null when measured at one frequency. */
  betweenHz: [number, number] | null;
}

/**
 * How far each beam's peak direction moves across the measured band: the maximum over all
 * frequency pairs of the great-circle angle between the pointing directions (the main-lobe
 * centroid `pointing` when present, else the peak sample) (Eq. 1) (core
 * `angularDistanceDeg`, atan2 form). A beam measured at one frequency drifts 0°. Beams are
 * matched by id and listed in order of first appearance. With phase-shifter steering fixed at
 * f₀ a linear array's beam squints as sin θ = (f₀/f)·sin θ₀ (θ from broadside; Mailloux,
 * Phased Array Antenna Handbook, 2nd ed., ch. 1, from memory) — the effect this measures.
 * Cost O(B · F²).
 * @example pointingDrift([{ frequencyHz: 26.5e9, beams: a }, { frequencyHz: 29.5e9, beams: b }], 3)
 */
export function pointingDrift(perFrequencyBeams: { frequencyHz: number; beams: BeamMetrics[] }[], maxDriftDeg: number): BeamDrift[] {
  const seen = new Map<string, { frequencyHz: number; beam: BeamMetrics }[]>();
  for (const f of perFrequencyBeams) {
    for (const beam of f.beams) {
      const list = seen.get(beam.id) ?? [];
      list.push({ frequencyHz: f.frequencyHz, beam });
      seen.set(beam.id, list);
    }
  }
  return [...seen].map(([id, list]) => {
    let driftDeg = 0;
    let betweenHz: [number, number] | null = null;
    for (let a = 0; a < list.length; a++) {
      for (let b = a + 1; b < list.length; b++) {
        const d = angularDistanceDeg(list[a].beam.pointing ?? list[a].beam.peak, list[b].beam.pointing ?? list[b].beam.peak); // Eq. 1
        if (betweenHz === null || d > driftDeg) {
          driftDeg = d;
          const [fa, fb] = [list[a].frequencyHz, list[b].frequencyHz];
          betweenHz = fa <= fb ? [fa, fb] : [fb, fa];
        }
      }
    }
    return { beam: id, driftDeg, flagged: driftDeg > maxDriftDeg, frequencies: list.length, betweenHz };
  });
}
