import { unitVector } from '../sphere/direction.js';
import type { ArrayModel, SteeringBeam } from './types.js';

const C_M_PER_S = 299_792_458;

/**
 * Rounds a phase to the nearest state of an n-bit phase shifter (steps of 2π/2ⁿ).
 * Formula: φq = 2π/2ⁿ · round(φ · 2ⁿ/2π)                                    Eq. (Q1)
 * Units: radians in and out. Boundary rule: ties round up (Math.round); bits = null returns φ.
 * Cost: O(1).
 * @example
 * quantizePhase(0.5, 2); // π/2 · round(0.318) = 0
 */
export function quantizePhase(phaseRad: number, bits: number | null): number {
  if (bits === null) return phaseRad;
  const step = (2 * Math.PI) / 2 ** bits;
  return step * Math.round(phaseRad / step); // Eq. (Q1)
}

/**
 * Complex excitation of each element for one codeword: progressive phase that steers the
 * beam to (θ₀, φ₀) at the design frequency f₀, quantized, plus the element's amplitude and
 * phase errors; the beam's conducted power is split equally over the elements it drives.
 * Formula: βₙ = −k₀ (û₀ · rₙ), k₀ = 2π f₀ / c (Balanis, Antenna Theory, 4th ed., §6.3,
 * progressive phase for scanning; §6.10 for planar arrays; section numbers from memory)                      Eq. (S1)
 * wₙ = √(P/N) · 10^(aₙ/20) · e^{j(Q(βₙ) + εₙ)}, wₙ = 0 for a failed or undriven element.
 * Units: P in mW (from dBm); w in √mW, so |Σ wₙ …|² is in mW.
 * Boundary rule: phases are taken modulo nothing; Q(β) rounds on the full real line.
 * Cost: O(elements).
 * @throws Error when the codeword names an element index the model does not have.
 * @example
 * const { re, im } = excitation(model, beam); // re[n] + j·im[n]
 */
export function excitation(model: ArrayModel, beam: SteeringBeam): { re: Float64Array; im: Float64Array } {
  const n = model.elements.length;
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  const k0 = (2 * Math.PI * model.designFrequencyHz) / C_M_PER_S;
  const u0 = unitVector(beam.thetaDeg, beam.phiDeg);
  const perElementMw = 10 ** (model.conductedPowerDbm / 10) / beam.elements.length;
  for (const i of beam.elements) {
    const el = model.elements[i];
    if (el === undefined) throw new Error(`beam ${beam.id}: no element ${i}`);
    if (el.failed) continue;
    const r = el.positionM;
    const beta = -k0 * (u0[0] * r[0] + u0[1] * r[1] + u0[2] * r[2]); // Eq. (S1)
    const phase = quantizePhase(beta, model.phaseBits) + (el.phaseErrorDeg * Math.PI) / 180;
    const amp = Math.sqrt(perElementMw) * 10 ** (el.amplitudeErrorDb / 20);
    re[i] = amp * Math.cos(phase);
    im[i] = amp * Math.sin(phase);
  }
  return { re, im };
}

export { C_M_PER_S };
