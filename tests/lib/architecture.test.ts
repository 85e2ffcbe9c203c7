import fs from 'node:fs';
import path from 'node:path';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

/**
 * The layout rules of DEVELOPERS.md ("Layout"), checked on the real import graph (read with the
 * TypeScript compiler's own parser; type-only imports do not count, they vanish at build time):
 * - no import cycles;
 * - only lib/data and lib/platform (and models itself) reach the database (models/, lib/platform/db);
 * - feature folders under lib/ (everything but data, auth, platform, http, mail) are pure: they never import
 *   lib/data, lib/auth, lib/platform or models, so they stay safe in the browser;
 * - files marked 'use client' never import server-only layers.
 */
const root = path.resolve(__dirname, '../..');
const SCANNED = ['app', 'components', 'lib', 'models', 'proxy.ts'];
const EXTENSIONS = ['.ts', '.tsx', '/index.ts', '/index.tsx'];

interface SourceFile {
  file: string;
  useClient: boolean;
  imports: string[];
}

function listSources(entry: string): string[] {
  const full = path.join(root, entry);
  if (!fs.existsSync(full)) return [];
  if (fs.statSync(full).isFile()) return /\.tsx?$/.test(full) && !full.endsWith('.d.ts') ? [full] : [];
  return fs.readdirSync(full).flatMap((name) => listSources(path.join(entry, name)));
}

function resolveImport(from: string, specifier: string): string | null {
  let base: string;
  if (specifier.startsWith('@/')) base = path.join(root, specifier.slice(2));
  else if (specifier.startsWith('.')) base = path.resolve(path.dirname(from), specifier);
  else return null;
  if (fs.existsSync(base) && fs.statSync(base).isFile()) return base;
  for (const extension of EXTENSIONS) if (fs.existsSync(base + extension)) return base + extension;
  return null;
}

function isTypeOnly(node: ts.ImportDeclaration | ts.ExportDeclaration): boolean {
  if (ts.isExportDeclaration(node)) return node.isTypeOnly;
  const clause = node.importClause;
  if (!clause) return false; // a side-effect import runs code
  if (clause.isTypeOnly) return true;
  const named = clause.namedBindings;
  return !clause.name && named !== undefined && ts.isNamedImports(named) && named.elements.length > 0 && named.elements.every((element) => element.isTypeOnly);
}

function readGraph(): SourceFile[] {
  return SCANNED.flatMap(listSources).map((file) => {
    const text = fs.readFileSync(file, 'utf8');
    const source = ts.createSourceFile(file, text, ts.ScriptTarget.Latest, false);
    const imports: string[] = [];
    source.forEachChild((node) => {
      if ((ts.isImportDeclaration(node) || ts.isExportDeclaration(node)) && node.moduleSpecifier && ts.isStringLiteral(node.moduleSpecifier) && !isTypeOnly(node)) {
        const target = resolveImport(file, node.moduleSpecifier.text);
        if (target) imports.push(target);
      }
    });
    return { file, useClient: /^\s*['"]use client['"]/.test(text), imports };
  });
}

const relative = (file: string) => path.relative(root, file).split(path.sep).join('/');
const SERVER_LAYERS = /^(lib\/(data|auth|platform)\/|models\/)/;
const DATABASE = /^(models\/|lib\/platform\/db\.ts$)/;
const MAY_REACH_DATABASE = /^(lib\/data\/|lib\/platform\/|models\/)/;
const PURE_FEATURE = /^lib\/(?!data\/|auth\/|platform\/|http\/|mail\/)/;

function cyclesOf(graph: SourceFile[]): string[][] {
  const edges = new Map(graph.map((node) => [node.file, node.imports]));
  const index = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const onStack = new Set<string>();
  const found: string[][] = [];
  let counter = 0;
  const visit = (v: string) => {
    index.set(v, counter);
    low.set(v, counter++);
    stack.push(v);
    onStack.add(v);
    for (const w of edges.get(v) ?? []) {
      if (!index.has(w)) {
        visit(w);
        low.set(v, Math.min(low.get(v)!, low.get(w)!));
      } else if (onStack.has(w)) low.set(v, Math.min(low.get(v)!, index.get(w)!));
    }
    if (low.get(v) === index.get(v)) {
      const component: string[] = [];
      let w: string;
      do {
        w = stack.pop()!;
        onStack.delete(w);
        component.push(relative(w));
      } while (w !== v);
      if (component.length > 1) found.push(component.sort());
    }
  };
  for (const node of graph) if (!index.has(node.file)) visit(node.file);
  return found;
}

describe('the layout rules (DEVELOPERS.md, Layout)', () => {
  const graph = readGraph();

  it('reads the whole source tree', () => {
    expect(graph.length).toBeGreaterThan(200);
    expect(graph.some((node) => relative(node.file) === 'lib/data/runs.ts')).toBe(true);
  });

  it('has no import cycle', () => {
    expect(cyclesOf(graph)).toEqual([]);
  });

  it('reaches the database only from lib/data and lib/platform', () => {
    const offenders = graph.flatMap((node) =>
      MAY_REACH_DATABASE.test(relative(node.file)) ? [] : node.imports.filter((target) => DATABASE.test(relative(target))).map((target) => `${relative(node.file)} -> ${relative(target)}`),
    );
    expect(offenders).toEqual([]);
  });

  it('keeps feature folders of lib pure (no data, auth, platform or models)', () => {
    const offenders = graph.flatMap((node) =>
      PURE_FEATURE.test(relative(node.file)) ? node.imports.filter((target) => SERVER_LAYERS.test(relative(target))).map((target) => `${relative(node.file)} -> ${relative(target)}`) : [],
    );
    expect(offenders).toEqual([]);
  });

  it("keeps 'use client' files off the server-only layers", () => {
    const offenders = graph.flatMap((node) =>
      node.useClient ? node.imports.filter((target) => SERVER_LAYERS.test(relative(target))).map((target) => `${relative(node.file)} -> ${relative(target)}`) : [],
    );
    expect(offenders).toEqual([]);
  });
});
