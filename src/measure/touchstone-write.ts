// Writing a Touchstone file (Touchstone File Format Specification 2.0, IBIS Open Forum, 2009): version 1
// (.sNp, Z and Y normalised to R) or version 2 (keywords, Z and Y in ohms and siemens), any frequency unit,
// parameter and format. Numbers are written in full (the shortest text that reads back to the same double)
// unless fewer digits are asked for.

import { fixedText, significantText } from '../units/digits-text.js';
import { FREQUENCY_SCALE, type DataFormat, type FrequencyUnit, type NetworkParameter } from './network-data.js';
import { hypot } from '../circuit/hypot.js';

export interface TouchstoneWriteInput {
  version: 1 | 2;
  ports: number;
  parameter: NetworkParameter;
  format: DataFormat;
  unit: FrequencyUnit;
  /** Reference impedance, Ω, the same at every port. */
  reference: number;
  frequencies: Float64Array;
  /** Parameter (i, j) at frequency k at index k·N² + i·N + j, in Ω, S or plain numbers. */
  re: Float64Array;
  im: Float64Array;
  /** Comment lines for the head of the file, without the "!". */
  comments?: readonly string[];
  /** Significant digits of each value; the full double when absent. */
  digits?: number;
  /**
   * Decimals of each value of `re` and `im` (index as theirs; RI only): each is written as its rounding to
   * that many decimals reads, String(Number(v.toFixed(d))), instead of with `digits`.
   */
  decimals?: Uint8Array;
  /** Order of a version 2 two-port's values (version 1 is always 21_12). */
  twoPortOrder?: '12_21' | '21_12';
}

const DEGREES = 180 / Math.PI;

export function writeTouchstone(input: TouchstoneWriteInput): string {
  const { ports, version } = input;
  const n2 = ports * ports;
  const count = input.frequencies.length;
  if (input.re.length !== count * n2 || input.im.length !== count * n2) throw new RangeError('writeTouchstone: value arrays do not match ports × frequencies');
  const { decimals } = input;
  if (decimals && (input.format !== 'RI' || decimals.length !== count * n2)) throw new RangeError('writeTouchstone: decimals are for RI values, one per value');
  const num = (v: number) => (input.digits ? significantText(v, input.digits) : String(v));
  const lines: string[] = (input.comments ?? []).map((c) => `! ${c}`.trimEnd());
  const option = `# ${input.unit} ${input.parameter} ${input.format} R ${num(input.reference)}`;
  const order = version === 1 ? '21_12' : (input.twoPortOrder ?? '12_21');
  if (version === 2) {
    lines.push('[Version] 2.0', option, `[Number of Ports] ${ports}`);
    if (ports === 2) lines.push(`[Two-Port Data Order] ${order}`);
    lines.push(`[Number of Frequencies] ${count}`, `[Reference] ${Array.from({ length: ports }, () => num(input.reference)).join(' ')}`, '[Network Data]');
  } else lines.push(option);

  // Version 1 Z and Y are normalised to R.
  const scale = version === 1 && input.parameter === 'Z' ? 1 / input.reference : version === 1 && input.parameter === 'Y' ? input.reference : 1;
  const unit = FREQUENCY_SCALE[input.unit];
  const pair = (index: number): string => {
    const re = input.re[index] * scale;
    const im = input.im[index] * scale;
    switch (input.format) {
      case 'RI':
        return decimals ? `${fixedText(re, decimals[index])} ${fixedText(im, decimals[index])}` : `${num(re)} ${num(im)}`;
      case 'MA':
        return `${num(hypot(re, im))} ${num(Math.atan2(im, re) * DEGREES)}`;
      case 'DB':
        return `${num(20 * Math.log10(hypot(re, im)))} ${num(Math.atan2(im, re) * DEGREES)}`;
    }
  };
  for (let k = 0; k < count; k++) {
    const base = k * n2;
    const f = num(input.frequencies[k] / unit);
    if (ports === 1) lines.push(`${f} ${pair(base)}`);
    else if (ports === 2) {
      const entries = order === '21_12' ? [0, 2, 1, 3] : [0, 1, 2, 3];
      lines.push(`${f} ${entries.map((e) => pair(base + e)).join(' ')}`);
    } else {
      // One matrix row a line, at most four pairs a line (the version 1 rule for three or more ports).
      for (let i = 0; i < ports; i++) {
        for (let j = 0; j < ports; j += 4) {
          const row = [];
          for (let m = j; m < Math.min(ports, j + 4); m++) row.push(pair(base + i * ports + m));
          lines.push(`${i === 0 && j === 0 ? f : ' '} ${row.join(' ')}`);
        }
      }
    }
  }
  if (version === 2) lines.push('[End]');
  return lines.join('\n') + '\n';
}
