// Reading a Touchstone file, versions 1.x, 2.0 and 2.1 (Touchstone File Format Specification 2.0, IBIS
// Open Forum, 2009; 2.1, 2024): option line, comments anywhere, the version 2 keywords, values of one
// frequency over any number of lines, version 1 Z and Y normalised to R, noise data skipped. Every problem
// is located at its line and column; a file with a problem gives no data at all.

import type { Diagnostic, SourcePosition } from '../model/diagnostics.js';
import { quote } from '../units/quote.js';
import { FREQUENCY_SCALE, type NetworkData } from './network-data.js';
import { MAX_PORTS, addReferences, applyKeyword, keywordKey, type KeywordEffect } from './touchstone-keywords.js';
import { recordLayout } from './touchstone-layout.js';
import { readOptionLine } from './touchstone-options.js';
import { RecordReader } from './touchstone-records.js';
import type { Token } from './touchstone-tokens.js';

export type TouchstoneResult = { ok: true; data: NetworkData } | { ok: false; errors: Diagnostic[] };

export interface TouchstoneOptions {
  /** The port count of a version 1 file whose name does not say it (.s1p, .s2p …). */
  ports?: number;
}

/** The port count a version 1 file's name gives: "x.s2p" → 2. */
export function portsFromName(file: string): number | undefined {
  const m = /\.s(\d{1,3})p$/i.exec(file);
  return m ? Number(m[1]) : undefined;
}

/** Read Touchstone text; `file` is the name messages give. */
export function readTouchstone(text: string, file: string, options: TouchstoneOptions = {}): TouchstoneResult {
  const reader = new Reader(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text, file, options);
  return reader.read();
}

/** The header of the file (version, option line, keywords) over the lines and records of RecordReader. */
class Reader extends RecordReader {
  private optionLine: number | undefined;
  private referenceContinues = false;

  protected result(): TouchstoneResult {
    if (this.problems.errorCount > 0) return { ok: false, errors: this.problems.sorted() };
    const data: NetworkData = {
      file: this.file,
      version: this.version ?? 1,
      ports: this.ports,
      parameter: this.optionsOrDefault().parameter,
      format: this.optionsOrDefault().format,
      frequencyUnit: this.optionsOrDefault().unit,
      reference: this.header.reference ?? Array.from({ length: this.ports }, () => this.optionsOrDefault().reference),
      frequencies: this.frequencies.toArray(),
      lines: Int32Array.from(this.recordLines.toArray()),
      re: this.re.toArray(),
      im: this.im.toArray(),
      at: { ports: this.portsPosition(), reference: this.referencePosition() },
    };
    return { ok: true, data };
  }

  private portsPosition(): SourcePosition {
    return this.position(this.header.portsLine !== undefined ? { line: this.header.portsLine, column: 1 } : { line: 1, column: 1 });
  }

  private referencePosition(): SourcePosition {
    if (this.header.referenceLine !== undefined) return this.position({ line: this.header.referenceLine, column: 1 });
    if (this.optionLine !== undefined) return this.position({ line: this.optionLine, column: this.options?.referenceColumn ?? 1 });
    return this.position({ line: 1, column: 1 });
  }

  protected keywordLine(open: number, end: number): void {
    const close = this.text.indexOf(']', open);
    if (close < 0 || close >= end) {
      this.here(this.column(open), `a keyword's closing "]" is missing: found ${quote(this.text.slice(open, end).trim())}`);
      return;
    }
    const written = this.text.slice(open + 1, close).trim().replace(/\s+/g, ' ');
    const key = keywordKey(written);
    const fields = this.fields(close + 1, end);
    const column = this.column(open);
    if (this.version === undefined) {
      if (key === 'version') {
        this.version = 2;
        this.readVersion(written, fields, column);
        return;
      }
      this.version = 2;
      this.here(column, `[${written}] before [Version]: a version 2 file begins with [Version] 2.0 (or 2.1)`);
    } else if (this.version === 1) {
      if (key === 'version') this.here(column, '[Version] must be the first line of a version 2 file, before the option line');
      else this.here(column, `keyword [${written}] in a version 1 file; a version 2 file begins with [Version] 2.0 on its first line`);
      // Whatever follows would be read under the wrong version.
      this.stopped = true;
      return;
    } else if (key === 'version') {
      this.here(column, '[Version] is given twice, or not first; it is the first line of a version 2 file');
      return;
    }
    this.closeReference();
    if (this.mode === 'end') {
      this.here(column, `nothing may follow [End], found [${written}]`);
      this.stopped = true;
      return;
    }
    if (this.mode === 'information') {
      if (key === 'end information') this.mode = 'header';
      return;
    }
    if (this.mode === 'noise' && key !== 'end') {
      this.here(column, `expected [End] or noise data after [Noise Data], found [${written}]`);
      return;
    }
    if (this.mode === 'data' && key !== 'noise data' && key !== 'end') {
      this.here(column, `expected network data, [Noise Data] or [End], found [${written}]`);
      return;
    }
    const effect: KeywordEffect = applyKeyword(this.header, key, written, fields, this.line, column, (col, message) => this.here(col, message));
    switch (effect) {
      case 'reference-continues':
        this.referenceContinues = true;
        break;
      case 'begin-information':
        this.mode = 'information';
        break;
      case 'network-data':
        if (this.mode === 'header') this.beginData(column);
        break;
      case 'noise-data':
        this.endRecordAtKeyword(written);
        this.mode = 'noise';
        break;
      case 'end':
        this.endRecordAtKeyword(written);
        this.mode = 'end';
        break;
      case 'none':
        break;
    }
  }

