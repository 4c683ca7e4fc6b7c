// A part page depends on its measurement files too: editing one changes the key its folder and PDF are
// carried over by, so the next build draws the page again; the part file alone staying the same is not enough.

import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { pdfKeys } from '../../src/build/pdf-reuse.js';
import { partKey } from '../../src/build/reuse.js';
import type { Part } from '../../src/model/part.js';
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

describe("a part folder's key", () => {
  const part = (path: string, hash: string, measured = false) =>
    ({ source: { path, hash }, measurements: measured ? [{ file: 'measurements/a.s2p', hash: '0123456789abcdef' }] : [] }) as unknown as Part;
  const site = 'a'.repeat(16) + 'b'.repeat(48);

  it('changes with the site, the content, the PDF link, the measurements and the path, and with nothing else', () => {
    const base = partKey(site, part('parts/c.yaml', '0123456789abcdef'), false);
    expect(partKey(site, part('parts/c.yaml', '0123456789abcdef'), false)).toBe(base);
    const others = [
      partKey('c'.repeat(64), part('parts/c.yaml', '0123456789abcdef'), false),
      partKey(site, part('parts/c.yaml', 'fedcba9876543210'), false),
      partKey(site, part('parts/c.yaml', '0123456789abcdef'), true),
      partKey(site, part('parts/c.yaml', '0123456789abcdef', true), false),
      partKey(site, part('parts/d/c.yaml', '0123456789abcdef'), false),
    ];
    expect(new Set([base, ...others]).size).toBe(6);
  });

  it('keeps a measured part apart from a path that starts like a hash', () => {
    // Without measurements a space follows the PDF flag; with them, 16 hex digits and then the space.
    const measured = partKey(site, part('x.yaml', '0123456789abcdef', true), false);
    const hash = measured.slice(33, 49);
    expect(hash).toMatch(/^[0-9a-f]{16}$/);
    expect(partKey(site, part(`${hash} x.yaml`, '0123456789abcdef'), false)).not.toBe(measured);
  });
});
