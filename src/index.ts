// Public library entry: re-exports grouped by pipeline stage (filled in as stages land).
export type * from './types.js';
export { WARNINGS, warning } from './warnings.js';
