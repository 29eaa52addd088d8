#!/usr/bin/env node
/**
 * Function lengths in source folders: every function declaration, method, constructor,
 * accessor, function expression and arrow function, with its length in lines (first line of the
 * signature to the closing brace; the doc comment above it is not counted, nested functions count
 * inside their parent too). test/structure/functionLength.test.ts holds src/batch (and, once its
 * split lands, src/report) to a stated limit.
 *
 *   node scripts/function-lengths.mjs [--over N] [folder|file …]   (default: src/batch src/report)
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import ts from 'typescript';

/** The name a reader would search for: the declared name, else the variable or property it is assigned to. */
function nameOf(node) {
  if (node.name && ts.isIdentifier(node.name)) return node.name.text;
  if (ts.isConstructorDeclaration(node)) return 'constructor';
  const p = node.parent;
  if (p && (ts.isVariableDeclaration(p) || ts.isPropertyAssignment(p) || ts.isPropertyDeclaration(p)) && p.name && ts.isIdentifier(p.name)) return p.name.text;
  return '(anonymous)';
}

/** Every function in one TypeScript source text: { name, line, lines }. */
export function functionLengthsOfText(fileName, text) {
  const sf = ts.createSourceFile(fileName, text, ts.ScriptTarget.ES2022, true, ts.ScriptKind.TS);
  const out = [];
  const visit = (node) => {
    if ((ts.isFunctionLike(node) && 'body' in node && node.body) ) {
      const start = sf.getLineAndCharacterOfPosition(node.getStart(sf)).line;
      const end = sf.getLineAndCharacterOfPosition(node.getEnd()).line;
      out.push({ name: nameOf(node), line: start + 1, lines: end - start + 1 });
    }
    ts.forEachChild(node, visit);
  };
  visit(sf);
  return out;
}

/** Every function of every .ts file under the folders (recursive; a file path measures that file): { file, name, line, lines }, longest first. */
export function functionLengths(folders, root = process.cwd()) {
  const out = [];
  const measure = (p) => {
    const file = path.relative(root, p).split(path.sep).join('/');
    for (const f of functionLengthsOfText(file, readFileSync(p, 'utf8'))) out.push({ file, ...f });
  };
  const walk = (dir) => {
    if (statSync(dir).isFile()) return measure(dir);
    for (const e of readdirSync(dir, { withFileTypes: true })) {
      const p = path.join(dir, e.name);
      if (e.isDirectory()) walk(p);
      else if (e.name.endsWith('.ts') && !e.name.endsWith('.d.ts')) measure(p);
    }
  };
  for (const f of folders) walk(path.resolve(root, f));
  return out.sort((a, b) => b.lines - a.lines || (a.file < b.file ? -1 : a.file > b.file ? 1 : a.line - b.line));
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const args = process.argv.slice(2);
  const i = args.indexOf('--over');
  const over = i >= 0 ? Number(args.splice(i, 2)[1]) : 0;
  const folders = args.length ? args : ['src/batch', 'src/report'];
  for (const f of functionLengths(folders)) if (f.lines > over) console.log(`${String(f.lines).padStart(5)}  ${f.file}:${f.line}  ${f.name}`);
}
