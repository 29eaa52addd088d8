import type { Document, LineCounter } from 'yaml';
import type { InputError } from '../types.js';
import { clipText } from '../io/inputError.js';
import { yamlPackage, yamlToJs } from '../io/yamlToJs.js';
import { fileKey } from './naming.js';

/** Key path inside a configuration file, e.g. ['checks', 2, 'limit']. */
export type KeyPath = (string | number)[];
/** Position (1-based) of a key path in the source text: of the key itself with `atKey`, else of its value. */
export type Locate = (path: KeyPath, atKey?: boolean) => { line: number; column: number } | undefined;

/** A configuration file read as plain data, with the one position mapper for its key paths. */
export interface ConfigSource {
  data: unknown;
  locate: Locate;
  /**
   * The text of the scalar at a key path as written (`007` stays '007', a date stays a text; a
   * quoted or block scalar gives its string), or undefined when the node there is not a scalar.
   */
  scalarText: (path: KeyPath) => string | undefined;
}

/**
 * Parse the text of a configuration file (YAML, or JSON — read by the same YAML 1.2 parser) into
 * plain data and a position mapper built on the parser's LineCounter and node ranges. Every
 * configuration kind (job file, limit set, report settings) goes through here, so every error
 * carries file:line:column the same way. Never throws: a syntax error or an alias bomb comes back
 * as an InputError in the project's grammar.
 *
 * A missing key has no node: `locate` then points at the closest existing parent. A key written
 * in its old spelling (`toleranceDb` for `tolerance_db`) is found under either spelling.
 * Cost O(text length).
 * @example parseConfigText('a: 1\n', 'x.yaml').source?.data // { a: 1 }
 */
export function parseConfigText(text: string, file: string): { source: ConfigSource | null; errors: InputError[] } {
  // The parser loads on the first configuration file of the process (src/lazyPackage.ts).
  const { LineCounter, parseDocument } = yamlPackage();
  const lineCounter = new LineCounter();
  const doc = parseDocument(text.replace(/^\uFEFF/, ''), { lineCounter, prettyErrors: false, uniqueKeys: true });
  if (doc.errors.length > 0) {
    const e = doc.errors[0];
    const { line, col } = lineCounter.linePos(e.pos[0]);
    const near = text.replace(/^\uFEFF/, '').slice(e.pos[0], e.pos[0] + 20).split('\n')[0];
    const format = /\.json$/i.test(file) ? 'JSON' : 'YAML';
    return {
      source: null,
      errors: [{ file, line, column: col, message: `${file}:${line}:${col}: syntax: found '${clipText(near)}', expected valid ${format} (${e.code})` }],
    };
  }
  const data = yamlToJs(doc, file);
  if (data instanceof Error) return { source: null, errors: [{ file, message: data.message }] };
  return { source: { data, locate: locator(doc, lineCounter), scalarText: (p) => scalarText(doc, p) }, errors: [] };
}

function scalarText(doc: Document, path: KeyPath): string | undefined {
  const { isScalar } = yamlPackage();
  const node = doc.getIn(path, true);
  if (!isScalar(node)) return undefined;
  return typeof node.value === 'string' ? node.value : (node as { source?: string }).source ?? String(node.value ?? '');
}

function locator(doc: Document, lc: LineCounter): Locate {
  const { isAlias, isMap, isNode, isScalar, isSeq } = yamlPackage();
  const at = (offset: number) => {
    const p = lc.linePos(offset);
    return { line: p.line, column: p.col };
  };
  return (path, atKey = false) => {
    let node: unknown = doc.contents;
    let best = isNode(node) && node.range ? node.range[0] : undefined;
    for (let i = 0; i < path.length; i++) {
      if (isAlias(node)) node = node.resolve(doc);
      const seg = path[i];
      if (isMap(node)) {
        const pair = node.items.find((it) => isScalar(it.key) && (it.key.value === seg || (typeof it.key.value === 'string' && fileKey(it.key.value) === seg)));
        if (!pair) break;
        if (atKey && i === path.length - 1 && isNode(pair.key) && pair.key.range) return at(pair.key.range[0]);
        node = pair.value;
        // `key:` with no value has no range: point at the key.
        const r = isNode(node) && node.range ? node.range[0] : isNode(pair.key) ? pair.key.range?.[0] : undefined;
        if (r !== undefined) best = r;
      } else if (isSeq(node) && typeof seg === 'number' && seg < node.items.length) {
        node = node.items[seg];
        if (isNode(node) && node.range) best = node.range[0];
      } else break;
    }
    return best === undefined ? undefined : at(best);
  };
}
