// folio.yaml: defaults when it is absent or empty, each field overriding its default, and the messages
// for values out of range.

import { mkdtempSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { DiagnosticList, formatDiagnostic } from '../../src/model/diagnostics.js';
import { loadLibrary } from '../../src/model/library.js';
import { DEFAULT_SETTINGS, readSettings, type FolioSettings } from '../../src/model/settings.js';
import { parseYamlSource } from '../../src/model/source.js';

function read(yaml: string): { settings?: FolioSettings; messages: string[] } {
  const diagnostics = new DiagnosticList();
  const source = parseYamlSource('folio.yaml', yaml, diagnostics);
  const settings = source ? readSettings({ source, diagnostics }) : undefined;
  return { settings, messages: diagnostics.sorted().map(formatDiagnostic) };
}

describe('defaults', () => {
  it('are 100 Hz to 10 GHz at 100 points a decade, within 10%, A4, 80% derating, 0 °C to 70 °C', () => {
    expect(DEFAULT_SETTINGS).toEqual({
      title: 'Part library',
      sweep: { fromHz: 100, toHz: 10e9, perDecade: 100 },
      within: 0.1,
      paper: 'A4',
      derating: 0.8,
      // The commercial temperature range (common practice).
      temperature: { fromC: 0, toC: 70 },
      measurementWarnDb: 1,
    });
  });

  it('apply to an empty folio.yaml', () => {
    expect(read('')).toEqual({ settings: DEFAULT_SETTINGS, messages: [] });
    expect(read('# nothing set yet\n')).toEqual({ settings: DEFAULT_SETTINGS, messages: [] });
  });

  describe('apply to a library without folio.yaml', () => {
    const root = mkdtempSync(join(tmpdir(), 'zfolio-settings-'));
    afterAll(() => rmSync(root, { recursive: true, force: true }));
    it('and it loads', () => {
      mkdirSync(join(root, 'parts'));
      writeFileSync(join(root, 'parts', 'r.yaml'), '# Invented test part.\nid: R-1\nkind: resistor\nnominal: 1k\n');
      const { library, diagnostics } = loadLibrary(root);
      expect(diagnostics).toEqual([]);
      expect(library?.settings).toEqual(DEFAULT_SETTINGS);
      expect(library?.parts.map((p) => p.id)).toEqual(['R-1']);
    });
  });

  it('fill in what a partial folio.yaml leaves out', () => {
    const { settings, messages } = read('sweep: {to: 1G}\n');
    expect(messages).toEqual([]);
    expect(settings).toEqual({ ...DEFAULT_SETTINGS, sweep: { fromHz: 100, toHz: 1e9, perDecade: 100 } });
  });
});

describe('overrides', () => {
  it('every field in engineering notation, stored in SI units', () => {
    const { settings, messages } = read(`
title: Bench library
owner: Test team (invented)
sweep:
  from: 1 kHz
  to: 3G
  per-decade: 40
band: {within: 5%}
paper: Letter
derating: 50%
`);
    expect(messages).toEqual([]);
    expect(settings).toMatchObject({
      title: 'Bench library',
      owner: 'Test team (invented)',
      sweep: { fromHz: 1e3, toHz: 3e9, perDecade: 40 },
      within: 0.05,
      paper: 'Letter',
      derating: 0.5,
    });
  });

  it('do not change the shared defaults object', () => {
    read('sweep: {from: 1k, per-decade: 10}\n');
    expect(DEFAULT_SETTINGS.sweep).toEqual({ fromHz: 100, toHz: 10e9, perDecade: 100 });
  });
});

describe('messages', () => {
  it('a sweep that ends below its start, at the value of `to`', () => {
    expect(read('sweep:\n  from: 10G\n  to: 1k\n').messages).toEqual([
      'folio.yaml:3:7: sweep.to: expected a frequency above the start of the sweep (from: 10 GHz), found 1 kHz',
    ]);
  });

  it('a start above the default end, at the value of `from`', () => {
    expect(read('sweep: {from: 20G}\n').messages).toEqual([
      'folio.yaml:1:15: sweep.from: expected a frequency below the end of the sweep (default to: 10 GHz), found 20 GHz',
    ]);
  });

  it('a fractional or excessive number of points a decade', () => {
    expect(read('sweep: {per-decade: 2.5}\n').messages).toEqual([
      'folio.yaml:1:21: sweep.per-decade: expected a whole number of points from 1 to 10000, found "2.5"',
    ]);
    expect(read('sweep: {per-decade: 20000}\n').messages).toEqual([
      'folio.yaml:1:21: sweep.per-decade: expected a whole number of points from 1 to 10000, found "20000"',
    ]);
  });

  it('an unknown paper size, with the near miss', () => {
    expect(read('paper: A5\n').messages).toEqual(['folio.yaml:1:8: paper: expected one of A4, Letter, found "A5"; did you mean "A4"?']);
  });

  it('a derating above 100%', () => {
    expect(read('derating: 150%\n').messages).toEqual(['folio.yaml:1:11: derating: expected a fraction of the rating up to 100%, found "150%"']);
  });

  it('an unknown field inside sweep, at its key', () => {
    expect(read('sweep:\n  form: 1k\n').messages).toEqual(['folio.yaml:2:3: unknown field "sweep.form"; did you mean "from"?']);
  });

  it('a list instead of a mapping', () => {
    expect(read('- title: x\n').messages).toEqual(['folio.yaml:1:1: expected a mapping of fields, found a list']);
  });
});
