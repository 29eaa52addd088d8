import type { InputError } from '../types.js';
import { yamlPackage, yamlToJs } from '../io/yamlToJs.js';
import type { LimitSet } from './limitSet.js';
import { validateLimitSet, type KeyPath } from './validateLimitSet.js';

/**
 * Parse the text of a limit set (YAML, or JSON — JSON is read by the same YAML 1.2 parser)
 * and validate it. Positions of keys come from the parser, so schema errors carry
 * file:line:column; syntax errors are turned into InputError values, never thrown.
 *
 * Cost O(text length).
 * @example parseLimitSetText('name: x\nquantity: eirp\nchecks: []\n', 'x.yaml').limitSet?.name // 'x'
 */
export function parseLimitSetText(text: string, file: string): { limitSet: LimitSet | null; errors: InputError[] } {
  const { LineCounter, parseDocument, isMap, isNode, isScalar } = yamlPackage();
  const lineCounter = new LineCounter();
  const doc = parseDocument(text, { lineCounter, prettyErrors: false, uniqueKeys: true });
  if (doc.errors.length > 0) {
    return {
      limitSet: null,
      errors: doc.errors.map((e) => {
        const pos = lineCounter.linePos(e.pos[0]);
        return { file, line: pos.line, column: pos.col, message: `not a valid YAML/JSON limit set: ${e.message.split('\n')[0]}` };
      }),
    };
  }
  const locate = (path: KeyPath, atKey = false): { line: number; column: number } | undefined => {
    if (atKey && path.length > 0) {
      const parent = path.length === 1 ? doc.contents : doc.getIn(path.slice(0, -1), true);
      const pair = isMap(parent) ? parent.items.find((it) => isScalar(it.key) && it.key.value === path[path.length - 1]) : undefined;
      if (pair && isNode(pair.key) && pair.key.range) {
        const pos = lineCounter.linePos(pair.key.range[0]);
        return { line: pos.line, column: pos.col };
      }
    }
    // A missing key has no node: point at the closest existing parent instead.
    for (let n = path.length; n >= 0; n--) {
      const node = n === 0 ? doc.contents : doc.getIn(path.slice(0, n), true);
      if (isNode(node) && node.range) {
        const pos = lineCounter.linePos(node.range[0]);
        return { line: pos.line, column: pos.col };
      }
    }
    return undefined;
  };
  const data = yamlToJs(doc, file);
  if (data instanceof Error) return { limitSet: null, errors: [{ file, message: data.message }] };
  return validateLimitSet(data, file, locate);
}
