// Reading a measurement file named on the command line: a regular file of at most MAX_MEASUREMENT_BYTES,
// checked before it is opened (a named pipe never blocks), then read as a Touchstone file.

import { closeSync, fstatSync, openSync, readSync, statSync } from 'node:fs';
import { formatDiagnostic, type Diagnostic } from '../model/diagnostics.js';
import { readTouchstone } from '../measure/touchstone-read.js';
import type { NetworkData } from '../measure/network-data.js';

/** 64 MB: some 350,000 two-port frequencies, far beyond any analyser sweep. */
export const MAX_MEASUREMENT_BYTES = 64 * 1024 * 1024;

export type MeasurementRead = { ok: true; data: NetworkData } | { ok: false; lines: string[] };

/** Read and parse `path`; `shown` is the name messages give it. */
export function readMeasurementFile(path: string, shown: string): MeasurementRead {
  const at = (message: string): MeasurementRead => ({ ok: false, lines: [formatDiagnostic({ file: shown, line: 1, column: 1, severity: 'error', message })] });
  let size: number;
  try {
    const s = statSync(path);
    if (!s.isFile()) return at(`expected a Touchstone file, found ${s.isDirectory() ? 'a folder' : 'something that is not a regular file'}`);
    size = s.size;
  } catch {
    return at('no such file');
  }
  if (size > MAX_MEASUREMENT_BYTES) return at(`the file is ${(size / 1048576).toFixed(0)} MB; zfolio reads measurement files of up to ${MAX_MEASUREMENT_BYTES / 1048576} MB`);
  let text: string;
  try {
    const fd = openSync(path, 'r');
    try {
      const buffer = Buffer.alloc(Math.min(fstatSync(fd).size, MAX_MEASUREMENT_BYTES + 1));
      const read = readSync(fd, buffer, 0, buffer.length, 0);
      text = buffer.subarray(0, read).toString('utf8');
    } finally {
      closeSync(fd);
    }
  } catch (error) {
    return at(`cannot read the file: ${(error as NodeJS.ErrnoException).code ?? (error as Error).message}`);
  }
  const result = readTouchstone(text, shown);
  return result.ok ? result : { ok: false, lines: result.errors.map((d: Diagnostic) => formatDiagnostic(d)) };
}
