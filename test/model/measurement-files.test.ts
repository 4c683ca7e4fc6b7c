// Measurement files named by parts: read with the library, each problem located at the part's `file:`
// line; folio.yaml's warning threshold.

import { mkdirSync, symlinkSync, writeFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { formatDiagnostic } from '../../src/model/diagnostics.js';
import { loadLibrary } from '../../src/model/library.js';
import { contentHash } from '../../src/model/source.js';
import { tempDir } from '../site-helpers.js';
import { measuredLibrary } from '../measure/measured-library.js';

const messages = (root: string) => loadLibrary(root).diagnostics.map(formatDiagnostic);

describe('measurement files', () => {
  it('are read with the library: text and hash on the entry', () => {
    const root = measuredLibrary();
    const { library, diagnostics } = loadLibrary(root);
    expect(diagnostics).toEqual([]);
    const entry = library!.partsById.get('CAP-M')!.measurements[0];
    expect(entry.text?.startsWith('! synthetic measurement made by a test\n')).toBe(true);
    expect(entry.hash).toBe(contentHash(entry.text!));
  });

  it('a missing file is an error at the part\'s file: line; nothing loads', () => {
    const root = measuredLibrary({ entry: '{file: measurements/other.s2p}' });
    expect(loadLibrary(root).library).toBeUndefined();
    expect(messages(root)).toEqual(['parts/cap.yaml:7:12: measurements[0].file: no file measurements/other.s2p in the library']);
  });

  it('a folder, a file that is not text, a link out of the library', () => {
    const root = measuredLibrary({ entry: '{file: measurements/dir.s2p}\n  - {file: measurements/binary.s2p}\n  - {file: measurements/out.s2p}' });
    mkdirSync(join(root, 'measurements', 'dir.s2p'));
    writeFileSync(join(root, 'measurements', 'binary.s2p'), Buffer.from([0x21, 0xff, 0xfe, 0x0a]));
    const outside = join(tempDir('outside'), 'x.s2p');
    writeFileSync(outside, '# GHz S RI\n');
    symlinkSync(outside, join(root, 'measurements', 'out.s2p'));
    expect(messages(root)).toEqual([
      'parts/cap.yaml:7:12: measurements[0].file: measurements/dir.s2p is a folder; expected a Touchstone file (.s1p, .s2p or .ts)',
      'parts/cap.yaml:8:12: measurements[1].file: measurements/binary.s2p is not text (it holds a byte that is not UTF-8); expected a Touchstone file (.s1p, .s2p or .ts)',
      'parts/cap.yaml:9:12: measurements[2].file: measurements/out.s2p is a symbolic link to a place outside the library folder; zfolio follows links only within the library, so copy the file in instead',
    ]);
    rmSync(outside);
  });
});

describe('folio.yaml measurements: warn-above', () => {
  it('defaults to 1 dB; takes "0.5 dB", "2dB" or a bare number', () => {
    expect(loadLibrary(measuredLibrary()).library!.settings.measurementWarnDb).toBe(1);
    for (const [text, value] of [['0.5 dB', 0.5], ['2dB', 2], ['3', 3]] as const) {
      expect(loadLibrary(measuredLibrary({ extraSettings: `measurements: {warn-above: ${text}}\n` })).library!.settings.measurementWarnDb).toBe(value);
    }
  });

  it.each(['0 dB', '-1', '50 dB', 'one'])('refuses %j', (text) => {
    const root = measuredLibrary({ extraSettings: `measurements: {warn-above: ${text}}\n` });
    expect(messages(root)).toEqual([`folio.yaml:3:28: measurements.warn-above: expected an rms |Z| error in dB above 0 and at most 40 (e.g. 1 dB), found "${text}"`]);
  });
});
