import { percentile } from './percentile.js';
import { totalScanPattern } from './totalScanPattern.js';
import { upperShareRegion } from './upperShareRegion.js';
import { weightedCdf } from './weightedCdf.js';

export interface BeamCorrespondence {
  /** EIRP2 per direction: the best EIRP over the codebook (uplink beam sweeping; the TSP), dBm. */
  eirp2: Float64Array;
  /** EIRP1 per direction: the EIRP of the beam the device picks from its receive measurement, dBm. */
  eirp1: Float64Array;
  /** ΔEIRP_BC = EIRP2 − EIRP1 per direction, dB (≥ 0). */
  deltaDb: Float64Array;
  /** The beam (index into the EIRP beams) the receive side picks per direction. */
  rxChoice: Int32Array;
  /** 1 where the direction is in the upper topSharePct % of EIRP2 by solid angle. */
  inRegion: Uint8Array;
  regionSr: number;
  /** EIRP2 at the region's boundary, dBm (null when that level is not evaluable). */
  regionFloorDbm: number | null;
  /** ΔEIRP_BC at levelPct of its solid-angle-weighted CDF over the region, dB (null: no region). */
  value: number | null;
}

/**
 * Beam correspondence of a unit measured both ways (3GPP TS 38.101-2 §6.6.4; the reference
 * notes, "Beam correspondence"; verify against the current release):
 *   EIRP2(û) = max_b EIRP_b(û)                  (the total scan pattern)        Eq. (B1)
 *   r(û)     = argmin_b EIS_b(û)                (the beam chosen from the receive side) Eq. (B2)
 *   EIRP1(û) = EIRP_r(û)(û)                                                      Eq. (B3)
 *   ΔEIRP_BC(û) = EIRP2(û) − EIRP1(û)                                            Eq. (B4)
 * evaluated over the directions in the upper topSharePct % of EIRP2 by solid angle
 * (upperShareRegion, Eq. U1), and read at levelPct of the solid-angle-weighted CDF of ΔEIRP_BC
 * over that region (the project's step percentile, the region being the whole population).
 * `eisBeams[k]` is the receive pattern of the beam whose transmit pattern is `eirpBeams[k]`
 * (the caller pairs them by beam id); ties of the receive choice go to the lowest index.
 * Units: dBm in, dB out. Cost O(points·beams + points log points).
 * @throws RangeError when the beam lists differ in length or are empty.
 * @example beamCorrespondence(w, eirp, eirp.map((e) => e.map((x) => -x)), 85, 50).value // 0 (same choice both ways)
 */
export function beamCorrespondence(weightSr: Float64Array, eirpBeams: Float64Array[], eisBeams: Float64Array[],
  levelPct: number, topSharePct: number): BeamCorrespondence {
  if (eirpBeams.length === 0 || eirpBeams.length !== eisBeams.length) {
    throw new RangeError(`beamCorrespondence: ${eirpBeams.length} transmit and ${eisBeams.length} receive beams`);
  }
  const eirp2 = totalScanPattern(eirpBeams, 'eirp').values; // Eq. (B1)
  const rxChoice = totalScanPattern(eisBeams, 'eis').bestBeam; // Eq. (B2)
  const n = eirp2.length;
  const eirp1 = new Float64Array(n);
  const deltaDb = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    eirp1[i] = eirpBeams[rxChoice[i]][i]; // Eq. (B3)
    deltaDb[i] = eirp2[i] - eirp1[i]; // Eq. (B4)
  }
  const { inRegion, floor, regionSr } = upperShareRegion(eirp2, weightSr, topSharePct);
  const d: number[] = [];
  const w: number[] = [];
  for (let i = 0; i < n; i++) if (inRegion[i]) { d.push(deltaDb[i]); w.push(weightSr[i]); }
  let value: number | null = null;
  if (d.length) {
    const cdf = weightedCdf(d, w);
    value = percentile({ ...cdf, sphereSr: cdf.measuredSr }, levelPct, 'eis'); // the region is the whole population
  }
  return { eirp2, eirp1, deltaDb, rxChoice, inRegion, regionSr, regionFloorDbm: floor, value };
}
