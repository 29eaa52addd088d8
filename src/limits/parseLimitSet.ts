import type { InputError } from '../types.js';
import type { LimitSet } from './limitSet.js';
import { limitSetSchema } from '../config/limitSetSchema.js';
import { loadConfigText } from '../config/validateConfig.js';

/**
 * Parse the text of a limit set (YAML, or JSON — JSON is read by the same YAML 1.2 parser) and
 * validate it (src/config: one position mapper, one schema, one error grammar), so every error
 * carries file:line:column. Syntax errors come back as InputError values, never thrown.
 *
 * Cost O(text length).
 * @example parseLimitSetText('name: x\nquantity: eirp\nchecks: []\n', 'x.yaml').limitSet?.name // 'x'
 */
export function parseLimitSetText(text: string, file: string): { limitSet: LimitSet | null; errors: InputError[]; notices: InputError[] } {
  const { value, errors, notices } = loadConfigText(limitSetSchema(), text, file);
  return { limitSet: value, errors, notices };
}
