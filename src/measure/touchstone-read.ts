// Reading a Touchstone file, versions 1.x, 2.0 and 2.1 (Touchstone File Format Specification 2.0, IBIS
// Open Forum, 2009; 2.1, 2024): option line, comments anywhere, the version 2 keywords, values of one
// frequency over any number of lines, version 1 Z and Y normalised to R, noise data skipped. Every problem
// is located at its line and column; a file with a problem gives no data at all.

import { DiagnosticList, type Diagnostic, type SourcePosition } from '../model/diagnostics.js';
import { quote } from '../units/quote.js';
import { GrowableFloat64 } from './growable.js';
import { FREQUENCY_SCALE, type NetworkData } from './network-data.js';
import { MAX_PORTS, addReferences, applyKeyword, keywordKey, type Header, type KeywordEffect } from './touchstone-keywords.js';
import { pairValue as importedPairValue, recordLayout, type RecordLayout } from './touchstone-layout.js';
import { DEFAULT_OPTIONS, readOptionLine, type OptionLine } from './touchstone-options.js';
import { isBlank as importedIsBlank, readNumber as importedReadNumber, tokensOf, type Token } from './touchstone-tokens.js';

// The functions of the per-value loops, bound once: under a module loader that turns each imported name
// into a property read (as tsx does for the benchmarks), a call through the import costs more than the work.
const isBlank = importedIsBlank;
const readNumber = importedReadNumber;
const pairValue = importedPairValue;

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

type Mode = 'header' | 'data' | 'v1-noise' | 'noise' | 'information' | 'end';

/** Stop reading after this many problems: the rest of such a file would only repeat them. */
const ERROR_LIMIT = 200;

class Reader {
  private readonly problems = new DiagnosticList();
  private version: 1 | 2 | undefined;
  private readonly header: Header = { matrix: 'Full', seen: new Set() };
  private options: OptionLine | undefined;
  private optionLine: number | undefined;
  private mode: Mode = 'header';
  private referenceContinues = false;
  private stopped = false;
  private line = 0;
  private lineStart = 0;
  // The data, once it begins.
  private ports = 0;
  private layout: RecordLayout | undefined;
  private perRecord = 0;
  private scale = 1;
  private normalise = 1;
  private readonly frequencies = new GrowableFloat64();
  private readonly recordLines = new GrowableFloat64();
  private readonly re = new GrowableFloat64(16384);
  private readonly im = new GrowableFloat64(16384);
  private pending = new Float64Array(0);
  private filled = -1;
  private recordFrequency = 0;
  private recordLine = 0;
  private lastNetworkFrequency = -Infinity;
  private readonly starts: number[] = [];
  private readonly ends: number[] = [];
  /** Just after the last field of the file, where "the file ends" messages point. */
  private lastField = { line: 1, column: 1 };

  constructor(
    private readonly text: string,
    private readonly file: string,
    private readonly given: TouchstoneOptions,
  ) {}

  read(): TouchstoneResult {
    const bareCr = bareCarriageReturn(this.text);
    if (bareCr >= 0) {
      const before = this.text.slice(0, bareCr);
      const line = before.split('\n').length;
      this.error({ line, column: bareCr - before.lastIndexOf('\n') }, 'a line ends with a bare carriage return (CR, as old Mac files do); save the file with LF or CRLF line ends');
      return this.result();
    }
    const text = this.text;
    const n = text.length;
    let pos = 0;
    while (pos <= n && !this.stopped) {
      let eol = text.indexOf('\n', pos);
      if (eol < 0) eol = n;
      this.line++;
      this.lineStart = pos;
      this.scanLine(pos, eol > pos && text.charCodeAt(eol - 1) === 13 ? eol - 1 : eol);
      pos = eol + 1;
    }
    if (!this.stopped) this.finish();
    return this.result();
  }

