import { planarSubArray } from './arrayGeometry.js';
import { scanCodebook } from './codebook.js';
import { C_M_PER_S } from './steering.js';
import type { ArrayModel, SteeringBeam } from './types.js';

/**
 * An invented 28 GHz handset antenna arrangement for demos, tests and the benchmark: a body of
 * 150 × 72 × 8 mm (z along the length, x through the thickness), a 2×2 patch sub-array on the
 * back face (boresight −x) and a 1×4 sub-array on the long side edge (boresight +y), both at
 * λ₀/2 spacing; the back elements are more directive (cos⁴ by default) than the edge ones
 * (cos²), all with a −30 dB back-lobe floor. Codebook: 9 beams on the back (θ 60/90/120° × φ 150/180/210°) and 7 on the
 * edge (θ 30…150° in 20° steps at φ = 90°), 16 in all; `extraBeams` adds a finer scan for
 * bigger benchmarks (beam count = 16 + extraBeams, extra beams alternate between the faces).
 * Units: Hz, dBm, metres. Cost: O(elements + beams).
 * @example
 * const { model, codebook } = handsetModule({ conductedPowerDbm: 13 });
 */
export function handsetModule(opts: {
  conductedPowerDbm: number;
  designFrequencyHz?: number;
  phaseBits?: number | null;
  extraBeams?: number;
  /** Element pattern exponents q of the back and edge faces (defaults 4 and 2). */
  backElementQ?: number;
  edgeElementQ?: number;
  /** Back-lobe floor of every element, dB (default −30). */
  floorDb?: number;
}): { model: ArrayModel; codebook: SteeringBeam[] } {
  const f0 = opts.designFrequencyHz ?? 28e9;
  const d = C_M_PER_S / f0 / 2;
  const floorDb = opts.floorDb ?? -30;
  const back = planarSubArray({
    rows: 2, cols: 2, spacingM: d, centerM: [-0.004, 0, 0.055], normal: [-1, 0, 0], axisU: [0, 1, 0],
    q: opts.backElementQ ?? 4, floorDb, polarizationDeg: 45,
  });
  const edge = planarSubArray({
    rows: 1, cols: 4, spacingM: d, centerM: [0, 0.036, 0.04], normal: [0, 1, 0], axisU: [0, 0, 1],
    q: opts.edgeElementQ ?? 2, floorDb, polarizationDeg: 0,
  });
  const backIdx = [0, 1, 2, 3];
  const edgeIdx = [4, 5, 6, 7];
  const backDirs = [60, 90, 120].flatMap((t) => [150, 180, 210].map((p) => ({ thetaDeg: t, phiDeg: p })));
  const edgeDirs = [30, 50, 70, 90, 110, 130, 150].map((t) => ({ thetaDeg: t, phiDeg: 90 }));
  const groups = [
    { elements: backIdx, directions: backDirs },
    { elements: edgeIdx, directions: edgeDirs },
  ];
  const extra = opts.extraBeams ?? 0;
  for (let i = 0; i < extra; i++) {
    // Golden-ratio walk over each face's hemisphere, so any count spreads evenly.
    const s = ((i * 0.618033988749895) % 1) * 2 - 1;
    const t = 90 + 60 * s;
    const onBack = i % 2 === 0;
    const p = onBack ? 180 + 60 * (((i * 0.7548776662466927) % 1) * 2 - 1) : 90;
    groups.push({ elements: onBack ? backIdx : edgeIdx, directions: [{ thetaDeg: t, phiDeg: p }] });
  }
  const model: ArrayModel = {
    elements: [...back, ...edge],
    designFrequencyHz: f0,
    phaseBits: opts.phaseBits === undefined ? 5 : opts.phaseBits,
    conductedPowerDbm: opts.conductedPowerDbm,
  };
  return { model, codebook: scanCodebook(groups) };
}
