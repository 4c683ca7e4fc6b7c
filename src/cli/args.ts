// Command-line options shared by every command.

import { parseArgs, type ParseArgsConfig } from 'node:util';
import { existsSync, statSync } from 'node:fs';
import { resolve } from 'node:path';
import type { SweepSpec } from '../circuit/sweep.js';
import { parseQuantity } from '../units/parse.js';
import { quote } from '../units/quote.js';
import { inRange, rangeText } from '../units/ranges.js';
import { formatEng } from '../units/format.js';
import { UsageError, type CommandIO } from './io.js';
import { MAX_POINTS_PER_DECADE } from '../model/settings.js';
import { closest } from '../model/suggest.js';

type Options = NonNullable<ParseArgsConfig['options']>;

export const LIBRARY_OPTION: Options = {
  library: { type: 'string', short: 'l' },
  help: { type: 'boolean', short: 'h' },
};

export const SWEEP_OPTIONS: Options = {
  from: { type: 'string' },
  to: { type: 'string' },
  'per-decade': { type: 'string' },
};

export interface Parsed {
  values: Record<string, string | boolean | string[] | undefined>;
  positionals: string[];
}

/**
 * The options of a command that takes no arguments; undefined when --help was asked for, its usage then
 * printed. An unknown option or an argument is misuse (exit 2).
 */
export function commandOptions(command: string, args: string[], options: Options, help: string, io: CommandIO): Parsed['values'] | undefined {
  const { values, positionals } = parseCommandLine(args, options, false);
  if (values.help) {
    io.out(help);
    return undefined;
  }
  if (positionals.length > 0) throw new UsageError(`${command} takes no arguments, found ${positionals.join(' ')}`);
  return values;
}

/** Parse argv strictly: an unknown option is misuse (exit 2), said in plain words. */
export function parseCommandLine(args: string[], options: Options, allowPositionals: boolean): Parsed {
  try {
    const { values, positionals } = parseArgs({ args, options, allowPositionals, strict: true });
    return { values: values as Parsed['values'], positionals };
  } catch (error) {
    const unknown = (error as { code?: string }).code === 'ERR_PARSE_ARGS_UNKNOWN_OPTION' ? /'(-[^']*)'/.exec((error as Error).message)?.[1] : undefined;
    if (unknown !== undefined) throw new UsageError(unknownOptionMessage(unknown, options));
    const message = (error as Error).message.replace(/\. To specify a positional argument.*$/s, '');
    throw new UsageError(message);
  }
}

function unknownOptionMessage(option: string, options: Options): string {
  const names = Object.keys(options);
  const guess = option.startsWith('--') ? closest(option.slice(2), names) : undefined;
  return `unknown option ${JSON.stringify(option)}${guess ? `; did you mean --${guess}?` : ''} (this command takes ${names.map((n) => `--${n}`).join(', ')})`;
}

/** The library folder: --library, else the current folder. It must exist. */
export function libraryRoot(values: Parsed['values'], io: CommandIO): string {
  const root = resolve(io.cwd, typeof values.library === 'string' ? values.library : '.');
  if (!existsSync(root) || !statSync(root).isDirectory()) throw new UsageError(`library folder not found: ${root}`);
  return root;
}

/** The library's sweep with --from/--to/--per-decade applied on top. */
export function sweepWithOverrides(base: SweepSpec, values: Parsed['values']): SweepSpec {
  const sweep = { ...base };
  const read = (name: string) => {
    const text = values[name];
    if (typeof text !== 'string') return undefined;
    const parsed = parseQuantity(text, name === 'per-decade' ? 'ratio' : 'frequency');
    if (!parsed.ok || !(parsed.value > 0)) throw new UsageError(`--${name}: ${parsed.ok ? `expected a value above zero, found ${quote(text)}` : parsed.message}`);
    if (name !== 'per-decade' && !inRange(parsed.value, 'frequency')) throw new UsageError(`--${name}: expected a frequency ${rangeText('frequency')}, found ${quote(text)}`);
    return parsed.value;
  };
  sweep.fromHz = read('from') ?? sweep.fromHz;
  sweep.toHz = read('to') ?? sweep.toHz;
  const perDecade = read('per-decade');
  if (perDecade !== undefined) {
    if (!Number.isInteger(perDecade) || perDecade > MAX_POINTS_PER_DECADE) throw new UsageError(`--per-decade: expected a whole number from 1 to ${MAX_POINTS_PER_DECADE}`);
    sweep.perDecade = perDecade;
  }
  if (!(sweep.toHz > sweep.fromHz)) {
    throw new UsageError(`the sweep must end above where it starts; found from ${formatEng(sweep.fromHz, 'Hz')} to ${formatEng(sweep.toHz, 'Hz')} (--from and --to, or folio.yaml sweep)`);
  }
  return sweep;
}
