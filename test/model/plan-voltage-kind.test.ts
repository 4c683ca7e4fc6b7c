// A DC rail is checked against DC ratings only. An AC rating is an r.m.s. value for alternating voltage; it
// says nothing certain about the DC a part can hold, so a part rated "310V AC" alone is unchecked on a DC
// rail (and says so), never a "310 V" part with plenty of margin. A part with both kinds is held to its DC
// rating, so the derating arithmetic below (rail ÷ DC rating against 80%, common practice) decides.

import { describe, expect, it } from 'vitest';
import { DiagnosticList, formatDiagnostic } from '../../src/model/diagnostics.js';
import { readPart, type Part } from '../../src/model/part.js';
import { readPlan, voltageStress } from '../../src/model/plan.js';
import { parseYamlSource } from '../../src/model/source.js';

function part(yaml: string): Part {
  const diagnostics = new DiagnosticList();
  const source = parseYamlSource('parts/t.yaml', yaml, diagnostics);
  const p = source ? readPart({ source, diagnostics }) : undefined;
  expect(diagnostics.sorted().map(formatDiagnostic)).toEqual([]);
  return p!;
}

const AC_ONLY = part('id: T-AC\nkind: capacitor\nnominal: 100n\nvoltage: 310V AC\nsafety: X2\n');
const BOTH = part('id: T-BOTH\nkind: capacitor\nnominal: 100n\nvoltage: [275V AC, 20V DC]\n');
const DC = part('id: T-DC\nkind: capacitor\nnominal: 100n\nvoltage: 400V DC\n');
const parts = new Map([AC_ONLY, BOTH, DC].map((p) => [p.id, p]));

function plan(railV: string, id: string): string[] {
  const text = `rail: VDD_X\nvoltage: ${railV}\ntarget: 10m\nband: {from: 100k, to: 10M}\nmounting: 0.3nH\ncapacitors:\n  - {part: ${id}, count: 1}\n`;
  const diagnostics = new DiagnosticList();
  const source = parseYamlSource('plans/p.yaml', text, diagnostics);
  if (source) readPlan({ source, diagnostics }, parts, 0.8);
  return diagnostics.sorted().map(formatDiagnostic);
}

describe('voltageStress uses DC ratings only', () => {
  it('a part rated 310 V AC alone is unrated on a DC rail, at 0.9 V as at 400 V', () => {
    expect(voltageStress(AC_ONLY, 0.9, 0.8)).toBe('unrated');
    expect(voltageStress(AC_ONLY, 400, 0.8)).toBe('unrated');
  });

  it('a part with both kinds is held to its DC rating: 17 V is 85% of 20 V DC, above 80%; 21 V is over it', () => {
    expect(voltageStress(BOTH, 15, 0.8)).toBe('ok');
    expect(voltageStress(BOTH, 17, 0.8)).toBe('above-derating');
    expect(voltageStress(BOTH, 21, 0.8)).toBe('over-rating');
  });

  it('an explicit DC rating counts like a bare one', () => {
    expect(voltageStress(DC, 330, 0.8)).toBe('above-derating');
  });

  it('a plan placing an AC-only part says why the rail cannot be checked, at the entry', () => {
    expect(plan('0.9V', 'T-AC')).toEqual([
      "plans/p.yaml:7:12: warning: capacitors[0].part: T-AC is rated 310 V AC only, and an AC rating is not a DC rating, so the rail's 900 mV cannot be checked against it",
    ]);
  });

  it('a plan over the DC rating of a dual-rated part is an error, however high its AC rating', () => {
    expect(plan('24V', 'T-BOTH')).toEqual(["plans/p.yaml:7:12: capacitors[0].part: the rail's 24 V exceeds the 20 V rating of T-BOTH; choose a part rated above the rail"]);
  });
});
