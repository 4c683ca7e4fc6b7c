// zfolio fit: a kind's model fitted to a measurement file, with residuals and a YAML block for the part.

import { relative, resolve } from 'node:path';
import { FIXTURES, impedanceFromNetwork, pointsOutside, type Fixture } from '../../measure/fixtures.js';
import { FIT_KINDS, type FitKind } from '../../measure/fit-models.js';
import { fitImpedance } from '../../measure/fit.js';
import { formatDiagnostic } from '../../model/diagnostics.js';
import { closest } from '../../model/suggest.js';
import { parseQuantity } from '../../units/parse.js';
import { quote } from '../../units/quote.js';
import { inRange, rangeText } from '../../units/ranges.js';
import { parseCommandLine } from '../args.js';
import { fitJson, fitText } from '../../present/fit-report.js';
import { EXIT_BAD_INPUT, EXIT_OK, UsageError, type CommandIO } from '../io.js';
import { readMeasurementFile } from '../measurement-file.js';

export const fitHelp = `Usage: zfolio fit FILE --kind KIND [--fixture FIXTURE] [--from F] [--to F]
                  [--json]

Reads a Touchstone file (.s1p, .s2p, or version 2 .ts), turns it into the
part's impedance by the fixture it was measured in, and fits the kind's model
by least squares on ln|Z| and phase. Prints each parameter with its standard
error, any the data cannot determine and why, the residuals (|Z| rms and max
in dB, phase rms in degrees), and a YAML block to paste into the part file.

Options:
  --kind KIND         capacitor, inductor, resistor or bead
  --fixture FIXTURE   reflection (one-port: Z = Z0(1+S11)/(1-S11)),
                      shunt-thru (two-port, part to ground:
                        Z = (Z0/2)·S21/(1-S21)),
                      series-thru (two-port, part in series:
                        Z = 2·Z0·(1-S21)/S21);
                      default: reflection for a one-port file, shunt-thru for
                      a capacitor and series-thru for the others in a two-port
                      file
  --from F, --to F    fit only this range, e.g. --from 10k --to 500M
  --json              one JSON object, SI units
  -h, --help          show this help

Reads no library: FILE is any Touchstone file.
`;

export function fit(args: string[], io: CommandIO): number {
  const { values, positionals } = parseCommandLine(
    args,
    { kind: { type: 'string' }, fixture: { type: 'string' }, from: { type: 'string' }, to: { type: 'string' }, json: { type: 'boolean' }, help: { type: 'boolean', short: 'h' } },
    true,
  );
  if (values.help) {
    io.out(fitHelp);
    return EXIT_OK;
  }
  if (positionals.length !== 1) throw new UsageError(`fit takes exactly one measurement file, found ${positionals.length}`);
  const kind = oneOf('kind', values.kind, FIT_KINDS, true) as FitKind;
  const named = oneOf('fixture', values.fixture, FIXTURES, false) as Fixture | undefined;
  const fromHz = frequency('from', values.from);
  const toHz = frequency('to', values.to);
  if (fromHz !== undefined && toHz !== undefined && !(toHz > fromHz)) throw new UsageError('--to must be above --from');

  const path = resolve(io.cwd, positionals[0]);
  const shown = relative(io.cwd, path) || positionals[0];
  const read = readMeasurementFile(path, shown);
  if (!read.ok) {
    for (const line of read.lines) io.err(line + '\n');
    return EXIT_BAD_INPUT;
  }
  const fixture: Fixture = named ?? (read.data.ports === 1 ? 'reflection' : kind === 'capacitor' ? 'shunt-thru' : 'series-thru');
  const impedance = impedanceFromNetwork(read.data, fixture);
  if (!impedance.ok) {
    io.err(formatDiagnostic(impedance.error) + '\n');
    return EXIT_BAD_INPUT;
  }
  const outcome = fitImpedance(kind, impedance.impedance, { fromHz, toHz });
  if (!outcome.ok) {
    io.err(`${shown}: ${outcome.message}\n`);
    return EXIT_BAD_INPUT;
  }
  const report = {
    file: shown,
    fit: outcome.fit,
    fixture,
    fixtureByDefault: named === undefined,
    referenceOhm: impedance.impedance.referenceOhm,
    outsideFixture: pointsOutside(impedance.impedance, outcome.fit.fromHz, outcome.fit.toHz),
  };
  io.out(values.json ? JSON.stringify(fitJson(report)) + '\n' : fitText(report));
  return EXIT_OK;
}

function oneOf(name: string, value: unknown, choices: readonly string[], required: boolean): string | undefined {
  if (value === undefined) {
    if (required) throw new UsageError(`--${name} is required: one of ${choices.join(', ')}`);
    return undefined;
  }
  const text = String(value);
  if (choices.includes(text)) return text;
  const guess = closest(text, choices);
  throw new UsageError(`--${name}: expected one of ${choices.join(', ')}, found ${quote(text)}${guess ? `; did you mean ${guess}?` : ''}`);
}

function frequency(name: string, value: unknown): number | undefined {
  if (typeof value !== 'string') return undefined;
  const parsed = parseQuantity(value, 'frequency');
  if (!parsed.ok) throw new UsageError(`--${name}: ${parsed.message}`);
  if (!inRange(parsed.value, 'frequency')) throw new UsageError(`--${name}: expected a frequency ${rangeText('frequency')}, found ${quote(value)}`);
  return parsed.value;
}
