// The layers of src/, read from the import statements themselves: no module imports a value from a layer
// above its own, the pure layers load no file system, YAML, rendering or browser package, and src/analysis
// takes only types from src/model (so the physics never loads the YAML reader). The check parses every
// source file with the TypeScript compiler and looks at its import and export declarations; an import
// counts as type-only when it says so (`import type`, or `type` on every name), whatever the compiler
// would elide.

import { readdirSync, readFileSync } from 'node:fs';
import { join, relative, resolve, sep } from 'node:path';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';
import { REPO } from './site-helpers.js';

const SRC = join(REPO, 'src');

/** Lowest first: a module may import values from its own layer and the layers before it. */
export const LAYERS = ['units', 'circuit', 'model', 'analysis', 'measure', 'history', 'present', 'charts', 'pages', 'print', 'build', 'serve', 'cli'] as const;
type Layer = (typeof LAYERS)[number];

/** Files directly under src/ and the layer they belong to. */
const ROOT_FILES: Readonly<Record<string, Layer>> = { 'version.ts': 'pages', 'on-exit.ts': 'print' };

/** Layers that take numbers (or figures) and return numbers (or words): no file system, no rendering. */
const PURE: readonly Layer[] = ['units', 'circuit', 'analysis', 'measure', 'present'];
/** Packages a pure layer may load, by layer. */
const PURE_PACKAGES: Readonly<Partial<Record<Layer, readonly string[]>>> = { circuit: ['ml-matrix'] };

export interface ImportEdge {
  /** The importing file, relative to src/ with forward slashes. */
  from: string;
  /** What the import names: a path relative to src/ for a relative import, else the package name. */
  to: string;
  relative: boolean;
  typeOnly: boolean;
  line: number;
}

function sourceFiles(dir: string): string[] {
  const out: string[] = [];
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) out.push(...sourceFiles(path));
    else if (entry.name.endsWith('.ts') && !entry.name.endsWith('.d.ts')) out.push(path);
  }
  return out.sort();
}

const srcPath = (file: string) => relative(SRC, file).split(sep).join('/');

/** Every import, re-export and dynamic import of a source file. */
export function importsOf(file: string, text = readFileSync(file, 'utf8')): ImportEdge[] {
  const source = ts.createSourceFile(file, text, ts.ScriptTarget.ES2022, true);
  const edges: ImportEdge[] = [];
  const add = (specifier: string, typeOnly: boolean, node: ts.Node) => {
    const isRelative = specifier.startsWith('.');
    const to = isRelative ? srcPath(resolve(file, '..', specifier)).replace(/\.js$/, '.ts') : packageName(specifier);
    edges.push({ from: srcPath(file), to, relative: isRelative, typeOnly, line: source.getLineAndCharacterOfPosition(node.getStart()).line + 1 });
  };
  const visit = (node: ts.Node) => {
    if (ts.isImportDeclaration(node) && ts.isStringLiteral(node.moduleSpecifier)) {
      const clause = node.importClause;
      const named = clause?.namedBindings && ts.isNamedImports(clause.namedBindings) ? clause.namedBindings.elements : undefined;
      const typeOnly = clause !== undefined && (clause.isTypeOnly || (clause.name === undefined && named !== undefined && named.length > 0 && named.every((e) => e.isTypeOnly)));
      add(node.moduleSpecifier.text, typeOnly, node);
    } else if (ts.isExportDeclaration(node) && node.moduleSpecifier && ts.isStringLiteral(node.moduleSpecifier)) {
      const named = node.exportClause && ts.isNamedExports(node.exportClause) ? node.exportClause.elements : undefined;
      add(node.moduleSpecifier.text, node.isTypeOnly || (named !== undefined && named.length > 0 && named.every((e) => e.isTypeOnly)), node);
    } else if (ts.isCallExpression(node) && node.expression.kind === ts.SyntaxKind.ImportKeyword && node.arguments.length > 0 && ts.isStringLiteral(node.arguments[0])) {
      add(node.arguments[0].text, false, node);
    }
    ts.forEachChild(node, visit);
  };
  visit(source);
  return edges;
}

/** "node:fs" → "node:", "@11ty/eleventy/x" → "@11ty/eleventy", "yaml" → "yaml". */
function packageName(specifier: string): string {
  if (specifier.startsWith('node:')) return 'node:';
  const parts = specifier.split('/');
  return specifier.startsWith('@') ? parts.slice(0, 2).join('/') : parts[0];
}

