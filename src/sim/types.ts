/**
 * Types of the analytic phased-array measurement model (src/sim). Conventions as in
 * src/types.ts: angles in degrees, θ from +z, φ from +x towards +y; positions in metres;
 * powers in dBm; linear power in mW.
 */

export type Vec3 = readonly [number, number, number];

/** One radiating element of the array. */
export interface ArrayElement {
  positionM: Vec3;
  /** Unit vector of the element's boresight (the normal of the face it sits on). */
  boresight: Vec3;
  /** Exponent q of the power pattern cos^q ψ off the boresight. */
  q: number;
  /** Back-lobe floor relative to the pattern maximum, dB (≤ 0; 0 makes the element isotropic). */
  floorDb: number;
  /** Polarization split χ: field share cos χ in the θ component, sin χ in the φ component. */
  polarizationDeg: number;
  /** Amplitude error of this element's chain, dB (0 = ideal). */
  amplitudeErrorDb: number;
  /** Phase error of this element's chain, degrees (0 = ideal). */
  phaseErrorDeg: number;
  /** A failed element radiates nothing. */
  failed: boolean;
}

export interface ArrayModel {
  elements: ArrayElement[];
  /** Frequency at which the steering phases are computed, Hz. */
  designFrequencyHz: number;
  /** Phase-shifter resolution in bits; null = ideal (continuous) phase shifters. */
  phaseBits: number | null;
  /** Total conducted power into the active elements of a beam, dBm (split equally). */
  conductedPowerDbm: number;
}

/** One codeword: a steering direction and the elements it drives. */
export interface SteeringBeam {
  id: string;
  thetaDeg: number;
  phiDeg: number;
  /** Indices into ArrayModel.elements of the elements this beam drives. */
  elements: number[];
}

/** Sample directions as a chamber writes them (poles and seams may repeat). */
export interface SampleGrid {
  thetaDeg: Float64Array;
  phiDeg: Float64Array;
}

/** One simulated beam on a SampleGrid: EIRP, dBm, total and per polarization. */
export interface SimulatedBeam {
  id: string;
  eirpDbm: Float64Array;
  eirpThetaDbm: Float64Array;
  eirpPhiDbm: Float64Array;
}