  private readVersion(written: string, fields: Token[], column: number): void {
    this.header.seen.add('version');
    const value = fields[0]?.text;
    if (value === undefined) this.here(column, `expected 2.0 or 2.1 after [${written}], found the end of the line`);
    else if (value !== '2.0' && value !== '2.1') this.here(fields[0].column, `expected version 2.0 or 2.1 after [${written}], found ${quote(value)}`);
    else if (fields.length > 1) this.here(fields[1].column, `expected only the version after [${written}], found also ${quote(fields[1].text)}`);
  }

  protected optionLineAt(hash: number, end: number): void {
    if (this.version === undefined) this.beginVersion1();
    if (this.stopped) return;
    const column = this.column(hash);
    this.closeReference();
    if (this.options !== undefined) {
      this.here(column, `a second option line; the file's option line is line ${this.optionLine}`);
      return;
    }
    if (this.mode !== 'header') {
      this.here(column, 'the option line comes after the network data; it must come before');
      return;
    }
    this.options = readOptionLine(this.fields(hash + 1, end), (col, message) => this.here(col, message));
    this.optionLine = this.line;
  }

  /** A file whose first line is no keyword is a version 1 file: its name says how many ports it has. */
  private beginVersion1(): void {
    this.version = 1;
  }

  private version1Ports(): boolean {
    const ports = this.given.ports ?? portsFromName(this.file);
    if (ports === undefined) {
      this.error({ line: 1, column: 1 }, 'cannot tell the number of ports: a version 1 file is named for it (.s1p, .s2p …); rename the file or give it [Version] 2.0 and [Number of Ports]');
    } else if (ports < 1 || ports > MAX_PORTS) {
      this.error({ line: 1, column: 1 }, `expected a file of 1 to ${MAX_PORTS} ports, found a name for ${ports} (${quote(this.file)})`);
    } else {
      this.header.ports = ports;
      return true;
    }
    this.stopped = true;
    return false;
  }

  /** A keyword ends what came before it: a [Reference] still short of values is an error. */
  private closeReference(): void {
    if (!this.referenceContinues) return;
    this.referenceContinues = false;
    const found = this.header.reference?.length ?? 0;
    this.error({ line: this.header.referenceLine ?? this.line, column: 1 }, `expected ${this.header.ports} reference impedances after [Reference], one a port, found ${found}`);
  }

  private beginData(column: number): void {
    this.mode = 'data';
    const h = this.header;
    if (this.version === 1 && !this.version1Ports()) return;
    if (h.ports === undefined) {
      // A [Number of Ports] that could not be read has its own message.
      if (!h.seen.has('number of ports')) this.here(column, 'network data before [Number of Ports]; a version 2 file states its number of ports first');
      this.stopped = true;
      return;
    }
    if (this.version === 2) {
      if (h.frequencies === undefined && !h.seen.has('number of frequencies')) this.here(column, 'a version 2 file states [Number of Frequencies] before its network data');
      if (h.ports === 2 && h.matrix === 'Full' && h.twoPortOrder === undefined && !h.seen.has('two-port data order')) this.here(column, 'a 2-port file states [Two-Port Data Order] (12_21 or 21_12) before its network data');
    }
    const options = this.optionsOrDefault();
    this.ports = h.ports;
    this.layout = recordLayout(h.ports, h.matrix, this.version === 1 ? '21_12' : (h.twoPortOrder ?? '12_21'));
    this.perRecord = 2 * this.layout.slots.length;
    this.pending = new Float64Array(this.perRecord);
    this.scale = FREQUENCY_SCALE[options.unit];
    // Version 1 Z and Y values are normalised to R; version 2 values are in ohms and siemens.
    this.normalise = this.version === 1 && options.parameter === 'Z' ? options.reference : this.version === 1 && options.parameter === 'Y' ? 1 / options.reference : 1;
  }

  protected dataLine(): void {
    if (this.version === undefined) this.beginVersion1();
    if (this.stopped) return;
    const starts = this.starts;
    if (this.referenceContinues) {
      const fields = starts.map((s, i) => ({ text: this.text.slice(s, this.ends[i]), column: this.column(s) }));
      if (addReferences(this.header, fields, (col, message) => this.here(col, message))) this.referenceContinues = false;
      return;
    }
    switch (this.mode) {
      case 'information':
      case 'noise':
        return;
      case 'end':
        this.here(this.column(starts[0]), `nothing may follow [End], found ${quote(this.text.slice(starts[0], this.ends[0]))}`);
        this.stopped = true;
        return;
      case 'v1-noise':
        this.noiseLine();
        return;
      case 'header':
        this.beginData(this.column(starts[0]));
        if (this.stopped) return;
        break;
      case 'data':
        break;
    }
    this.networkLine();
  }

  protected finish(): void {
    const lastLine = this.lastField;
    this.closeReference();
    if (this.mode === 'information') this.error(lastLine, 'the file ends inside [Begin Information]; expected [End Information]');
    if (this.filled >= 0) {
      const record = Number.isFinite(this.recordFrequency) ? `frequency ${this.inUnit(this.recordFrequency)} (line ${this.recordLine})` : `the record at line ${this.recordLine} (its frequency unreadable)`;
      this.error(lastLine, `the file ends inside the values of ${record}: found ${this.filled} of ${this.perRecord}`);
      return;
    }
    const records = this.frequencies.length;
    if (records === 0) {
      if (this.problems.errorCount === 0) this.error(lastLine, 'no network data: the file ends before any frequency and its values');
      return;
    }
    const expected = this.header.frequencies;
    if (this.version === 2 && expected !== undefined && records !== expected) {
      this.error({ line: this.header.frequenciesLine ?? 1, column: 1 }, `[Number of Frequencies] says ${expected}, but the network data hold ${records}`);
    }
  }
}
