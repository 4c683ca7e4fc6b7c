// Where each value of a Touchstone record goes in the N×N matrix, and how a pair of numbers becomes a
// complex value (Touchstone File Format Specification 2.0, IBIS Open Forum, 2009: "Network Data",
// "[Two-Port Data Order]", "[Matrix Format]").

import type { DataFormat } from './network-data.js';

export type MatrixFormat = 'Full' | 'Lower' | 'Upper';
export type TwoPortOrder = '12_21' | '21_12';

/** For the n-th pair of a record: its matrix index i·N + j, and the mirrored index of a half matrix (or −1). */
export interface RecordLayout {
  slots: Int32Array;
  mirrors: Int32Array;
}

/**
 * Full matrices are row by row (S11 S12 … S1N S21 …), except a 2-port in the 21_12 order (S11 S21 S12
 * S22), which every version 1 two-port file uses. Lower holds j ≤ i row by row, Upper j ≥ i; the other half
 * is the same by symmetry.
 */
export function recordLayout(ports: number, matrix: MatrixFormat, twoPortOrder: TwoPortOrder): RecordLayout {
  const slots: number[] = [];
  const mirrors: number[] = [];
  for (let i = 0; i < ports; i++) {
    const from = matrix === 'Upper' ? i : 0;
    const to = matrix === 'Lower' ? i : ports - 1;
    for (let j = from; j <= to; j++) {
      slots.push(i * ports + j);
      mirrors.push(matrix !== 'Full' && i !== j ? j * ports + i : -1);
    }
  }
  if (ports === 2 && matrix === 'Full' && twoPortOrder === '21_12') {
    // S11 S21 S12 S22
    slots.splice(0, 4, 0, 2, 1, 3);
  }
  return { slots: Int32Array.from(slots), mirrors: Int32Array.from(mirrors) };
}

const DEGREE = Math.PI / 180;

/** A pair as written (magnitude–angle in degrees, dB–angle, or real–imaginary) as [re, im]. */
export function pairValue(format: DataFormat, a: number, b: number): [number, number] {
  switch (format) {
    case 'RI':
      return [a, b];
    case 'MA':
      return [a * Math.cos(b * DEGREE), a * Math.sin(b * DEGREE)];
    case 'DB': {
      // 20·log10|x| (the specification's dB is of the magnitude, a voltage ratio).
      const magnitude = 10 ** (a / 20);
      return [magnitude * Math.cos(b * DEGREE), magnitude * Math.sin(b * DEGREE)];
    }
  }
}