  private result(): TouchstoneResult {
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

  private optionsOrDefault(): OptionLine {
    return this.options ?? DEFAULT_OPTIONS;
  }

  private position(at: { line: number; column: number }): SourcePosition {
    return { file: this.file, line: at.line, column: at.column };
  }

  private portsPosition(): SourcePosition {
    return this.position(this.header.portsLine !== undefined ? { line: this.header.portsLine, column: 1 } : { line: 1, column: 1 });
  }

  private referencePosition(): SourcePosition {
    if (this.header.referenceLine !== undefined) return this.position({ line: this.header.referenceLine, column: 1 });
    if (this.optionLine !== undefined) return this.position({ line: this.optionLine, column: this.options?.referenceColumn ?? 1 });
    return this.position({ line: 1, column: 1 });
  }

  private error(at: { line: number; column: number }, message: string): void {
    this.problems.error(this.position(at), message);
    if (this.problems.errorCount >= ERROR_LIMIT) this.stopped = true;
  }

  private here(column: number, message: string): void {
    this.error({ line: this.line, column }, message);
  }

  /** One line without its line end: split into fields up to a "!" comment, then handled by its kind. */
  private scanLine(from: number, to: number): void {
    const text = this.text;
    const starts = this.starts;
    const ends = this.ends;
    starts.length = 0;
    ends.length = 0;
    let i = from;
    let end = to;
    while (i < end) {
      const c = text.charCodeAt(i);
      if (c === 33) {
        end = i;
        break;
      }
      if (isBlank(c)) {
        i++;
        continue;
      }
      const start = i;
      while (i < end) {
        const d = text.charCodeAt(i);
        if (isBlank(d) || d === 33) break;
        i++;
      }
      starts.push(start);
      ends.push(i);
    }
    if (starts.length === 0) return;
    this.lastField = { line: this.line, column: this.column(ends[ends.length - 1]) };
    const first = text.charCodeAt(starts[0]);
    if (first === 91) this.keywordLine(starts[0], end);
    else if (first === 35) this.optionLineAt(starts[0], end);
    else this.dataLine();
  }

  private fields(from: number, to: number): Token[] {
    return tokensOf(this.text, from, to, this.lineStart);
  }

  private column(index: number): number {
    return index - this.lineStart + 1;
  }

  private keywordLine(open: number, end: number): void {
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

  private optionLineAt(hash: number, end: number): void {
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

  private dataLine(): void {
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

  private networkLine(): void {
    const text = this.text;
    const starts = this.starts;
    const ends = this.ends;
    const count = starts.length;
    let k = 0;
    if (this.filled < 0) {
      const f = readNumber(text, starts[0], ends[0]) * this.scale;
      const records = this.frequencies.length;
      // A version 1 two-port file may end with noise parameters: they begin where the frequency falls back.
      if (this.version === 1 && this.ports === 2 && records > 0 && f <= this.lastNetworkFrequency) {
        this.mode = 'v1-noise';
        this.noiseLine();
        return;
      }
      if (this.version === 2 && this.header.frequencies !== undefined && records === this.header.frequencies) {
        this.here(this.column(starts[0]), `more network data than [Number of Frequencies] ${this.header.frequencies} (line ${this.header.frequenciesLine}) says`);
        this.stopped = true;
        return;
      }
      this.checkFrequency(f, 0);
      this.filled = 0;
      this.recordFrequency = f;
      this.recordLine = this.line;
      k = 1;
    }
    const need = this.perRecord;
    const pending = this.pending;
    for (; k < count; k++) {
      if (this.filled === need) {
        this.tooMany(k);
        break;
      }
      const value = readNumber(text, starts[k], ends[k]);
      if (!Number.isFinite(value)) this.notANumber(k, 'a number');
      pending[this.filled++] = value;
    }
    if (this.filled === need) this.commit();
  }

  private checkFrequency(f: number, field: number): void {
    const column = this.column(this.starts[field]);
    const written = this.text.slice(this.starts[field], this.ends[field]);
    if (!Number.isFinite(f)) this.notANumber(field, 'a frequency');
    else if (f < 0) this.here(column, `expected a frequency of zero or more, found ${quote(written)}`);
    else if (this.frequencies.length > 0 && !(f > this.lastNetworkFrequency)) {
      this.here(column, `frequencies must increase: ${written} ${this.unit()} follows ${this.inUnit(this.lastNetworkFrequency)}`);
    }
  }

  private unit(): string {
    return this.optionsOrDefault().unit;
  }

  /** A frequency in the file's own unit, as its lines write it. */
  private inUnit(hz: number): string {
    if (!Number.isFinite(hz)) return 'an unreadable frequency';
    return `${Number((hz / this.scale).toPrecision(12))} ${this.unit()}`;
  }

  private notANumber(field: number, what: string): void {
    const written = this.text.slice(this.starts[field], this.ends[field]);
    const value = Number(written);
    const why = /^[+-]?(\d|\.\d)/.test(written) && /^[+-]?[\d.]+[eE][+-]?\d+$/.test(written) && !Number.isFinite(value) ? ' (too large for a number)' : '';
    this.here(this.column(this.starts[field]), `expected ${what}, found ${quote(written)}${why}`);
  }

  private tooMany(field: number): void {
    const column = this.column(this.starts[field]);
    const extra = this.starts.length - field;
    if (this.recordLine === this.line) {
      const total = this.starts.length - 1;
      const ports = Math.round(Math.sqrt(total / 2));
      const hint = this.version === 1 && ports !== this.ports && 2 * ports * ports === total ? `; ${total} values a line is a ${ports}-port file: name it .s${ports}p` : '';
      this.here(column, `expected ${this.perRecord} values after the frequency (a ${this.ports}-port file), found ${total}${hint}`);
    } else {
      this.here(column, `the frequency of line ${this.recordLine} has ${this.perRecord} values, and ${extra} more follow on this line; a frequency's values may go over several lines, but each new frequency begins a line`);
    }
  }

  private commit(): void {
    const layout = this.layout!;
    const { slots, mirrors } = layout;
    const format = this.optionsOrDefault().format;
    const n2 = this.ports * this.ports;
    const base = this.re.extend(n2);
    this.im.extend(n2);
    const scale = this.normalise;
    const pending = this.pending;
    for (let p = 0; p < slots.length; p++) {
      const a = pending[2 * p];
      const b = pending[2 * p + 1];
      let re = a;
      let im = b;
      if (format !== 'RI') {
        [re, im] = pairValue(format, a, b);
      }
      this.re.set(base + slots[p], re * scale);
      this.im.set(base + slots[p], im * scale);
      if (mirrors[p] >= 0) {
        this.re.set(base + mirrors[p], re * scale);
        this.im.set(base + mirrors[p], im * scale);
      }
    }
    this.frequencies.push(this.recordFrequency);
    this.recordLines.push(this.recordLine);
    this.lastNetworkFrequency = this.recordFrequency;
    this.filled = -1;
  }

  /** Version 1 noise parameters: frequency, NFmin, |Γopt|, ∠Γopt, Rn — five numbers a line, skipped. */
  private noiseLine(): void {
    const count = this.starts.length;
    for (let k = 0; k < count; k++) {
      if (!Number.isFinite(readNumber(this.text, this.starts[k], this.ends[k]))) this.notANumber(k, 'a number (noise data)');
    }
    if (count !== 5) this.here(this.column(this.starts[Math.min(count, 5) - 1]), `expected 5 noise values a line (frequency, NFmin, |Γopt|, ∠Γopt, Rn), found ${count}`);
  }

  private endRecordAtKeyword(written: string): void {
    if (this.filled < 0) return;
    this.here(1, `expected ${this.perRecord} values for the frequency of line ${this.recordLine}, found ${this.filled} before [${written}]`);
    this.filled = -1;
  }

  private finish(): void {
    const lastLine = this.lastField;
    this.closeReference();
    if (this.mode === 'information') this.error(lastLine, 'the file ends inside [Begin Information]; expected [End Information]');
    if (this.filled >= 0) {
      this.error(lastLine, `the file ends inside the values of frequency ${this.inUnit(this.recordFrequency)} (line ${this.recordLine}): found ${this.filled} of ${this.perRecord}`);
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

/** Index of the first CR not followed by LF, or −1. */
function bareCarriageReturn(text: string): number {
  for (let i = text.indexOf('\r'); i >= 0; i = text.indexOf('\r', i + 1)) {
    if (text.charCodeAt(i + 1) !== 10) return i;
  }
  return -1;
}
