import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

// The runtime import graph of src/ (issue 15): every relative `import … from`, `export … from`
// and `import('…')` that loads a module. `import type` / `export type` are erased by tsc and
// cannot make an ES module see another half-initialized, so they are left out.
const SRC = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../src');

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    if (e.isDirectory()) return sourceFiles(p);
    return e.name.endsWith('.ts') ? [p] : [];
  });
}

// A whole statement up to its specifier: `import|export [type] … from '…'`, `import '…'`, `import('…')`.
const STATEMENT = /(?:^\s*(import|export)\s+(type\s)?[^'";]*?\bfrom\s*|^\s*import\s+|\bimport\s*\(\s*)['"](\.{1,2}\/[^'"]+)['"]/gm;

/** Relative imports of one file, resolved to source paths (`./x.js` → `./x.ts`). */
export function importsOf(file: string, text: string, withTypes = false): string[] {
  const out: string[] = [];
  for (const m of text.matchAll(STATEMENT)) {
    if (m[2] && !withTypes) continue; // type-only
    const target = path.resolve(path.dirname(file), m[3]).replace(/\.js$/, '.ts');
    out.push(target);
  }
  return out;
}

/** One cycle per strongly connected group found by depth-first search, as a path of files. */
export function findCycles(graph: Map<string, string[]>): string[][] {
  const state = new Map<string, 'open' | 'done'>();
  const stack: string[] = [];
  const cycles: string[][] = [];
  const visit = (node: string): void => {
    state.set(node, 'open');
    stack.push(node);
    for (const next of graph.get(node) ?? []) {
      const s = state.get(next);
      if (s === 'open') cycles.push([...stack.slice(stack.indexOf(next)), next]);
      else if (s === undefined && graph.has(next)) visit(next);
    }
    stack.pop();
    state.set(node, 'done');
  };
  for (const node of [...graph.keys()].sort()) if (!state.has(node)) visit(node);
  return cycles;
}

describe('import graph of src/', () => {
  const files = sourceFiles(SRC);
  const graph = new Map(files.map((f) => [f, importsOf(f, readFileSync(f, 'utf8'))]));

  it('finds the imports it walks (the walker itself works)', () => {
    // Hand-checked: src/coverage/trp.ts imports neumaierSum and sphereNormSr.
    const trp = graph.get(path.join(SRC, 'coverage/trp.ts'))!;
    expect(trp).toContain(path.join(SRC, 'sphere/neumaierSum.ts'));
    expect(trp).toContain(path.join(SRC, 'coverage/sphereNormSr.ts'));
    // Hand-written statements: type-only imports are left out, multi-line and dynamic ones kept.
    const text = "import type { A } from './a.js';\nimport {\n  b,\n  type C,\n} from './b.js';\nexport { d } from '../d.js';\nexport type { E } from './e.js';\nconst f = await import('./f.js');\n";
    expect(importsOf('/x/y/z.ts', text)).toEqual(['/x/y/b.ts', '/x/d.ts', '/x/y/f.ts']);
    // Every relative import names a file that exists (otherwise a cycle could hide behind a typo).
    const missing = [...graph.values()].flat().filter((t) => !graph.has(t));
    expect(missing).toEqual([]);
  });

  it('detects a cycle when there is one (the detector can fail)', () => {
    const g = new Map([['a', ['b']], ['b', ['c']], ['c', ['a']], ['d', ['a']]]);
    expect(findCycles(g)).toEqual([['a', 'b', 'c', 'a']]);
    expect(findCycles(new Map([['a', ['b']], ['b', []]]))).toEqual([]);
  });

  it('has no cycle (the src/sim/writers cycle of issue 15 stays broken)', () => {
    const cycles = findCycles(graph).map((c) => c.map((f) => path.relative(SRC, f)).join(' → '));
    expect(cycles, `import cycles in src/:\n${cycles.join('\n')}`).toEqual([]);
  });

  it('has no cycle through type-only imports either (the layout plans and the check-kind types have their own homes)', () => {
    const typed = new Map(files.map((f) => [f, importsOf(f, readFileSync(f, 'utf8'), true)]));
    const cycles = findCycles(typed).map((c) => c.map((f) => path.relative(SRC, f)).join(' → '));
    expect(cycles, `import cycles in src/ (type imports counted):\n${cycles.join('\n')}`).toEqual([]);
  });
});
