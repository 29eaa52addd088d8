import type { Document } from 'yaml';
import { lazyPackage } from '../lazyPackage.js';

/** The YAML parser, loaded when a job file, limit set or report settings are read (src/lazyPackage.ts). */
export const yamlPackage = lazyPackage<typeof import('yaml')>('yaml');

/**
 * Largest number of alias expansions accepted in a job or limit file. Real files use a few
 * anchors at most; an "alias bomb" (anchors of anchors, each used many times) expands into
 * billions of nodes. The yaml library stops at this count and throws; the error is reported as
 * the file's own problem.
 */
export const MAX_YAML_ALIASES = 100;

/**
 * A parsed YAML document as plain data, or an Error whose message names the file and says why
 * it was refused (too many aliases: a resource-exhaustion attack or a mistake). Never throws for
 * a document's content.
 * @example yamlToJs(parseDocument('a: 1'), 'x.yaml') // { a: 1 }
 */
export function yamlToJs(doc: Document, file: string): unknown {
  try {
    return doc.toJS({ maxAliasCount: MAX_YAML_ALIASES }) as unknown;
  } catch (e) {
    if (e instanceof ReferenceError || (e instanceof Error && /alias/i.test(e.message))) {
      return new Error(`${file}: aliases: found more than ${MAX_YAML_ALIASES} alias expansions (*name), expected a file without nested alias chains (an "alias bomb" would expand without bound)`);
    }
    return new Error(`${file}: found content the YAML reader cannot turn into data (${(e as Error).message.split('\n')[0].slice(0, 80)}), expected a plain YAML/JSON mapping`);
  }
}
