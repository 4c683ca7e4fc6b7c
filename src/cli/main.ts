// The zfolio command: dispatch, help, and exit codes (0 ok, 1 bad input or a failure, 2 misuse; 3 from plan).

import { DEBUG_ENV, EXIT_BAD_INPUT, EXIT_MISUSE, EXIT_OK, UsageError, type CommandIO } from './io.js';
import { failureDetails, failureLine } from './failure.js';
import { FailedAfterSwap, OutputRefused } from '../build/output-guard.js';
import { VERSION } from '../version.js';

type Command = (args: string[], io: CommandIO) => number | Promise<number>;

interface CommandEntry {
  /**
   * The command and its help, from its own module, loaded on first use: a command loads only what it needs
   * (check, figures, sweep and plan never load vega, eleventy or Chromium's driver), so each starts sooner.
   */
  load(): Promise<{ run: Command; help: string }>;
  summary: string;
  /** The command handles SIGINT and SIGTERM itself (see process.ts). */
  ownsSignals?: boolean;
}

export const COMMANDS: Record<string, CommandEntry> = {
  check: { load: () => import('./commands/check.js').then((m) => ({ run: m.check, help: m.checkHelp })), summary: 'validate the library and list every problem' },
  figures: { load: () => import('./commands/figures.js').then((m) => ({ run: m.figures, help: m.figuresHelp })), summary: 'resonances, SRF and usable band of parts' },
  sweep: { load: () => import('./commands/sweep.js').then((m) => ({ run: m.sweep, help: m.sweepHelp })), summary: "a part's impedance at every sweep point" },
  plan: { load: () => import('./commands/plan.js').then((m) => ({ run: m.plan, help: m.planHelp })), summary: 'check a rail plan against its target impedance, or --suggest parts' },
  build: { load: () => import('./commands/build.js').then((m) => ({ run: m.build, help: m.buildHelp })), summary: 'build the folio: static site, and PDFs with --pdf' },
  serve: { load: () => import('./commands/serve.js').then((m) => ({ run: m.serve, help: m.serveHelp })), summary: 'build, serve on this machine, and rebuild on every change', ownsSignals: true },
  print: { load: () => import('./commands/print.js').then((m) => ({ run: m.print, help: m.printHelp })), summary: 'PDFs of chosen parts and review packs' },
  diff: { load: () => import('./commands/diff.js').then((m) => ({ run: m.diff, help: m.diffHelp })), summary: 'what changed since a git revision, and which verdicts it moved' },
  fit: { load: () => import('./commands/fit.js').then((m) => ({ run: m.fit, help: m.fitHelp })), summary: "fit a kind's model to a measured Touchstone file" },
  export: { load: () => import('./commands/export.js').then((m) => ({ run: m.exportCommand, help: m.exportHelp })), summary: "parts' models as Touchstone (.s1p) or SPICE (.subckt) files" },
};

export function mainHelp(): string {
  const width = Math.max(...Object.keys(COMMANDS).map((c) => c.length));
  const lines = Object.entries(COMMANDS).map(([name, c]) => `  ${name.padEnd(width)}  ${c.summary}`);
  return `zfolio ${VERSION}: impedance datasheets for a library of passive parts

Usage: zfolio COMMAND [options]

Commands:
${lines.join('\n')}

Every command takes --help, and every one but fit takes --library DIR
(default: the current folder).
Exit status: 0 success; 1 problems in the library, or a failure said in one
line; 2 wrong command line, or an output folder zfolio will not replace;
3 a rail plan misses its target (plan).
`;
}

export async function main(argv: string[], io: CommandIO): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined || name === '--help' || name === '-h' || name === 'help') {
    const topic = name === 'help' ? rest[0] : undefined;
    const text = topic && Object.hasOwn(COMMANDS, topic) ? (await COMMANDS[topic].load()).help : mainHelp();
    // With no command at all the help is an answer to misuse: stderr and exit 2.
    if (name === undefined) io.err(text);
    else io.out(text);
    return name === undefined ? EXIT_MISUSE : EXIT_OK;
  }
  if (name === '--version' || name === '-V') {
    io.out(`zfolio ${VERSION}\n`);
    return EXIT_OK;
  }
  // Own keys only: "constructor" or "__proto__" is not a command.
  const command = Object.hasOwn(COMMANDS, name) ? COMMANDS[name] : undefined;
  if (!command) {
    io.err(`zfolio: unknown command ${JSON.stringify(name)}; expected one of ${Object.keys(COMMANDS).join(', ')}\n`);
    return EXIT_MISUSE;
  }
  try {
    const { run } = await command.load();
    return await run(rest, io);
  } catch (error) {
    if (error instanceof UsageError) {
      io.err(`zfolio ${name}: ${error.message}\nRun "zfolio ${name} --help" for usage.\n`);
      return EXIT_MISUSE;
    }
    if (error instanceof OutputRefused) {
      io.err(`zfolio ${name}: ${error.message}\n`);
      return EXIT_MISUSE;
    }
    // A build that failed once its new site was in place: what failed, then that the site is the new one.
    const failed = error instanceof FailedAfterSwap ? error.cause : error;
    io.err(`zfolio ${name}: ${failureLine(failed)}\n`);
    if (error instanceof FailedAfterSwap) io.err(`zfolio ${name}: ${error.inPlace}\n`);
    if (io.env[DEBUG_ENV]) io.err(failureDetails(failed) + '\n');
    return EXIT_BAD_INPUT;
  }
}
