// Timing helpers for benchmarks: repeat until enough time has passed, report seconds per run.

export interface BenchSection {
  name: string;
  run(): string[] | Promise<string[]>;
}

export interface Measurement {
  runs: number;
  secondsPerRun: number;
}

/** Run `fn` at least `minRuns` times and for at least `minSeconds`, after one warm-up run. */
export function measure(fn: () => void, minRuns = 20, minSeconds = 0.5): Measurement {
  fn();
  let runs = 0;
  const start = process.hrtime.bigint();
  let elapsed = 0;
  while (runs < minRuns || elapsed < minSeconds) {
    fn();
    runs++;
    elapsed = Number(process.hrtime.bigint() - start) / 1e9;
  }
  return { runs, secondsPerRun: elapsed / runs };
}

/** The same for async work. */
export async function measureAsync(fn: () => Promise<void>, minRuns = 3, minSeconds = 0.5): Promise<Measurement> {
  await fn();
  let runs = 0;
  const start = process.hrtime.bigint();
  let elapsed = 0;
  while (runs < minRuns || elapsed < minSeconds) {
    await fn();
    runs++;
    elapsed = Number(process.hrtime.bigint() - start) / 1e9;
  }
  return { runs, secondsPerRun: elapsed / runs };
}
