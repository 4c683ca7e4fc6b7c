// Reading details the specification's examples do not cover: comments anywhere, line ends, a byte-order
// mark, the Upper matrix format, information blocks, version 2.1, defaults of an absent option line and a
// port count given by the caller (Touchstone File Format Specification 2.0, IBIS Open Forum, 2009).

import { describe, expect, it } from 'vitest';
import { parameterAt } from '../../src/measure/network-data.js';
import { portsFromName, readTouchstone } from '../../src/measure/touchstone-read.js';
import { readNumber } from '../../src/measure/touchstone-tokens.js';

function ok(text: string, file = 'x.s1p', ports?: number) {
  const r = readTouchstone(text, file, { ports });
  if (!r.ok) throw new Error(r.errors.map((e) => `${e.line}:${e.column}: ${e.message}`).join('\n'));
  return r.data;
}

describe('readNumber', () => {
  it.each([
    ['1', 1],
    ['-2.5', -2.5],
    ['+.5', 0.5],
    ['1e3', 1000],
    ['1.5E-3', 0.0015],
    ['7.', 7],
  ])('reads %s', (text, value) => expect(readNumber(text, 0, text.length)).toBe(value));
  it.each(['', '.', '-', 'e5', '1e', '1..2', '0x10', 'Infinity', 'NaN', '1_0', '1,5', '١'])('refuses %j', (text) => expect(readNumber(text, 0, text.length)).toBeNaN());
});

describe('readTouchstone', () => {
  it('without an option line: GHz, S, MA, R 50', () => {
    const d = ok('1 0.5 90\n');
    expect([d.frequencyUnit, d.parameter, d.format, d.reference]).toEqual(['GHz', 'S', 'MA', [50]]);
    expect(d.frequencies[0]).toBe(1e9);
    expect(parameterAt(d, 0, 0, 0)[1]).toBeCloseTo(0.5, 15);
  });

  it('comments anywhere, and a frequency over several lines with comments between', () => {
    const d = ok('# MHz S RI R 50\n1 0.1 0.2 ! S11\n 0.3 0.4 ! S21\n! a whole comment line\n 0.5 0.6 0.7 0.8\n', 'x.s2p');
    expect(Array.from(d.re)).toEqual([0.1, 0.5, 0.3, 0.7]);
    expect(Array.from(d.im)).toEqual([0.2, 0.6, 0.4, 0.8]);
  });

  it('CRLF line ends, tabs and a byte-order mark', () => {
    const d = ok('\ufeff# kHz Z RI R 50\r\n1\t10\t-1\r\n2 20 -2\r\n');
    expect(Array.from(d.frequencies)).toEqual([1e3, 2e3]);
    expect(Array.from(d.re)).toEqual([500, 1000]);
  });

  it('version 1 Y data are normalised to R: Y = y/R', () => {
    const d = ok('# Hz Y RI R 25\n1 0.5 0.25\n');
    expect(parameterAt(d, 0, 0, 0)).toEqual([0.02, 0.01]);
  });

  it('DB format: 20·log10 of the magnitude', () => {
    const d = ok('# Hz S DB R 50\n1 -6.020599913279624 0\n');
    expect(parameterAt(d, 0, 0, 0)[0]).toBeCloseTo(0.5, 14);
  });

  it('the Upper matrix format fills the lower half by symmetry', () => {
    const text = '[Version] 2.0\n# GHz S RI\n[Number of Ports] 3\n[Number of Frequencies] 1\n[Matrix Format] Upper\n[Network Data]\n1 11 0 12 0 13 0\n 22 0 23 0\n 33 0\n[End]\n';
    const d = ok(text, 'x.ts');
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(parameterAt(d, 0, i, j)[0]).toBe(10 * (Math.min(i, j) + 1) + Math.max(i, j) + 1);
  });

  it('version 2.1 with an information block and letter case of keywords as written', () => {
    const text = '[Version] 2.1\n# MHz Z RI\n[NUMBER OF PORTS] 1\n[Number of  Frequencies] 2\n[Begin Information]\nanything [at all] here\n[End Information]\n[Network Data]\n1 5 0\n2 6 0\n[End]\n! trailing comment\n';
    const d = ok(text, 'x.ts');
    expect(Array.from(d.re)).toEqual([5, 6]);
  });

  it('a version 2 Z file keeps its ohms whatever R says', () => {
    const d = ok('[Version] 2.0\n# Hz Z RI R 75\n[Number of Ports] 1\n[Number of Frequencies] 1\n[Network Data]\n1 10 0\n', 'x.ts');
    expect(parameterAt(d, 0, 0, 0)).toEqual([10, 0]);
    expect(d.reference).toEqual([75]);
  });

  it('a version 1 file not named .sNp reads when the caller gives its port count', () => {
    expect(ok('# Hz Z RI\n1 10 0\n', 'sweep.txt', 1).ports).toBe(1);
  });

  it('a frequency of zero (DC) is data', () => {
    expect(Array.from(ok('# Hz Z RI\n0 10 0\n1 10 0\n').frequencies)).toEqual([0, 1]);
  });

  it('positions of the port count and reference for later messages', () => {
    const d = ok('[Version] 2.0\n# Hz Z RI\n[Number of Ports] 1\n[Number of Frequencies] 1\n[Reference] 20\n[Network Data]\n1 10 0\n', 'x.ts');
    expect([d.at.ports.line, d.at.reference.line]).toEqual([3, 5]);
    expect(Array.from(d.lines)).toEqual([7]);
  });

  it('port counts from names', () => {
    expect([portsFromName('a.s1p'), portsFromName('A.S2P'), portsFromName('b.s12p'), portsFromName('c.ts'), portsFromName('s2p')]).toEqual([1, 2, 12, undefined, undefined]);
  });

  it('a file of many errors lists at most 100 and counts the rest', () => {
    const lines = ['# Hz Z RI'];
    for (let i = 1; i <= 300; i++) lines.push(`${i} x 0`);
    const r = readTouchstone(lines.join('\n'), 'x.s1p');
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.errors).toHaveLength(101);
      expect(r.errors[100].message).toMatch(/^and \d+ more errors in this file/);
    }
  });
});
