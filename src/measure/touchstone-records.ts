// The lines of a Touchstone file and its network data (see touchstone-read.ts, whose Reader adds the header:
// version, option line and keywords). A line is split into fields up to its "!" comment and handed to the
// reader by its kind; network data are gathered a record (one frequency's values, over any number of lines)
// at a time, checked value by value, and stored as S, Y or Z in SI units. Every problem is located.

import { DiagnosticList, type SourcePosition } from '../model/diagnostics.js';
import { quote } from '../units/quote.js';
import { GrowableFloat64 } from './growable.js';
import type { Header } from './touchstone-keywords.js';
import { pairValue as importedPairValue, type RecordLayout } from './touchstone-layout.js';
import { DEFAULT_OPTIONS, type OptionLine } from './touchstone-options.js';
import { isBlank as importedIsBlank, readNumber as importedReadNumber, tokensOf, type Token } from './touchstone-tokens.js';
import type { TouchstoneOptions, TouchstoneResult } from './touchstone-read.js';

// The functions of the per-value loops, bound once: under a module loader that turns each imported name
// into a property read (as tsx does for the benchmarks), a call through the import costs more than the work.
const isBlank = importedIsBlank;
const readNumber = importedReadNumber;
const pairValue = importedPairValue;

export type Mode = 'header' | 'data' | 'v1-noise' | 'noise' | 'information' | 'end';

/** Stop reading after this many problems: the rest of such a file would only repeat them. */
const ERROR_LIMIT = 200;

export abstract class RecordReader {
  protected readonly problems = new DiagnosticList();
  protected version: 1 | 2 | undefined;
  protected readonly header: Header = { matrix: 'Full', seen: new Set() };
  protected options: OptionLine | undefined;
  protected mode: Mode = 'header';
  protected stopped = false;
  protected line = 0;
  protected lineStart = 0;
  // The data, once it begins.
  protected ports = 0;
  protected layout: RecordLayout | undefined;
  protected perRecord = 0;
  protected scale = 1;
  protected normalise = 1;
  protected readonly frequencies = new GrowableFloat64();
  protected readonly recordLines = new GrowableFloat64();
  protected readonly re = new GrowableFloat64(16384);
  protected readonly im = new GrowableFloat64(16384);
  protected pending = new Float64Array(0);
  protected filled = -1;
  protected recordFrequency = 0;
  protected recordLine = 0;
  protected lastNetworkFrequency = -Infinity;
  protected readonly starts: number[] = [];
  protected readonly ends: number[] = [];
  /** Just after the last field of the file, where "the file ends" messages point. */
  protected lastField = { line: 1, column: 1 };

  constructor(
    protected readonly text: string,
    protected readonly file: string,
    protected readonly given: TouchstoneOptions,
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

  protected optionsOrDefault(): OptionLine {
    return this.options ?? DEFAULT_OPTIONS;
  }

  protected position(at: { line: number; column: number }): SourcePosition {
    return { file: this.file, line: at.line, column: at.column };
  }

  protected error(at: { line: number; column: number }, message: string): void {
    this.problems.error(this.position(at), message);
    if (this.problems.errorCount >= ERROR_LIMIT) this.stopped = true;
  }

  protected here(column: number, message: string): void {
    this.error({ line: this.line, column }, message);
  }

  /** One line without its line end: split into fields up to a "!" comment, then handled by its kind. */
  protected scanLine(from: number, to: number): void {
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

  protected fields(from: number, to: number): Token[] {
    return tokensOf(this.text, from, to, this.lineStart);
  }

  protected column(index: number): number {
    return index - this.lineStart + 1;
  }

  protected networkLine(): void {
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

  protected checkFrequency(f: number, field: number): void {
    const column = this.column(this.starts[field]);
    const written = this.text.slice(this.starts[field], this.ends[field]);
    if (!Number.isFinite(f)) this.notANumber(field, 'a frequency');
    else if (f < 0) this.here(column, `expected a frequency of zero or more, found ${quote(written)}`);
    else if (this.frequencies.length > 0 && !(f > this.lastNetworkFrequency)) {
      this.here(column, `frequencies must increase: ${written} ${this.unit()} follows ${this.inUnit(this.lastNetworkFrequency)}`);
    }
  }

  protected unit(): string {
    return this.optionsOrDefault().unit;
  }

  /** A frequency in the file's own unit, as its lines write it. */
  protected inUnit(hz: number): string {
    if (!Number.isFinite(hz)) return 'an unreadable frequency';
    return `${Number((hz / this.scale).toPrecision(12))} ${this.unit()}`;
  }

  protected notANumber(field: number, what: string): void {
    const written = this.text.slice(this.starts[field], this.ends[field]);
    const value = Number(written);
    const why = /^[+-]?(\d|\.\d)/.test(written) && /^[+-]?[\d.]+[eE][+-]?\d+$/.test(written) && !Number.isFinite(value) ? ' (too large for a number)' : '';
    this.here(this.column(this.starts[field]), `expected ${what}, found ${quote(written)}${why}`);
  }

  protected tooMany(field: number): void {
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

  protected commit(): void {
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
  protected noiseLine(): void {
    const count = this.starts.length;
    for (let k = 0; k < count; k++) {
      if (!Number.isFinite(readNumber(this.text, this.starts[k], this.ends[k]))) this.notANumber(k, 'a number (noise data)');
    }
    if (count !== 5) this.here(this.column(this.starts[Math.min(count, 5) - 1]), `expected 5 noise values a line (frequency, NFmin, |Γopt|, ∠Γopt, Rn), found ${count}`);
  }

  protected endRecordAtKeyword(written: string): void {
    if (this.filled < 0) return;
    this.here(1, `expected ${this.perRecord} values for the frequency of line ${this.recordLine}, found ${this.filled} before [${written}]`);
    this.filled = -1;
  }

  /** A line that begins with "[". */
  protected abstract keywordLine(open: number, end: number): void;
  /** A line that begins with "#". */
  protected abstract optionLineAt(hash: number, end: number): void;
  /** Any other line with fields: network data, noise data, or values of a keyword that go on. */
  protected abstract dataLine(): void;
  /** After the last line. */
  protected abstract finish(): void;
  protected abstract result(): TouchstoneResult;
}

/** Index of the first CR not followed by LF, or −1. */
function bareCarriageReturn(text: string): number {
  for (let i = text.indexOf('\r'); i >= 0; i = text.indexOf('\r', i + 1)) {
    if (text.charCodeAt(i + 1) !== 10) return i;
  }
  return -1;
}
