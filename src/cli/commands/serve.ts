// zfolio serve: build the folio, serve it on this machine, and rebuild when the library or a template changes.

import { existsSync } from 'node:fs';
import { relative } from 'node:path';
import { formatDiagnostic } from '../../model/diagnostics.js';
import { DEFAULT_OUT_DIR } from '../../build/build.js';
import { terminalProgress } from '../../build/progress.js';
import { serveFolio, type BuildReport } from '../../serve/serve.js';
import { DEFAULT_HOST, DEFAULT_PORT } from '../../serve/static-server.js';
import { commandOptions, LIBRARY_OPTION, libraryRoot } from '../args.js';
import { EXIT_OK, UsageError, type CommandIO } from '../io.js';
import { plural } from '../report.js';
import { BUILD_OPTIONS, carriedText, outputOptions, removedPdfsText, reportBuild, workersOption } from './build.js';

export const serveHelp = `Usage: zfolio serve [--library DIR] [--out DIR] [--port N] [--host ADDRESS]

Builds the folio, serves it at http://${DEFAULT_HOST}:${DEFAULT_PORT}/ (or the next free port,
which it names), and builds it again whenever folio.yaml, a YAML file under
parts/, comparisons/, plans/ or reviews/, or one of zfolio's templates changes.
A rebuild that fails lists its problems and the previous site stays up.
Press Ctrl+C to stop.

Options:
  --out DIR           where the site goes (default: ${DEFAULT_OUT_DIR} under the library)
  --port N            the port to try first (default: ${DEFAULT_PORT}; 0: any free port)
  --host ADDRESS      the address to listen on (default: ${DEFAULT_HOST}, this
                      machine only)
  --workers N         threads drawing charts (default: one per core)
  -l, --library DIR   the library folder (default: the current folder)
  -h, --help          show this help
`;

const SERVE_OPTIONS = {
  ...LIBRARY_OPTION,
  out: BUILD_OPTIONS.out,
  workers: BUILD_OPTIONS.workers,
  port: { type: 'string', short: 'p' },
  host: { type: 'string' },
} as const;

export function portOption(value: unknown): number {
  if (value === undefined) return DEFAULT_PORT;
  const text = String(value);
  const n = Number(text);
  if (!/^\d+$/.test(text) || n > 65535) throw new UsageError(`--port: expected a whole number from 0 to 65535, found ${JSON.stringify(text)}`);
  return n;
}

function hostOption(value: unknown): string {
  if (value === undefined) return DEFAULT_HOST;
  const text = String(value).trim();
  if (text === '') throw new UsageError('--host: expected an address such as 127.0.0.1, found nothing');
  return text;
}

const clock = (at: Date) => at.toTimeString().slice(0, 8);

function changedText(changed: string[]): string {
  const shown = changed.slice(0, 3).join(', ');
  return changed.length > 3 ? `${shown} and ${changed.length - 3} more` : shown;
}

/** One line per rebuild, with its time; a failed one lists its problems first. */
export function reportRebuild(report: BuildReport, io: CommandIO): void {
  const after = `after ${changedText(report.changed)} changed`;
  const { result, error } = report;
  if (error || !result) {
    io.err(`${clock(report.at)} rebuild failed ${after}: ${error?.message ?? 'no result'}; still serving the previous site\n`);
    return;
  }
  for (const d of result.diagnostics) io.err(formatDiagnostic(d) + '\n');
  if (!result.ok) {
    const errors = result.diagnostics.filter((d) => d.severity === 'error').length;
    io.err(`${clock(report.at)} rebuild failed ${after}: ${plural(errors, 'error')} in the library; still serving the previous site\n`);
    return;
  }
  const removed = result.removedPdfs.length > 0 ? `; ${removedPdfsText(result.removedPdfs)}` : '';
  io.out(`${clock(report.at)} rebuilt ${plural(result.parts, 'part')}${carriedText(result)}, ${plural(result.pages, 'page')} in ${result.seconds.toFixed(1)} s ${after}${removed}\n`);
}

/** Resolves when the process is asked to stop (Ctrl+C, or a service manager's TERM). */
function processStop(): { signal: AbortSignal; dispose(): void } {
  const controller = new AbortController();
  const stop = () => controller.abort();
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
  return {
    signal: controller.signal,
    dispose() {
      process.off('SIGINT', stop);
      process.off('SIGTERM', stop);
    },
  };
}

export async function serve(args: string[], io: CommandIO): Promise<number> {
  const stop = processStop();
  try {
    return await serveUntil(args, io, stop.signal);
  } finally {
    stop.dispose();
  }
}

/** The command, stopping when `stop` aborts (tests stop it this way instead of with a signal). */
export async function serveUntil(args: string[], io: CommandIO, stop: AbortSignal): Promise<number> {
  const values = commandOptions('serve', args, SERVE_OPTIONS, serveHelp, io);
  if (!values) return EXIT_OK;
  const root = libraryRoot(values, io);
  const port = portOption(values.port);
  const host = hostOption(values.host);
  const workers = workersOption(values.workers);
  stop.addEventListener('abort', () => io.out('stopping\n'), { once: true });

  let folio: Awaited<ReturnType<typeof serveFolio>>;
  try {
    folio = await serveFolio({
      libraryRoot: root,
      ...outputOptions(values, io),
      port,
      host,
      workers,
      progress: terminalProgress((text) => io.err(text), io.isTTY),
      onBuild: (report) => {
        if (report.round > 0) return reportRebuild(report, io);
        if (report.result) reportBuild(report.result, io);
        else io.err(`zfolio serve: the build failed: ${report.error?.message}\n`);
      },
      onWatchError: (error) => io.err(`zfolio serve: cannot watch for changes: ${error.message}\n`),
    });
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'EADDRINUSE' || code === 'EACCES' || code === 'EADDRNOTAVAIL' || code === 'ENOTFOUND' || code === 'EAI_AGAIN') {
      throw new UsageError(`cannot listen on ${host} port ${port}: ${(error as Error).message}`);
    }
    throw error;
  }

  if (stop.aborted) {
    // Asked to stop during the first build.
    await folio.close();
    return EXIT_OK;
  }
  const where = relative(io.cwd, folio.outDir) || '.';
  const busy = folio.requestedPort !== 0 && folio.port !== folio.requestedPort ? ` (port ${folio.requestedPort} is busy)` : '';
  const built = folio.first.result?.ok ? '' : `; ${existsSync(folio.outDir) ? 'the previous site' : 'nothing'} until the problems above are fixed`;
  io.out(`serving ${where} at ${folio.url}${busy}${built}\n`);
  io.out('rebuilding when the library or the templates change; press Ctrl+C to stop\n');

  await new Promise<void>((done) => (stop.aborted ? done() : stop.addEventListener('abort', () => done(), { once: true })));
  await folio.close();
  return EXIT_OK;
}
