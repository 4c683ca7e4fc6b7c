// The bracketed keywords of a version 2 Touchstone file (Touchstone File Format Specification 2.0, IBIS
// Open Forum, 2009; 2.1, 2024): each read into the file's header, or refused with what was expected.

import { quote } from '../units/quote.js';
import type { MatrixFormat, TwoPortOrder } from './touchstone-layout.js';
import { readNumber, type Token } from './touchstone-tokens.js';

/** The most ports zfolio reads (a file's matrix holds N² values a frequency). */
export const MAX_PORTS = 64;

export interface Header {
  ports?: number;
  portsLine?: number;
  twoPortOrder?: TwoPortOrder;
  matrix: MatrixFormat;
  frequencies?: number;
  frequenciesLine?: number;
  reference?: number[];
  referenceLine?: number;
  /** Keywords already given, for "given twice" messages. */
  seen: Set<string>;
}

/** What a keyword line changes in the reading, besides the header. */
export type KeywordEffect = 'none' | 'network-data' | 'noise-data' | 'end' | 'begin-information' | 'end-information' | 'reference-continues';

/** The keywords as the specification spells them. */
export const KEYWORDS = [
  'Version',
  'Number of Ports',
  'Two-Port Data Order',
  'Number of Frequencies',
  'Number of Noise Frequencies',
  'Reference',
  'Matrix Format',
  'Mixed-Mode Order',
  'Begin Information',
  'End Information',
  'Network Data',
  'Noise Data',
  'End',
] as const;

type Report = (column: number, message: string) => void;

/** "[Number of Ports]" → "number of ports": letter case and runs of spaces do not matter. */
export function keywordKey(name: string): string {
  return name.trim().replace(/\s+/g, ' ').toLowerCase();
}

/**
 * Apply one keyword (not [Version], which the reader handles first) with its fields on the same line.
 * `keyColumn` is where the "[" stands.
 */
export function applyKeyword(header: Header, key: string, written: string, fields: readonly Token[], line: number, keyColumn: number, report: Report): KeywordEffect {
  if (header.seen.has(key)) {
    report(keyColumn, `[${written}] is given twice; a file gives each keyword once`);
    return 'none';
  }
  header.seen.add(key);
  const noArguments = () => {
    if (fields.length > 0) report(fields[0].column, `[${written}] takes nothing after it on its line, found ${quote(fields[0].text)}`);
  };
  const needsPorts = (): boolean => {
    if (header.ports !== undefined) return true;
    report(keyColumn, `[${written}] must come after [Number of Ports]`);
    return false;
  };
  switch (key) {
    case 'number of ports': {
      const n = wholeNumber(fields, `[${written}]`, 'the number of ports', keyColumn, report);
      if (n === undefined) return 'none';
      if (n < 1 || n > MAX_PORTS) {
        report(fields[0].column, `expected a number of ports from 1 to ${MAX_PORTS}, found ${quote(fields[0].text)}`);
        return 'none';
      }
      header.ports = n;
      header.portsLine = line;
      return 'none';
    }
    case 'two-port data order': {
      const value = single(fields, `[${written}]`, 'the order 12_21 or 21_12', keyColumn, report);
      if (value === undefined) return 'none';
      if (value !== '12_21' && value !== '21_12') {
        report(fields[0].column, `expected 12_21 or 21_12 after [${written}], found ${quote(value)}`);
        return 'none';
      }
      if (header.ports !== undefined && header.ports !== 2) report(keyColumn, `[${written}] is for 2-port files; this file has ${header.ports} ports`);
      header.twoPortOrder = value;
      return 'none';
    }
    case 'number of frequencies': {
      const n = wholeNumber(fields, `[${written}]`, 'the number of frequencies', keyColumn, report);
      if (n === undefined) return 'none';
      if (n < 1) {
        report(fields[0].column, `expected at least one frequency after [${written}], found ${quote(fields[0].text)}`);
        return 'none';
      }
      header.frequencies = n;
      header.frequenciesLine = line;
      return 'none';
    }
    case 'number of noise frequencies':
      // The noise data themselves are skipped; the count must still be a count.
      wholeNumber(fields, `[${written}]`, 'the number of noise frequencies', keyColumn, report);
      return 'none';
    case 'reference': {
      if (!needsPorts()) return 'none';
      header.reference = [];
      header.referenceLine = line;
      return addReferences(header, fields, report) ? 'none' : 'reference-continues';
    }
    case 'matrix format': {
      const value = single(fields, `[${written}]`, 'Full, Lower or Upper', keyColumn, report);
      if (value === undefined) return 'none';
      const matrix = (['Full', 'Lower', 'Upper'] as const).find((m) => m.toLowerCase() === value.toLowerCase());
      if (!matrix) {
        report(fields[0].column, `expected Full, Lower or Upper after [${written}], found ${quote(value)}`);
        return 'none';
      }
      header.matrix = matrix;
      return 'none';
    }
    case 'mixed-mode order':
      report(keyColumn, 'mixed-mode (differential and common-mode) data are not read: zfolio takes single-ended S, Y or Z parameters');
      return 'none';
    case 'begin information':
      noArguments();
      return 'begin-information';
    case 'end information':
      report(keyColumn, '[End Information] without [Begin Information] before it');
      return 'none';
    case 'network data':
      noArguments();
      return 'network-data';
    case 'noise data':
      noArguments();
      return 'noise-data';
    case 'end':
      noArguments();
      return 'end';
    default:
      report(keyColumn, `unknown keyword [${written}]; expected one of ${KEYWORDS.map((k) => `[${k}]`).join(', ')}`);
      return 'none';
  }
}

/** Add reference impedances from a line; true when the port count is reached. Extra values are an error. */
export function addReferences(header: Header, fields: readonly Token[], report: Report): boolean {
  const wanted = header.ports ?? 0;
  const list = header.reference ?? (header.reference = []);
  for (const field of fields) {
    if (list.length === wanted) {
      report(field.column, `[Reference] takes one impedance a port (${wanted}), found more: ${quote(field.text)}`);
      return true;
    }
    const ohms = readNumber(field.text, 0, field.text.length);
    if (!(ohms > 0) || !Number.isFinite(ohms)) report(field.column, `expected a reference impedance, a number above zero in Ω, found ${quote(field.text)}`);
    list.push(ohms);
  }
  return list.length === wanted;
}

function single(fields: readonly Token[], what: string, expected: string, keyColumn: number, report: Report): string | undefined {
  if (fields.length === 0) {
    report(keyColumn, `expected ${expected} after ${what}, found the end of the line`);
    return undefined;
  }
  if (fields.length > 1) report(fields[1].column, `expected only ${expected} after ${what}, found also ${quote(fields[1].text)}`);
  return fields[0].text;
}

function wholeNumber(fields: readonly Token[], what: string, expected: string, keyColumn: number, report: Report): number | undefined {
  const text = single(fields, what, expected, keyColumn, report);
  if (text === undefined) return undefined;
  if (!/^\d{1,9}$/.test(text)) {
    report(fields[0].column, `expected ${expected} after ${what}, a whole number, found ${quote(text)}`);
    return undefined;
  }
  return Number(text);
}
