import type { SteeringBeam } from './types.js';

/**
 * A codebook of steering beams: for each group of elements (a sub-array on one face), one
 * codeword per listed steering direction. Beam ids are consecutive integers from firstId, in
 * group order, as codebooks are usually numbered.
 * Cost: O(beams). Boundary rule: an empty group list gives an empty codebook.
 * @example
 * scanCodebook([{ elements: [0, 1, 2, 3], directions: [{ thetaDeg: 90, phiDeg: 0 }] }]); // [{ id: '0', ... }]
 */
export function scanCodebook(
  groups: { elements: number[]; directions: { thetaDeg: number; phiDeg: number }[] }[],
  firstId = 0,
): SteeringBeam[] {
  const out: SteeringBeam[] = [];
  for (const g of groups) {
    for (const d of g.directions) {
      out.push({ id: String(firstId + out.length), thetaDeg: d.thetaDeg, phiDeg: d.phiDeg, elements: [...g.elements] });
    }
  }
  return out;
}
