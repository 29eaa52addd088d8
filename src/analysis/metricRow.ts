/**
 * Every scalar metric of one unit as a flat, named row, so that metrics can be differenced
 * (reference unit) and tabulated against frequency under the same names. The names, labels and
 * units are owned by the metric catalogue (src/metrics/catalogue.ts); this re-export keeps the
 * analysis stage's public name.
 */
export { metricRow } from '../metrics/catalogue.js';
