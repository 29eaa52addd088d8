import type { Quantity } from '../types.js';
import type { ColumnRole } from './types.js';
import { QUANTITIES } from '../quantity.js';

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
  // received power (calibrated into EIRP with the job file's table)
  rx_power: 'power',
  received_power: 'power',
  p_rx: 'power',
  prx: 'power',
};

/**
 * Names of the two orthogonal components of a polarization pair, as suffixes of a quantity
 * (`eirp_co`, `eis_lhcp`) and as `pol` column values: θ/φ, co/cross (Ludwig-3), H/V, LHCP/RHCP.
 * Index 0 is the first component (role valueTheta), 1 the second (valuePhi).
 */
export const PAIR_NAMES: readonly [readonly string[], readonly string[]][] = [
  [['theta', 'th', 'θ'], ['phi', 'ph', 'φ']],
  [['co', 'copol', 'co_pol'], ['cross', 'cx', 'xpol', 'cross_pol']],
  [['h', 'hor', 'horizontal'], ['v', 'ver', 'vert', 'vertical']],
  [['lhcp'], ['rhcp']],
];

/** Stand-alone field-component names without a quantity (`Etheta`, `E_phi`). */
const FIELD_COMPONENTS: Record<string, 0 | 1> = { etheta: 0, e_theta: 0, 'eθ': 0, ephi: 1, e_phi: 1, 'eφ': 1 };

/** Component index (0 first, 1 second) of a polarization name, or −1. Case-insensitive. */
export function pairComponent(name: string): 0 | 1 | -1 {
  const n = name.trim().toLowerCase();
  for (const [a, b] of PAIR_NAMES) {
    if (a.includes(n)) return 0;
    if (b.includes(n)) return 1;
  }
  return -1;
}

/** The pair a component name belongs to, as 'first/second' for messages (e.g. 'co/cross'). */
export function pairLabel(name: string): string {
  const n = name.trim().toLowerCase();
  const pair = PAIR_NAMES.find(([a, b]) => a.includes(n) || b.includes(n)) ?? PAIR_NAMES[0];
  return `${pair[0][0]}/${pair[1][0]}`;
}


/**
 * Role of a base header name, or null when the column is not one spherecov reads.
 * @example roleOfName('eirp_theta') // { role: 'valueTheta', quantity: 'eirp' }
 */
export function roleOfName(base: string): NamedRole | null {
  const fixed = FIXED[base];
  if (fixed) return { role: fixed };
  const field = FIELD_COMPONENTS[base];
  if (field !== undefined) return { role: field === 0 ? 'valueTheta' : 'valuePhi' };
  for (const q of QUANTITIES) {
    if (base === q) return { role: 'value', quantity: q };
    if (base.startsWith(`${q}_`)) {
      const k = pairComponent(base.slice(q.length + 1));
      if (k >= 0) return { role: k === 0 ? 'valueTheta' : 'valuePhi', quantity: q };
    }
  }
  return null;
}
