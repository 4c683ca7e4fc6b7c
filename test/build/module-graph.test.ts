// What loading the build loads: the modules src/build/build.ts reaches through static imports (type-only
// imports are erased, an `import()` waits until it runs) hold no chart drawing and no vega. A build that
// draws no chart (nothing changed, or only pages) then never loads vega, vega-lite and their thirty-odd
// packages, about a fifth of loading zfolio; a build that draws loads them when it draws its first chart
// (chart-pool.ts) or in its chart worker threads. Read from the source files themselves.

import { existsSync, readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const SRC = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..', 'src');

/** The specifiers a module imports statically for their values (not `import type`, not `import()`). */
function staticImports(text: string): string[] {
  const found: string[] = [];
  const statement = /^(?:import|export)\s+(?!type\s)([^;]*?)\s+from\s+'([^']+)'|^import\s+'([^']+)'/gms;
  for (const m of text.matchAll(statement)) {
    // `import { type A, type B } from` loads nothing either.
    const names = m[1];
    if (names !== undefined && /^\{[^}]*\}$/s.test(names.trim()) && names.replace(/[{}\s]/g, '').split(',').filter(Boolean).every((n) => n.startsWith('type'))) continue;
    found.push(m[2] ?? m[3]);
  }
  return found;
}

/** Every module reached from `entry` (paths under src/) and every package specifier met on the way, with the module that imports it. */
function reached(entry: string): { modules: Set<string>; packages: Map<string, string> } {
  const modules = new Set<string>();
  const packages = new Map<string, string>();
  const queue = [entry];
  while (queue.length > 0) {
    const file = queue.pop()!;
    if (modules.has(file)) continue;
    modules.add(file);
    for (const spec of staticImports(readFileSync(file, 'utf8'))) {
      if (spec.startsWith('.')) {
        const target = resolve(dirname(file), spec.replace(/\.js$/, '.ts'));
        expect(existsSync(target), `${file} imports ${spec}`).toBe(true);
        queue.push(target);
      } else if (!spec.startsWith('node:') && !packages.has(spec)) packages.set(spec, file);
    }
  }
  return { modules, packages };
}

describe('the modules a build loads before it draws', () => {
  const { modules, packages } = reached(join(SRC, 'build', 'build.ts'));

  it('are many (the walk follows the imports)', () => {
    expect(modules.size).toBeGreaterThan(100);
    expect(packages.has('@11ty/eleventy')).toBe(true);
    expect(packages.has('yaml')).toBe(true);
  });

  it('hold no vega package and no chart drawing', () => {
    const vega = [...packages].filter(([spec]) => /^vega(-|$)/.test(spec)).map(([spec, from]) => `${spec} from ${from}`);
    expect(vega).toEqual([]);
    // vega itself is loaded by charts/vega-runtime.ts (its single-file build, by path: no import names it).
    for (const drawing of ['charts/render.ts', 'build/chart-draw.ts', 'charts/text-metrics.ts', 'charts/vega-runtime.ts']) expect(modules.has(join(SRC, drawing))).toBe(false);
  });

  it('include the drawing modules in a chart worker', () => {
    const worker = reached(join(SRC, 'build', 'chart-worker.ts'));
    expect(worker.modules.has(join(SRC, 'charts', 'vega-runtime.ts'))).toBe(true);
    expect(worker.modules.has(join(SRC, 'build', 'chart-draw.ts'))).toBe(true);
  });

  it('leave vega-lite out of a chart worker and of drawing in this thread', () => {
    // vega-lite compiles only a spec the table of compiled specs lacks (charts/vega-specs.ts loads it then).
    for (const entry of ['build/chart-worker.ts', 'build/chart-draw.ts']) {
      const { packages: loaded } = reached(join(SRC, entry));
      expect(loaded.get('vega-lite'), entry).toBeUndefined();
    }
  });
});
