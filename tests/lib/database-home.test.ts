import fs from 'node:fs';
import path from 'node:path';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

/**
 * One home for the database (DEVELOPERS.md, "Models and the database"), read from the source with
 * the TypeScript parser:
 * - only lib/platform/db.ts constructs a Sequelize instance (scripts, seeders and migrations too);
 * - lib/data takes the instance from models/index.ts, never from lib/platform/db directly, so the
 *   models are always initialised on the instance it queries;
 * - every table a migration creates has a model (`tableName`) in models/. Whether each model declares
 *   exactly its table's columns is checked against the migrated database in
 *   tests/integration/models-match-schema.test.ts.
 */
const root = path.resolve(__dirname, '../..');

function sourcesUnder(entry: string): string[] {
  const full = path.join(root, entry);
  if (!fs.existsSync(full)) return [];
  if (fs.statSync(full).isFile()) return /\.(ts|tsx|mts|cts)$/.test(full) && !full.endsWith('.d.ts') ? [full] : [];
  return fs.readdirSync(full).flatMap((name) => sourcesUnder(path.join(entry, name)));
}

const relative = (file: string) => path.relative(root, file).split(path.sep).join('/');

/** Every node of a file, depth first. */
function nodesOf(file: string): ts.Node[] {
  const source = ts.createSourceFile(file, fs.readFileSync(file, 'utf8'), ts.ScriptTarget.Latest, true);
  const nodes: ts.Node[] = [];
  const walk = (node: ts.Node) => {
    nodes.push(node);
    node.forEachChild(walk);
  };
  walk(source);
  return nodes;
}

/** The first string argument of every call to `name` (a method or a plain function) in a file. */
function firstStringArguments(file: string, name: string): string[] {
  return nodesOf(file).flatMap((node) => {
    if (!ts.isCallExpression(node)) return [];
    const callee = ts.isPropertyAccessExpression(node.expression) ? node.expression.name.text : ts.isIdentifier(node.expression) ? node.expression.text : '';
    const first = node.arguments[0];
    return callee === name && first && ts.isStringLiteralLike(first) ? [first.text] : [];
  });
}

describe('one home for the database', () => {
  it('constructs Sequelize in lib/platform/db.ts only', () => {
    const files = ['app', 'components', 'lib', 'models', 'scripts', 'seeders', 'migrations', 'proxy.ts'].flatMap(sourcesUnder);
    expect(files.length).toBeGreaterThan(200);
    // Only files that mention the name are parsed (the parse is what decides).
    const constructing = files
      .filter((file) => fs.readFileSync(file, 'utf8').includes('Sequelize'))
      .filter((file) => nodesOf(file).some((node) => ts.isNewExpression(node) && ts.isIdentifier(node.expression) && node.expression.text === 'Sequelize'));
    expect(constructing.map(relative)).toEqual(['lib/platform/db.ts']);
  });

  it('lets lib/data take the Sequelize instance from models, never from lib/platform/db', () => {
    const offenders = sourcesUnder('lib/data').filter((file) =>
      nodesOf(file).some((node) => ts.isImportDeclaration(node) && ts.isStringLiteral(node.moduleSpecifier) && /(^@\/lib\/platform\/db$|\/platform\/db$)/.test(node.moduleSpecifier.text)),
    );
    expect(offenders.map(relative)).toEqual([]);
  });

  it('has a model for every table a migration creates', () => {
    const created = sourcesUnder('migrations').flatMap((file) => firstStringArguments(file, 'createTable'));
    // Source: the migrations themselves; at least the tables of the first schema (users … uploads).
    expect(created).toContain('runs');
    expect(created.length).toBeGreaterThanOrEqual(23);
    const modelled = new Set(
      sourcesUnder('models').flatMap((file) =>
        nodesOf(file).flatMap((node) =>
          ts.isPropertyAssignment(node) && ts.isIdentifier(node.name) && node.name.text === 'tableName' && ts.isStringLiteralLike(node.initializer) ? [node.initializer.text] : [],
        ),
      ),
    );
    expect(created.filter((table) => !modelled.has(table)).sort()).toEqual([]);
  });
});
