/**
 * Receive sensitivity pattern (EIS) of a beam from its transmit EIRP pattern, by reciprocity:
 * the beam's realized gain is EIRP − P_conducted, and EIS = S_conducted − gain.
 * Formula: EIS(û) = S − (EIRP(û) − P)                                          Eq. (R1)
 * (reciprocity of a passive antenna; common practice for synthetic EIS data).
 * Units: dBm in and out. Boundary rule: lower EIS is better, so the EIRP peak is the EIS best.
 * Cost: O(points).
 * @example
 * eisFromEirp(Float64Array.of(25), 13, -95)[0]; // −107
 */
export function eisFromEirp(eirpDbm: Float64Array, conductedPowerDbm: number, conductedSensitivityDbm: number): Float64Array {
  const out = new Float64Array(eirpDbm.length);
  for (let i = 0; i < out.length; i++) out[i] = conductedSensitivityDbm - (eirpDbm[i] - conductedPowerDbm); // Eq. (R1)
  return out;
}
