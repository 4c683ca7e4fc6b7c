// The folio at scale (opt-in: `npm run bench -- scale`): generated libraries of 1,000 and 10,000 invented
// parts, each built cold, rebuilt once with nothing changed (timed apart: it has no spare version to update
// yet, see src/build/carry-over.ts), rebuilt after one part file is edited (EDITS times, the sizes taking
// turns) and rebuilt with nothing changed,
// every build in a process of its own so its peak RSS is its own (the edit and the rebuild with nothing
// changed are also timed as whole processes: Node's start, loading zfolio, the build and the exit, as a
// `zfolio build` command takes); then the site's size, its files and its largest page. Each 10,000-part figure is also given as a ratio to the 1,000-part one measured in this run.
// ZFOLIO_BENCH_SCALE=N1,N2 builds other sizes (e.g. 200,2000 for a quick look).

import { execFileSync } from 'node:child_process';
import { lstatSync, readdirSync, readFileSync, realpathSync, rmSync, writeFileSync } from 'node:fs';
import { loadavg } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { pathToFileURL } from 'node:url';
import { findChrome, launchChrome } from '../src/print/browser.js';
import { writeGeneratedLibrary } from './generate.js';
import type { BenchSection } from './measure.js';

const HERE = dirname(fileURLToPath(import.meta.url));
const SIZES = (process.env.ZFOLIO_BENCH_SCALE ?? '1000,10000').split(',').map(Number);
/**
 * One-edit rebuilds timed at each size. A single rebuild's time moved by 15 % from one run to the next on a
 * 2-core machine with nothing else running (1.56 to 1.94 s at 10,000 parts), and the machine's own speed moves
 * over minutes (the same cold build took 32.7 and 46.7 s of CPU a few minutes apart): the sizes take turns,
 * one edit each a round, so that both meet the machine as it is then. The figure and its ratio are each
 * size's median, with the range beside it, and each round's ratio is given too.
 */
const EDITS = 5;

/** The item of median value (the lower middle of an even count). */
function median<T>(items: readonly T[], value: (item: T) => number): T {
  return [...items].sort((a, b) => value(a) - value(b))[Math.floor((items.length - 1) / 2)];
}

interface Build {
  ok: boolean;
  /** buildFolio's own time (scale-build.mjs). */
  seconds: number;
  /** The whole process: Node's start, loading zfolio's modules, the build and the exit, as a command takes. */
  processSeconds: number;
  peakRssBytes: number;
  /** CPU time of every thread of the build's process, from its start (scale-build.mjs). */
  cpu: { userSeconds: number; systemSeconds: number };
  reused: number;
  pages: number;
  /** What the build did (BuildResult.work), and the units it kept from the spare and linked from the live site. */
  work: Record<string, number>;
  unitsKept: number;
  unitsLinked: number;
  error?: string;
}

interface SiteSize {
  bytes: number;
  files: number;
  largestPage: { file: string; bytes: number };
}

interface Run {
  parts: number;
  /** Seconds from opening the index in headless Chromium (from the file system) to its first screenshot; null without Chromium. */
  indexSeconds: number | null;
  cold: Build;
  /** The first rebuild, nothing changed: no spare version yet, so every unit is linked from the live site. */
  first: Build;
  /** The edit rebuild of median time of EDITS (each a new ESR for the same part), and every one's times. */
  edited: Build;
  edits: { seconds: number[]; processSeconds: number[] };
  unchanged: Build;
  site: SiteSize;
  partFolderBytes: number;
}

function build(library: string, out: string): Build {
  const started = performance.now();
  const text = execFileSync(process.execPath, [join(HERE, 'scale-build.mjs'), library, out], { encoding: 'utf8', maxBuffer: 1 << 20 });
  const processSeconds = (performance.now() - started) / 1000;
  const result = { ...(JSON.parse(text.trim().split('\n').pop()!) as Omit<Build, 'processSeconds'>), processSeconds };
  if (!result.ok) throw new Error(`scale bench: a build of ${library} failed: ${result.error}`);
  return result;
}

