// Temperatures and temperature coefficients as part files and folio.yaml write them.
// A temperature needs its unit: "-55°C", "125 °C", "85C", "218.15K" (Celsius as the trade writes it, or
// kelvin). A bare number is refused: by zfolio's rule it would be kelvin, which nobody means by "-55".
// Inside zfolio temperatures are kept in °C (named …C), differences in K.
// A temperature coefficient: "200ppm/K" or "±200ppm/K" (either sign, as resistors are specified, common
// practice), "+300ppm/K" or "-150ppm/K" (one sign), also with "/°C".

import { quote } from './quote.js';

/** 0 °C in kelvin (BIPM SI Brochure, 9th ed., 2.3.1). */
export const KELVIN_AT_ZERO_CELSIUS = 273.15;

/** Temperatures zfolio reads, °C: below the coldest any part is rated for, above the hottest solder. */
export const TEMPERATURE_RANGE_C = { min: -270, max: 500 } as const;
/** Largest temperature coefficient accepted, per K (1%/K): beyond any passive part's drift. */
export const MAX_COEFFICIENT_PER_K = 0.01;

export type ParsedTemperature = { ok: true; celsius: number } | { ok: false; message: string };

const NUMBER = '([+\\-−]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?)';
const TEMPERATURE = new RegExp(`^${NUMBER}\\s*(°C|℃|C|degC|K)$`);

/** A temperature in °C from "-55°C", "125 °C", "85C" or "358.15K". */
export function parseTemperature(input: string): ParsedTemperature {
  const text = input.trim();
  const m = TEMPERATURE.exec(text);
  if (!m) {
    const bare = new RegExp(`^${NUMBER}$`).test(text);
    return { ok: false, message: `expected a temperature with its unit, e.g. -55°C, 125 °C or 398K, found ${quote(input)}${bare ? ': write °C (or K) after the number' : ''}` };
  }
  const value = Number(m[1].replace('−', '-'));
  const celsius = m[2] === 'K' ? value - KELVIN_AT_ZERO_CELSIUS : value;
  if (m[2] === 'K' && value < 0) return { ok: false, message: `expected a temperature, found ${quote(input)}: no temperature is below 0 K` };
  if (!(celsius >= TEMPERATURE_RANGE_C.min && celsius <= TEMPERATURE_RANGE_C.max)) {
    return { ok: false, message: `expected a temperature from ${TEMPERATURE_RANGE_C.min} °C to ${TEMPERATURE_RANGE_C.max} °C, found ${quote(input)}` };
  }
  return { ok: true, celsius };
}

export type ParsedCoefficient = { ok: true; lowPerK: number; highPerK: number } | { ok: false; message: string };

const COEFFICIENT = new RegExp(`^(±|\\+/?-)?\\s*${NUMBER}\\s*ppm\\s*/\\s*(K|°C|℃|C)$`);

/** "200ppm/K" or "±200ppm/K": from −200 to +200 ppm/K; "-150ppm/K": exactly that. In 1/K. */
export function parseTemperatureCoefficient(input: string): ParsedCoefficient {
  const m = COEFFICIENT.exec(input.trim());
  if (!m) return { ok: false, message: `expected a temperature coefficient such as 200ppm/K (either sign), ±200ppm/K or -150ppm/K, found ${quote(input)}` };
  const raw = m[2].replace('−', '-');
  const value = Number(`${raw}e-6`);
  if (!(Math.abs(value) <= MAX_COEFFICIENT_PER_K)) return { ok: false, message: `expected a temperature coefficient of at most 10000ppm/K, found ${quote(input)}` };
  const signed = m[1] === undefined && /^[+-]/.test(raw);
  if (signed) return { ok: true, lowPerK: value, highPerK: value };
  if (m[1] !== undefined && /^[+-]/.test(raw)) return { ok: false, message: `expected a temperature coefficient such as ±200ppm/K, found ${quote(input)}` };
  return { ok: true, lowPerK: -Math.abs(value), highPerK: Math.abs(value) };
}

/** "−55 °C" for pages and messages. */
export function formatCelsius(celsius: number): string {
  const rounded = Number(celsius.toPrecision(6));
  return `${rounded < 0 ? '−' : ''}${Math.abs(rounded)} °C`;
}
