// What `zfolio fit` prints: the fitted parameters in engineering notation, why any was left out, the
// residuals, and a YAML block to paste into a part file; or one JSON object in SI units.

import type { Fixture } from '../measure/fixtures.js';
import { FIT_PARAMETERS, type FitKind } from '../measure/fit-models.js';
import type { FitResult, LeftOut } from '../measure/fit.js';
import { formatEng, formatPercent } from '../units/format.js';

export interface FitReportInput {
  file: string;
  fit: FitResult;
  fixture: Fixture;
  /** The fixture was chosen from the port count and kind, not named on the command line. */
  fixtureByDefault: boolean;
  referenceOhm: number;
  /** Points where |Z| is outside the fixture's accurate range, and that range. */
  outsideFixture?: { count: number; lowOhm: number; highOhm: number };
}

const SOURCE: Readonly<Record<Fixture, string>> = {
  reflection: 'S11, Z11 or 1/Y11',
  'shunt-thru': 'S21, part to ground between the ports',
  'series-thru': 'S21, part in series between the ports',
};

/** A parameter's value with four significant digits and its unit, as a part file takes it: "18.01mΩ". */
export function yamlQuantity(value: number, kind: FitKind, name: string): string {
  const spec = FIT_PARAMETERS[kind].find((p) => p.name === name)!;
  return formatEng(value, spec.dimension, { digits: 4, space: false });
}

/** The block to paste into the part file. */
export function fitYaml(fit: FitResult): string[] {
  const p = fit.parameters;
  const names = FIT_PARAMETERS[fit.kind].map((s) => s.name).filter((n) => p[n] !== undefined && n !== 'nominal');
  const flow = `{${names.map((n) => `${n}: ${yamlQuantity(p[n], fit.kind, n)}`).join(', ')}}`;
  if (fit.kind === 'bead') return [`model: ${flow}`];
  return [`nominal: ${yamlQuantity(p.nominal, fit.kind, 'nominal')}`, ...(names.length ? [`parasitics: ${flow}`] : [])];
}

/** Why a parameter was left out, in words. */
export function leftOutText(l: LeftOut, fit: FitResult): string {
  const range = `${formatEng(fit.fromHz, 'frequency')} to ${formatEng(fit.toHz, 'frequency')}`;
  const where =
    l.strongest === 'low-end'
      ? '; its effect grows towards the low end, so a sweep starting lower would show it'
      : l.strongest === 'high-end'
        ? '; its effect grows towards the high end, so a sweep reaching higher would show it'
        : '';
  if (l.why === 'not-needed') return `left out: the fit is no better with it than the noise in the data explains${where}`;
  if (l.why === 'no-effect') return `left out: at its best value it changes |Z| and phase by less than 0.1% anywhere from ${range}${where}`;
  return `left out: the scatter of the data leaves it uncertain by more than a factor of two (±${formatPercent(Math.expm1(l.standardError), 2)})${where}`;
}

export function fitText(r: FitReportInput): string {
  const { fit } = r;
  const lines: string[] = [];
  lines.push(
    `${r.file}: ${fit.kind}, ${r.fixture} fixture (${SOURCE[r.fixture]}; Z0 = ${formatEng(r.referenceOhm, 'resistance')})${r.fixtureByDefault ? ', chosen by default: give --fixture to change it' : ''}`,
    `fitted ${fit.points} points from ${formatEng(fit.fromHz, 'frequency')} to ${formatEng(fit.toHz, 'frequency')}`,
    '',
  );
  const specs = FIT_PARAMETERS[fit.kind];
  const width = Math.max(...specs.map((s) => s.name.length));
  for (const spec of specs) {
    const value = fit.parameters[spec.name];
    const left = fit.leftOut.find((l) => l.name === spec.name);
    if (value !== undefined) {
      const error = fit.standardErrors[spec.name];
      lines.push(`  ${spec.name.padEnd(width)}  ${formatEng(value, spec.dimension, { digits: 4 }).padEnd(11)}  ± ${formatPercent(Math.expm1(error), 2)} (one standard error)`);
    } else if (left) lines.push(`  ${spec.name.padEnd(width)}  ${leftOutText(left, fit)}`);
  }
  const res = fit.residual;
  lines.push('', `residual over the fitted range: |Z| rms ${res.rmsDb.toPrecision(2)} dB, max ${res.maxDb.toPrecision(2)} dB; phase rms ${res.rmsDeg.toPrecision(2)}°`);
  if (r.outsideFixture && r.outsideFixture.count > 0) {
    const o = r.outsideFixture;
    const range = o.lowOhm > 0 && o.highOhm < Infinity ? `outside ${formatEng(o.lowOhm, 'resistance')} to ${formatEng(o.highOhm, 'resistance')}` : o.lowOhm > 0 ? `below ${formatEng(o.lowOhm, 'resistance')}` : `above ${formatEng(o.highOhm, 'resistance')}`;
    lines.push(`note: at ${o.count} of ${fit.points} points |Z| is ${range}, where a ${r.fixture} measurement loses accuracy; weigh the fit there with care`);
  }
  lines.push('', 'Paste into the part file:', ...fitYaml(fit), '');
  return lines.join('\n');
}

export function fitJson(r: FitReportInput): object {
  const { fit } = r;
  return {
    file: r.file,
    kind: fit.kind,
    fixture: r.fixture,
    referenceOhm: r.referenceOhm,
    points: fit.points,
    fromHz: fit.fromHz,
    toHz: fit.toHz,
    parameters: fit.parameters,
    standardErrors: fit.standardErrors,
    leftOut: fit.leftOut.map((l) => ({ parameter: l.name, why: l.why, strongest: l.strongest, reason: leftOutText(l, fit) })),
    residual: fit.residual,
  };
}