/** Bytes and files of a site (through its link), and its largest HTML page. */
function siteSize(site: string): SiteSize {
  const root = realpathSync(site);
  const size: SiteSize = { bytes: 0, files: 0, largestPage: { file: '', bytes: 0 } };
  const walk = (dir: string) => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      const path = join(dir, entry.name);
      if (entry.isDirectory()) walk(path);
      else {
        const bytes = lstatSync(path).size;
        size.bytes += bytes;
        size.files++;
        if (entry.name.endsWith('.html') && bytes > size.largestPage.bytes) size.largestPage = { file: path.slice(root.length + 1), bytes };
      }
    }
  };
  walk(root);
  return size;
}

function folderBytes(dir: string): number {
  return readdirSync(dir, { withFileTypes: true }).reduce((n, e) => n + (e.isDirectory() ? folderBytes(join(dir, e.name)) : lstatSync(join(dir, e.name)).size), 0);
}

/** The index page opened in headless Chromium from the file system: seconds until its first screenshot. */
async function firstScreenshot(site: string): Promise<number | null> {
  const chrome = findChrome(undefined, process.env);
  if ('problem' in chrome) return null;
  const browser = await launchChrome(chrome.path);
  try {
    const page = await browser.newPage();
    await page.setViewport({ width: 1280, height: 900 });
    const started = performance.now();
    await page.goto(`${pathToFileURL(realpathSync(site)).href}/index.html`, { waitUntil: 'load' });
    await page.screenshot();
    return (performance.now() - started) / 1000;
  } finally {
    await browser.close();
  }
}

/** A size's library built cold and once more unchanged, its site measured, ready for the edit rounds. */
interface Prepared extends Omit<Run, 'edited' | 'edits' | 'unchanged'> {
  root: string;
  out: string;
  target: string;
  original: string;
  builds: Build[];
}

async function prepare(parts: number): Promise<Prepared> {
  const root = writeGeneratedLibrary(parts, 1);
  const out = join(root, '_site');
  const target = join(root, 'parts', 'group-0', 'gen-0.yaml');
  try {
    const cold = build(root, out);
    const site = siteSize(out);
    const partFolderBytes = folderBytes(join(realpathSync(out), 'parts')) / parts;
    const first = build(root, out);
    const indexSeconds = await firstScreenshot(out);
    return { parts, root, out, target, original: readFileSync(target, 'utf8'), builds: [], cold, first, site, partFolderBytes, indexSeconds };
  } catch (error) {
    // Not yet in runAll's list, which removes the libraries prepared before.
    rmSync(root, { recursive: true, force: true });
    throw error;
  }
}

/** Edit round `i` of one size: a new ESR for the same part, and the rebuild. */
function editRound(p: Prepared, i: number): void {
  writeFileSync(p.target, p.original.replace(/esr: [^,}]+/, `esr: 0.01${23 + i}`));
  p.builds.push(build(p.root, p.out));
}

function finish(p: Prepared, unchanged: Build): Run {
  const { builds, root: _root, out: _out, target: _target, original: _original, ...rest } = p;
  const edits = { seconds: builds.map((b) => b.seconds), processSeconds: builds.map((b) => b.processSeconds) };
  const edited = { ...median(builds, (b) => b.seconds), processSeconds: median(edits.processSeconds, (x) => x) };
  return { ...rest, edited, edits, unchanged };
}

/** Every size prepared, then the edit rounds (each size in turn), then each rebuilt with nothing changed. */
async function runAll(sizes: readonly number[]): Promise<Run[]> {
  const prepared: Prepared[] = [];
  try {
    for (const parts of sizes) prepared.push(await prepare(parts));
    for (let i = 0; i < EDITS; i++) for (const p of prepared) editRound(p, i);
    return prepared.map((p) => finish(p, build(p.root, p.out)));
  } finally {
    for (const p of prepared) rmSync(p.root, { recursive: true, force: true });
  }
}

