import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { analysePlan } from '../../src/analysis/plan-figures.js';
import { planPageData } from '../../src/pages/plan-page.js';
import { DiagnosticList } from '../../src/model/diagnostics.js';
import { loadLibrary } from '../../src/model/library.js';
import { readPlan } from '../../src/model/plan.js';
import { parseYamlSource } from '../../src/model/source.js';

// The plan page's data for a rail placed above one part's DC-bias table (fixture library, invented parts).
const { library } = loadLibrary(fileURLToPath(new URL('../fixtures/rail-library', import.meta.url)));

function plan(text: string) {
  const diagnostics = new DiagnosticList();
  const source = parseYamlSource('plans/hot.yaml', text, diagnostics)!;
  return readPlan({ source, diagnostics }, library!.partsById, 0.8)!;
}

describe('plan page: DC bias', () => {
  const hot = plan('rail: HOT\nvoltage: 3.3V\ntarget: 20m\nband: {from: 1M, to: 10M}\nmounting: 0.3nH\ncapacitors:\n  - {part: RT-C-4U7, count: 4}\n  - {part: RT-C-22U, count: 2}\n');
  const page = planPageData(analysePlan(hot, 50), 'hash', undefined, undefined);
  it('marks the extrapolated value beside the part, with the table end, and says how in the note', () => {
    // RT-C-4U7's table ends at 2 V (80 %); RT-C-22U's at 6.3 V.
    expect(page.placements[0]).toMatchObject({ partId: 'RT-C-4U7', atRail: '3.76 µF (80%)', note: 'DC-bias table, extrapolated: the table ends at 2 V, its last fraction is held' });
    expect(page.placements[1]).toMatchObject({ partId: 'RT-C-22U', note: 'DC-bias table' });
    expect(page.biasNote).toContain('above a table\'s last point its last fraction is held, which is likely optimistic');
    // A note for a reader: a sentence without the field path, what to do, and the place kept apart.
    expect(page.warnings).toEqual([
      {
        text: expect.stringMatching(/^The DC-bias table of RT-C-4U7 ends at 2 V, below the rail's 3\.3 V; .*\.$/),
        advice: expect.stringContaining('Extend the DC-bias table of RT-C-4U7'),
        location: 'plans/hot.yaml:7:12',
      },
    ]);
  });
  it('says nothing of extrapolation when every rail voltage is inside its table', () => {
    const cool = planPageData(analysePlan(plan('rail: COOL\nvoltage: 1V\ntarget: 20m\nband: {from: 1M, to: 10M}\nmounting: 0.3nH\ncapacitors:\n  - {part: RT-C-4U7, count: 4}\n'), 50), 'hash', undefined, undefined);
    expect(cool.placements[0].note).toBe('DC-bias table');
    expect(cool.biasNote).not.toContain('extrapolat');
    expect(cool.biasNote).not.toContain('optimistic');
  });
});
