import type { ArrayElement, ArrayModel, SteeringBeam } from '../../src/sim/index.js';
import { C_M_PER_S } from '../../src/sim/index.js';

/** An isotropic, ideal element at a position (test fixture). */
export function isoElement(z: number): ArrayElement {
  return {
    positionM: [0, 0, z],
    boresight: [1, 0, 0],
    q: 0,
    floorDb: 0,
    polarizationDeg: 0,
    amplitudeErrorDb: 0,
    phaseErrorDeg: 0,
    failed: false,
  };
}

/** Uniform linear array of n isotropic elements along z at spacing spacingWl·λ₀. */
export function zLineArray(n: number, spacingWl: number, f0 = 28e9, powerDbm = 0): ArrayModel {
  const d = (spacingWl * C_M_PER_S) / f0;
  return {
    elements: Array.from({ length: n }, (_, i) => isoElement((i - (n - 1) / 2) * d)),
    designFrequencyHz: f0,
    phaseBits: null,
    conductedPowerDbm: powerDbm,
  };
}

export function beamAll(model: ArrayModel, thetaDeg: number, phiDeg = 0, id = '0'): SteeringBeam {
  return { id, thetaDeg, phiDeg, elements: model.elements.map((_, i) => i) };
}
