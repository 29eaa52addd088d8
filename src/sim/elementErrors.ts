import { createRng } from './prng.js';
import type { ArrayElement } from './types.js';

/**
 * Per-element amplitude and phase errors of the RF chains (production spread or a phase
 * calibration error): independent normal draws added to each element's existing errors.
 * Formula: aₙ += σ_a·zₙ, εₙ += σ_φ·z′ₙ, z ~ N(0, 1).
 * Units: dB and degrees. Boundary rule: only the elements listed in `only` change when given.
 * Cost: O(elements). Pure: returns new element objects.
 * @example
 * perturbElements(elements, { amplitudeSigmaDb: 0.5, phaseSigmaDeg: 5, seed: 3 });
 */
export function perturbElements(
  elements: ArrayElement[],
  opts: { amplitudeSigmaDb: number; phaseSigmaDeg: number; seed: number; only?: number[] },
): ArrayElement[] {
  const rng = createRng(opts.seed);
  const pick = opts.only ? new Set(opts.only) : null;
  return elements.map((el, i) => {
    const za = rng.normal();
    const zp = rng.normal();
    if (pick && !pick.has(i)) return { ...el };
    return {
      ...el,
      amplitudeErrorDb: el.amplitudeErrorDb + opts.amplitudeSigmaDb * za,
      phaseErrorDeg: el.phaseErrorDeg + opts.phaseSigmaDeg * zp,
    };
  });
}

/**
 * Marks one element as failed (an open feed or dead amplifier: it radiates nothing).
 * @throws Error when the index is out of range.
 * @example
 * failElement(elements, 2);
 */
export function failElement(elements: ArrayElement[], index: number): ArrayElement[] {
  if (!Number.isInteger(index) || index < 0 || index >= elements.length) {
    throw new Error(`failElement: no element ${index} (array has ${elements.length})`);
  }
  return elements.map((el, i) => (i === index ? { ...el, failed: true } : { ...el }));
}
