// A network as a Touchstone file describes it: its S, Y or Z parameters at each frequency, in SI units
// (Hz, Ω, S), whatever units, format and normalisation the file was written in.

import type { SourcePosition } from '../model/diagnostics.js';

export type NetworkParameter = 'S' | 'Y' | 'Z';
export type DataFormat = 'MA' | 'DB' | 'RI';
export type FrequencyUnit = 'Hz' | 'kHz' | 'MHz' | 'GHz';

/** Hz per unit of each frequency unit an option line may name. */
export const FREQUENCY_SCALE: Readonly<Record<FrequencyUnit, number>> = { Hz: 1, kHz: 1e3, MHz: 1e6, GHz: 1e9 };

export interface NetworkData {
  /** The file as messages name it. */
  file: string;
  /** 1 for a version 1.x file (no [Version] keyword), 2 for 2.0 and 2.1. */
  version: 1 | 2;
  ports: number;
  parameter: NetworkParameter;
  /** As the file wrote its values; the values below are converted. */
  format: DataFormat;
  frequencyUnit: FrequencyUnit;
  /** Reference impedance of each port, Ω. */
  reference: number[];
  /** Hz, strictly increasing. */
  frequencies: Float64Array;
  /**
   * Parameter (i, j), 0-based, at frequency k: index k·N² + i·N + j. S is dimensionless, Z in Ω and Y in S
   * (a version 1 file's normalised Z and Y are already multiplied or divided by its R).
   */
  re: Float64Array;
  im: Float64Array;
  /** The line each frequency's values begin on, for messages about one frequency. */
  lines: Int32Array;
  /** Where the file states its port count and reference impedance, for messages about them. */
  at: { ports: SourcePosition; reference: SourcePosition };
}

/** Parameter (i, j), 0-based, at frequency index k, as [re, im]. */
export function parameterAt(data: NetworkData, k: number, i: number, j: number): [number, number] {
  const index = k * data.ports * data.ports + i * data.ports + j;
  return [data.re[index], data.im[index]];
}
