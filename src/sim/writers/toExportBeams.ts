import type { SimulatedBeam } from '../types.js';
import type { ExportBeam } from './exportTypes.js';

/**
 * Simulated beams as writer input (total and both polarization components, dBm).
 * @example
 * formatExport({ grid, beams: toExportBeams(sim) }, { layout: 'pol-pair' });
 */
export function toExportBeams(beams: SimulatedBeam[]): ExportBeam[] {
  return beams.map((b) => ({ id: b.id, valuesDb: b.eirpDbm, thetaDb: b.eirpThetaDbm, phiDb: b.eirpPhiDbm }));
}
