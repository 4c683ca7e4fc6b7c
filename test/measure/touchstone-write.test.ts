import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { writeTouchstone, type TouchstoneWriteInput } from '../../src/measure/touchstone-write.js';

// The writer's text is compared with the worked examples of the Touchstone File Format Specification 2.0
// (IBIS Open Forum, 2009), as kept in scikit-rf's test folder (BSD-3, copied unchanged into
// test/fixtures/touchstone/spec with its notice). Each check names its example. Values are given to the writer
// in ohms and plain numbers, as zfolio holds them.
const SPEC = fileURLToPath(new URL('../fixtures/touchstone/spec/', import.meta.url));
const example = (name: string) => readFileSync(SPEC + name, 'utf8');
/** The data lines of a file: neither comments nor keywords nor the option line, comments cut off. */
const dataLines = (text: string) =>
  text
    .split(/\r?\n/)
    .map((l) => l.replace(/!.*/, '').trimEnd())
    .filter((l) => l.trim() !== '' && !l.trimStart().startsWith('[') && !l.trimStart().startsWith('#'));
const numbers = (line: string) => line.trim().split(/\s+/).map(Number);
const rad = Math.PI / 180;

/** Polar values (magnitude, degrees) to the writer's re/im arrays. */
function polar(values: [number, number][]): { re: Float64Array; im: Float64Array } {
  return {
    re: Float64Array.from(values, ([m, a]) => m * Math.cos(a * rad)),
    im: Float64Array.from(values, ([m, a]) => m * Math.sin(a * rad)),
  };
}

describe('writeTouchstone against the specification’s examples', () => {
  it('version 1 normalises Z to R: the ohms of example 10 written with R 75 are the numbers of example 9', () => {
    const ohms = dataLines(example('ex_10.ts')).map(numbers);
    const input: TouchstoneWriteInput = {
      version: 1,
      ports: 1,
      parameter: 'Z',
      format: 'MA',
      unit: 'MHz',
      reference: 75,
      frequencies: Float64Array.from(ohms, (r) => r[0] * 1e6),
      ...polar(ohms.map((r) => [r[1], r[2]])),
    };
    const text = writeTouchstone(input);
    expect(text.split('\n').find((l) => l.startsWith('#'))).toBe('# MHz Z MA R 75');
    const written = dataLines(text).map(numbers);
    const expected = dataLines(example('ex_9.s1p')).map(numbers);
    expect(written).toHaveLength(expected.length);
    written.forEach((row, k) => row.forEach((v, j) => expect(v).toBeCloseTo(expected[k][j], 10)));
  });

  it('version 2 two-port in 21_12 order: the data lines of example 3, character for character', () => {
    // S11 = 111, S12 = 112, S21 = 121, S22 = 122 at 1 GHz; 211… at 2 GHz; all at 0°.
    const at = (k: number) => [k * 100 + 11, k * 100 + 12, k * 100 + 21, k * 100 + 22];
    const text = writeTouchstone({
      version: 2,
      ports: 2,
      parameter: 'S',
      format: 'MA',
      unit: 'GHz',
      reference: 50,
      frequencies: Float64Array.from([1e9, 2e9]),
      re: Float64Array.from([...at(1), ...at(2)]),
      im: new Float64Array(8),
      twoPortOrder: '21_12',
    });
    const reference = dataLines(example('ex_3.ts'));
    expect(dataLines(text)).toEqual(reference);
    // Keywords in the order the example gives them, [Version] first and [End] last (the specification's rule).
    const keywords = (t: string) => t.split('\n').filter((l) => l.startsWith('[')).map((l) => l.replace(/\].*/, ']'));
    const ours = keywords(text);
    expect(ours[0]).toBe('[Version]');
    expect(ours.at(-1)).toBe('[End]');
    const shared = keywords(reference.join('\n') + '\n' + example('ex_3.ts')).filter((k) => ours.includes(k));
    expect(ours.filter((k) => shared.includes(k))).toEqual(shared);
    expect(text).toContain('[Number of Frequencies] 2\n');
  });

  it('a four-port writes each frequency’s matrix one row a line, as example 14', () => {
    const rows = dataLines(example('ex_14.s4p')).map(numbers);
    // Every fourth line starts with the frequency; the others hold a row's four pairs alone.
    const frequencies: number[] = [];
    const values: [number, number][] = [];
    rows.forEach((r, i) => {
      const pairs = i % 4 === 0 ? r.slice(1) : r;
      if (i % 4 === 0) frequencies.push(r[0] * 1e9);
      for (let j = 0; j < 8; j += 2) values.push([pairs[j], pairs[j + 1]]);
    });
    const text = writeTouchstone({ version: 1, ports: 4, parameter: 'S', format: 'MA', unit: 'GHz', reference: 50, frequencies: Float64Array.from(frequencies), ...polar(values), digits: 6 });
    const written = dataLines(text).map(numbers);
    expect(written).toHaveLength(rows.length);
    written.forEach((row, k) => {
      expect(row).toHaveLength(rows[k].length);
      row.forEach((v, j) => expect(v).toBeCloseTo(rows[k][j], 4));
    });
  });

  it('RI and DB formats: 20·log10|S| and the angle; real and imaginary parts as they are', () => {
    const base = { version: 2 as const, ports: 1, parameter: 'S' as const, unit: 'Hz' as const, reference: 50, frequencies: Float64Array.from([1e6]) };
    const s = { re: Float64Array.from([0.3]), im: Float64Array.from([-0.4]) };
    expect(dataLines(writeTouchstone({ ...base, format: 'RI', ...s }))).toEqual(['1000000 0.3 -0.4']);
    const [f, db, angle] = numbers(dataLines(writeTouchstone({ ...base, format: 'DB', ...s }))[0]);
    expect(f).toBe(1e6);
    // |S| = 0.5: 20·log10(0.5) = −6.0206 dB; angle atan2(−0.4, 0.3) = −53.130°.
    expect(db).toBeCloseTo(-6.020599913279624, 12);
    expect(angle).toBeCloseTo(-53.13010235415598, 12);
  });

  it('refuses value arrays that do not match ports × frequencies', () => {
    expect(() =>
      writeTouchstone({ version: 2, ports: 2, parameter: 'Z', format: 'RI', unit: 'Hz', reference: 50, frequencies: Float64Array.from([1, 2]), re: new Float64Array(4), im: new Float64Array(4) }),
    ).toThrow(/ports × frequencies/);
  });
});

