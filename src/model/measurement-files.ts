// Reading the measurement files a library's parts name: each must be a readable text file inside the
// library's measurements/ folder. A missing or unreadable file is an error at the part's `file:` line; the
// text is kept on the entry (with its content hash, for caches) and read as Touchstone above this layer.

import type { DiagnosticList } from './diagnostics.js';
import { readDataFile } from './library-files.js';
import type { Part } from './part.js';
import { contentHash } from './source.js';

/** 16 MB: some 90,000 two-port frequencies, far more than an analyser sweep holds. */
export const MAX_MEASUREMENT_BYTES = 16 * 1024 * 1024;

export function loadMeasurementFiles(root: string, parts: readonly Part[], diagnostics: DiagnosticList): void {
  const read = new Map<string, ReturnType<typeof readDataFile>>();
  for (const part of parts) {
    part.measurements.forEach((entry, i) => {
      let result = read.get(entry.file);
      if (!result) {
        result = readDataFile(root, entry.file, MAX_MEASUREMENT_BYTES, 'a Touchstone file (.s1p, .s2p or .ts)');
        read.set(entry.file, result);
      }
      if ('problem' in result) {
        diagnostics.error(entry.fileAt, `measurements[${i}].file: ${result.problem}`);
        return;
      }
      entry.text = result.text;
      entry.hash = contentHash(result.text);
    });
  }
}
