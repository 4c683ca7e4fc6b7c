// A part's measurements: `measurements: [{file, fixture, note, date}]`, each file a Touchstone file under
// the library's measurements/ folder. Here the entries are read from the part file; the files themselves are
// read when the library is loaded (measurement-files.ts) and compared with the model above the model layer.

import { quote, type SourcePosition } from './diagnostics.js';
import { Fields } from './fields.js';
import { readDate } from './review.js';

/** How a measurement was made (src/measure/fixtures.ts turns each into an impedance). */
export const MEASUREMENT_FIXTURES = ['reflection', 'shunt-thru', 'series-thru'] as const;
export type MeasurementFixture = (typeof MEASUREMENT_FIXTURES)[number];

/** The folder of the library that holds measurement files. */
export const MEASUREMENTS_FOLDER = 'measurements';

export interface MeasurementEntry {
  /** Library-relative path with forward slashes, under measurements/. */
  file: string;
  /** As written; when absent, chosen from the file's port count and the part's kind. */
  fixture?: MeasurementFixture;
  note?: string;
  /** YYYY-MM-DD. */
  date?: string;
  /** The list item, and the file name in it, for messages. */
  at: SourcePosition;
  fileAt: SourcePosition;
  /** The file's text and content hash, filled in when the library is loaded. */
  text?: string;
  hash?: string;
}

/** What a part's pages depend on besides its part file: each measurement file's path and content hash. */
export function measurementInputs(entries: readonly MeasurementEntry[]): string {
  return entries.map((e) => `${e.file} ${e.hash ?? ''}`).join('\n');
}

const ENTRY_FIELDS = ['file', 'fixture', 'note', 'date'];
// Under measurements/, no backslash; and (checked below) no ".", ".." or empty segment: a file inside the folder.
const FILE_PATTERN = /^measurements\/[^\\]+$/;
const FILE_HINT = `a file under ${MEASUREMENTS_FOLDER}/, written from the library folder (e.g. measurements/part.s2p)`;

/** The `measurements` list of a part file; problems go to the file's diagnostics. */
export function readMeasurementEntries(root: Fields): MeasurementEntry[] {
  const list = root.seq('measurements');
  if (!list) return [];
  const entries: MeasurementEntry[] = [];
  list.items.forEach((item, i) => {
    const label = `measurements[${i}]`;
    const entry = Fields.of(root.ctx, item, label);
    if (!entry) return;
    entry.expect(ENTRY_FIELDS, ['file'], () => 'the measurement file under measurements/, e.g. file: measurements/part.s2p');
    let file = entry.text('file', { pattern: FILE_PATTERN, patternHint: FILE_HINT });
    if (file !== undefined && file.split('/').some((segment) => segment === '' || segment === '.' || segment === '..')) {
      entry.error('file', `expected ${FILE_HINT}, found ${quote(file)}`);
      file = undefined;
    }
    const fixture = entry.text('fixture', { oneOf: MEASUREMENT_FIXTURES }) as MeasurementFixture | undefined;
    const note = entry.text('note');
    const date = entry.has('date') ? readDate(entry, 'date') : undefined;
    if (file === undefined) return;
    if (entries.some((e) => e.file === file && e.fixture === fixture)) {
      entry.warning('file', `${quote(file)} is listed twice with the same fixture; the second entry repeats the first`);
    }
    entries.push({ file, fixture, note, date, at: entry.position(), fileAt: entry.position('file') });
  });
  return entries;
}
