// A part page depends on its measurement files too: editing one changes the key its folder and PDF are
// carried over by, so the next build draws the page again; the part file alone staying the same is not enough.

import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { pdfKeys } from '../../src/build/pdf-reuse.js';
import { partKey } from '../../src/build/reuse.js';
import { loadLibrary } from '../../src/model/library.js';
import { measuredLibrary, measuredTree, shuntThruText } from '../measure/measured-library.js';

describe('keys of a measured part', () => {
  it('change with the measurement file, not only with the part file', () => {
    const root = measuredLibrary();
    const before = loadLibrary(root).library!;
    writeFileSync(join(root, 'measurements', 'cap.s2p'), shuntThruText(measuredTree, 121));
    const after = loadLibrary(root).library!;
    const [a, b] = [before.partsById.get('CAP-M')!, after.partsById.get('CAP-M')!];
    expect(a.source.hash).toBe(b.source.hash);
    expect(partKey('site', a, false)).not.toBe(partKey('site', b, false));
    const pdf = 'pdf/parts/CAP-M.pdf';
    expect(pdfKeys(before, 'site').get(pdf)).not.toBe(pdfKeys(after, 'site').get(pdf));
    // The same files read again give the same key.
    expect(partKey('site', loadLibrary(root).library!.partsById.get('CAP-M')!, false)).toBe(partKey('site', b, false));
  });
});