const s = (x: number) => `${x.toFixed(x < 10 ? 2 : 1)} s`;
const mb = (bytes: number) => `${(bytes / 1e6).toFixed(bytes < 1e7 ? 2 : 0)} MB`;
const kb = (bytes: number) => `${(bytes / 1e3).toFixed(0)} KB`;
const n = (x: number) => x.toLocaleString('en-US');
const ratio = (a: number, b: number) => `${(a / b).toFixed(2)}×`;
const range = (xs: readonly number[]) => `${Math.min(...xs).toFixed(2)} to ${s(Math.max(...xs))}`;
const work = (b: Build) => `${b.work.filesParsed} files parsed, ${b.work.partsAnalysed} parts analysed, ${b.work.pagesRendered} pages rendered, ${n(b.unitsKept)} units kept, ${b.unitsLinked} linked`;

export const scaleBench: BenchSection = {
  name: 'scale',
  async run() {
    // The builds run the compiled dist/ (scale-build.mjs): compile it from the sources as they are.
    execFileSync('npm', ['run', '--silent', 'build:ts'], { cwd: join(HERE, '..'), stdio: 'inherit' });
    const lines = [`load average before: ${loadavg().map((x) => x.toFixed(2)).join(' ')}; each build in a process of its own`];
    const runs = await runAll(SIZES);
    for (const r of runs) {
      const parts = r.parts;
      lines.push(
        `${n(parts)} parts: cold ${s(r.cold.seconds)} (${n(r.cold.pages)} pages; ${s(r.cold.cpu.userSeconds)} user and ${s(r.cold.cpu.systemSeconds)} system CPU), first rebuild ${s(r.first.seconds)} (${work(r.first)}), then one part edited ${s(r.edited.seconds)} (the median of ${EDITS} edits, ${range(r.edits.seconds)}; ${s(r.edited.processSeconds)} the whole process, ${range(r.edits.processSeconds)}; ${n(r.edited.reused)} part folders carried over; ${work(r.edited)}), nothing changed ${s(r.unchanged.seconds)} (${s(r.unchanged.processSeconds)} the whole process; ${work(r.unchanged)}); ` +
          `peak RSS ${mb(r.cold.peakRssBytes)} cold, ${mb(r.edited.peakRssBytes)} edited; site ${mb(r.site.bytes)} in ${n(r.site.files)} files, ${kb(r.partFolderBytes)} a part folder, largest page ${kb(r.site.largestPage.bytes)} (${r.site.largestPage.file}); index to first screenshot in Chromium ${r.indexSeconds === null ? 'not measured (no Chromium)' : s(r.indexSeconds)}`,
      );
    }
    const [base, ...larger] = runs;
    for (const r of larger) {
      lines.push(
        `${n(r.parts)} parts as ratios to ${n(base.parts)} (${ratio(r.parts, base.parts)} the parts): cold ${ratio(r.cold.seconds, base.cold.seconds)}, one edit ${ratio(r.edited.seconds, base.edited.seconds)} (medians; round by round ${r.edits.seconds.map((x, i) => ratio(x, base.edits.seconds[i])).join(', ')}; the whole process ${ratio(r.edited.processSeconds, base.edited.processSeconds)}), ` +
          `nothing changed ${ratio(r.unchanged.seconds, base.unchanged.seconds)} (the whole process ${ratio(r.unchanged.processSeconds, base.unchanged.processSeconds)}), peak RSS ${ratio(r.cold.peakRssBytes, base.cold.peakRssBytes)}, site size ${ratio(r.site.bytes, base.site.bytes)}, files ${ratio(r.site.files, base.site.files)}`,
      );
    }
    lines.push(`load average after: ${loadavg().map((x) => x.toFixed(2)).join(' ')}`);
    return lines;
  },
};
