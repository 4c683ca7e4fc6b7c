import { describe, expect, it } from 'vitest';
import { warningNote } from '../../src/present/warning-notes.js';

describe('warning notes', () => {
  it('turn a located warning into a sentence with its advice and its place apart', () => {
    const note = warningNote({
      file: 'plans/vdd-3v3.yaml',
      line: 24,
      column: 12,
      severity: 'warning',
      message: 'capacitors[2].part: the rail\'s 3.3 V is 82.5% of the 4 V rating of P-1, above the derating limit of 80% (folio.yaml "derating")',
      advice: 'Place a part rated 4.13 V or more.',
    });
    expect(note).toEqual({
      text: 'The rail\'s 3.3 V is 82.5% of the 4 V rating of P-1, above the derating limit of 80% (folio.yaml "derating").',
      advice: 'Place a part rated 4.13 V or more.',
      location: 'plans/vdd-3v3.yaml:24:12',
    });
  });

  it('keep a message that starts with words, not a field path, and add no second full stop', () => {
    const note = warningNote({ file: 'plans/x.yaml', line: 1, column: 1, severity: 'warning', message: 'the rail has no regulator, plane or capacitors yet; "zfolio plan --suggest" can choose capacitors for it.' });
    expect(note.text).toBe('The rail has no regulator, plane or capacitors yet; "zfolio plan --suggest" can choose capacitors for it.');
    expect(note.advice).toBe('');
  });

  it('strip a nested field path such as mounting-by-package', () => {
    const note = warningNote({ file: 'p.yaml', line: 3, column: 5, severity: 'warning', message: 'mounting-by-package: no part in the library has package "0403"' });
    expect(note.text).toBe('No part in the library has package "0403".');
  });
});
