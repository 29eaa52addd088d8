import type { Quantity } from '../types.js';
import type { ColumnRole } from './types.js';

/** Role and quantity a base header name stands for (CONTRACT.md, "Input folder"). */
export interface NamedRole {
  role: ColumnRole;
  quantity?: Quantity;
}

const FIXED: Record<string, ColumnRole> = {
  theta: 'theta',
  'θ': 'theta',
  phi: 'phi',
  'φ': 'phi',
  azimuth: 'azimuth',
  az: 'azimuth',
  elevation: 'elevation',
  el: 'elevation',
  elev: 'elevation',
  pol: 'pol',
  polarization: 'pol',
  polarisation: 'pol',
  unit: 'unit',
  dut: 'unit',
  serial: 'unit',
  sn: 'unit',
  beam: 'beam',
  beam_id: 'beam',
  codeword: 'beam',
  freq: 'frequency',
  frequency: 'frequency',
  power: 'power',
};

const QUANTITIES: Quantity[] = ['eirp', 'gain', 'eis'];

/**
 * Role of a base header name, or null when the column is not one spherecov reads.
 * @example roleOfName('eirp_theta') // { role: 'valueTheta', quantity: 'eirp' }
 */
export function roleOfName(base: string): NamedRole | null {
  const fixed = FIXED[base];
  if (fixed) return { role: fixed };
  for (const q of QUANTITIES) {
    if (base === q) return { role: 'value', quantity: q };
    if (base === `${q}_theta` || base === `${q}_th`) return { role: 'valueTheta', quantity: q };
    if (base === `${q}_phi` || base === `${q}_ph`) return { role: 'valuePhi', quantity: q };
  }
  return null;
}