/** A version 1 one-port S file in RI (a data line: the frequency, then Re and Im of S11). */
const onePort = (re: number[], im: number[], extra: Partial<TouchstoneWriteInput> = {}): TouchstoneWriteInput => ({
  version: 1,
  ports: 1,
  parameter: 'S',
  format: 'RI',
  unit: 'Hz',
  reference: 50,
  frequencies: Float64Array.from(re, (_, k) => 1000 * (k + 1)),
  re: Float64Array.from(re),
  im: Float64Array.from(im),
  ...extra,
});

describe('writeTouchstone with decimals per value', () => {
  it('writes each value as its rounding to that many decimals reads back (String(Number(v.toFixed(d))), ECMA-262)', () => {
    const re = [0.123456789, -0.99999999987, 0.5, -0.0000001234, 0.999999999999999, 1e-9];
    const im = [-0.000012345678, 0.3333333333333333, -0.25, 0.7071067811865476, -1e-12, 0.0625];
    const decimals = Uint8Array.from([6, 12, 3, 9, 17, 4]);
    const lines = dataLines(writeTouchstone(onePort(re, im, { decimals })));
    expect(lines).toEqual(re.map((r, k) => `${1000 * (k + 1)} ${String(Number(r.toFixed(decimals[k])))} ${String(Number(im[k].toFixed(decimals[k])))}`));
    expect(lines[0]).toBe('1000 0.123457 -0.000012');
    expect(lines[3]).toBe('4000 -1.23e-7 0.707106781');
  });

  it('refuses decimals for a format other than RI, or of another length than the values', () => {
    expect(() => writeTouchstone(onePort([0.1], [0.2], { format: 'MA', decimals: Uint8Array.from([3]) }))).toThrow(RangeError);
    expect(() => writeTouchstone(onePort([0.1, 0.2], [0.2, 0.3], { decimals: Uint8Array.from([3]) }))).toThrow(RangeError);
  });
});