/** The layer of a src/-relative path, or undefined for a folder the table does not know. */
export function layerOf(path: string): Layer | undefined {
  const [top, ...rest] = path.split('/');
  if (rest.length === 0) return ROOT_FILES[top];
  return (LAYERS as readonly string[]).includes(top) ? (top as Layer) : undefined;
}

/** What is wrong with one edge, or undefined. */
export function edgeProblem(edge: ImportEdge): string | undefined {
  const from = layerOf(edge.from);
  const where = `src/${edge.from}:${edge.line}`;
  if (!from) return `${where}: src/${edge.from} is in no layer; add its folder to LAYERS in test/layers.test.ts`;
  if (!edge.relative) {
    if (!PURE.includes(from) || edge.typeOnly) return undefined;
    if ((PURE_PACKAGES[from] ?? []).includes(edge.to)) return undefined;
    return `${where}: ${from} is a pure layer but loads ${edge.to === 'node:' ? 'a Node built-in' : edge.to}`;
  }
  const to = layerOf(edge.to);
  if (!to) return `${where}: imports src/${edge.to}, which is in no layer`;
  if (edge.typeOnly) return undefined;
  if (LAYERS.indexOf(to) > LAYERS.indexOf(from)) return `${where}: ${from} imports a value from ${to}, a higher layer (src/${edge.to})`;
  if (from === 'analysis' && to === 'model') return `${where}: analysis imports a value from model (src/${edge.to}); take only types from model`;
  return undefined;
}

describe('the import reader', () => {
  const read = (text: string) => importsOf(join(SRC, 'analysis', 'x.ts'), text);

  it('tells type-only imports from value imports, as written', () => {
    const edges = read(
      [
        "import type { Part } from '../model/part.js';",
        "import { type Plan, type Placement } from '../model/plan.js';",
        "import { voltageStress, type Plan as P } from '../model/plan.js';",
        "import Eleventy from '@11ty/eleventy';",
        "import * as fs from 'node:fs';",
        "export { quote } from '../units/quote.js';",
        "export type { Diagnostic } from '../model/diagnostics.js';",
        "const late = () => import('../charts/render.js');",
      ].join('\n'),
    );
    expect(edges.map((e) => [e.to, e.typeOnly, e.line])).toEqual([
      ['model/part.ts', true, 1],
      ['model/plan.ts', true, 2],
      ['model/plan.ts', false, 3],
      ['@11ty/eleventy', false, 4],
      ['node:', false, 5],
      ['units/quote.ts', false, 6],
      ['model/diagnostics.ts', true, 7],
      ['charts/render.ts', false, 8],
    ]);
  });

  it('finds every kind of problem it is meant to find', () => {
    const problems = read(
      [
        "import { voltageStress } from '../model/plan.js';",
        "import type { Part } from '../model/part.js';",
        "import { renderChart } from '../charts/render.js';",
        "import type { ChartOutput } from '../charts/render.js';",
        "import { readFileSync } from 'node:fs';",
        "import { frequencyRoot } from './root.js';",
      ].join('\n'),
    ).map(edgeProblem);
    expect(problems[0]).toMatch(/analysis imports a value from model/);
    expect(problems[1]).toBeUndefined();
    expect(problems[2]).toMatch(/analysis imports a value from charts, a higher layer/);
    expect(problems[3]).toBeUndefined();
    expect(problems[4]).toMatch(/pure layer but loads a Node built-in/);
    expect(problems[5]).toBeUndefined();
  });

  it('places an unknown folder in no layer, and says so', () => {
    expect(edgeProblem({ from: 'gadgets/x.ts', to: 'units/quote.ts', relative: true, typeOnly: false, line: 1 })).toMatch(/in no layer/);
  });
});

describe('the layers of src/', () => {
  const edges = sourceFiles(SRC).flatMap((f) => importsOf(f));

  it('reads the whole tree', () => {
    // A sanity floor: the tree has well over a hundred modules and several hundred imports.
    expect(new Set(edges.map((e) => e.from)).size).toBeGreaterThan(100);
    expect(edges.length).toBeGreaterThan(400);
  });

  it('has no upward value import, no value from model in analysis, and nothing impure in the pure layers', () => {
    expect(edges.map(edgeProblem).filter((p) => p !== undefined)).toEqual([]);
  });

  it('imports only files that exist', () => {
    const files = new Set(sourceFiles(SRC).map(srcPath));
    const missing = edges.filter((e) => e.relative && !files.has(e.to) && !e.to.endsWith('.d.ts')).map((e) => `src/${e.from}:${e.line} -> src/${e.to}`);
    expect(missing).toEqual([]);
  });
});
