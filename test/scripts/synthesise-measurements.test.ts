// The demo library's measurement files are synthetic and reproducible: the generator kept in the repo writes
// exactly the files in measurements/, each says in its comments that it is synthetic, and each part that
// lists one names a file the generator made.

import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadLibrary } from '../../src/model/library.js';
import { DEMO_MEASUREMENTS, writeDemoMeasurements } from '../../scripts/synthesise-measurements.js';
import { REPO, tempDir } from '../site-helpers.js';

describe('the demo measurements', () => {
  it('are exactly what the seeded generator writes', () => {
    const dir = tempDir('demo-measurements');
    writeDemoMeasurements(dir);
    expect(readdirSync(join(REPO, 'measurements')).sort()).toEqual(readdirSync(join(dir, 'measurements')).sort());
    for (const m of DEMO_MEASUREMENTS) expect(readFileSync(join(REPO, m.file), 'utf8'), m.file).toBe(readFileSync(join(dir, m.file), 'utf8'));
  });

  it('say they are synthetic, in their first comment line', () => {
    for (const m of DEMO_MEASUREMENTS) expect(readFileSync(join(REPO, m.file), 'utf8').split('\n')[0]).toBe('! SYNTHETIC measurement for the zfolio demo library: no part was measured.');
  });

  it('are the files the demo parts list, with the fixture they were made for', () => {
    const { library } = loadLibrary(REPO);
    const listed = library!.parts.flatMap((p) => p.measurements.map((e) => ({ part: p.id, file: e.file, fixture: e.fixture })));
    expect(listed.sort((a, b) => (a.file < b.file ? -1 : 1))).toEqual(DEMO_MEASUREMENTS.map((m) => ({ part: m.part, file: m.file, fixture: m.fixture })).sort((a, b) => (a.file < b.file ? -1 : 1)));
  });
});
