// A plan read from YAML text in a test, its parts from their own texts: the same reader a library uses, with
// no problem reported (the test fails on any diagnostic).

import { expect } from 'vitest';
import { DiagnosticList, formatDiagnostic } from '../../src/model/diagnostics.js';
import { readPart } from '../../src/model/part.js';
import { readPlan, type Plan } from '../../src/model/plan.js';
import { parseYamlSource } from '../../src/model/source.js';
import type { TemperatureRange } from '../../src/model/spread.js';

export function planFromYaml(partFiles: readonly string[], planFile: string, operating?: TemperatureRange): Plan {
  const d = new DiagnosticList();
  const parts = partFiles.map((t, i) => readPart({ source: parseYamlSource(`parts/${i}.yaml`, t, d)!, diagnostics: d })!);
  const p = readPlan({ source: parseYamlSource('plans/r.yaml', planFile, d)!, diagnostics: d }, new Map(parts.map((x) => [x.id, x])), 0.8, operating);
  expect(d.sorted().map(formatDiagnostic)).toEqual([]);
  return p!;
}
