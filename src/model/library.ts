// A library folder: folio.yaml and every part file under parts/, read and checked as a whole.

import { isMap, type Node } from 'yaml';
import { DiagnosticList, PER_FILE_LIMIT, formatPosition, quote, type Diagnostic, type SourcePosition } from './diagnostics.js';
import type { PartCache } from './part-cache.js';
import { scalarText } from './fields.js';
import { entryExists, libraryFolder, readLibraryFile, yamlFilesUnder } from './library-files.js';
import { MAX_ID_LENGTH, fileStem, pageName } from './page-names.js';
import { ID_PATTERN, readPart, type Part } from './part.js';
import { readPlan, uniqueRails, type Plan } from './plan.js';
import { comparisonKey, readComparison, type Comparison } from './comparison.js';
import { readReview, type Review } from './review.js';
import { loadMeasurementFiles } from './measurement-files.js';
import { DEFAULT_SETTINGS, readSettings, type FolioSettings } from './settings.js';
import { parseYamlSource, positionOf, type SourceFile } from './source.js';
import { coverageGap, type TemperatureRange } from './spread.js';
import { temperatureGap } from './part-facts.js';

export interface Library {
  /** Absolute path of the library folder. */
  root: string;
  settings: FolioSettings;
  /** In file-path order. */
  parts: Part[];
  partsById: ReadonlyMap<string, Part>;
  /** Every file read, in path order, for hashes and appendices. */
  sources: SourceFile[];
  /** plans/*.yaml (rail decoupling plans), in path order; empty when there is no plans/ folder. */
  plans: Plan[];
  /** comparisons/*.yaml, in path order. */
  comparisons: Comparison[];
  /** reviews/*.yaml, in path order. */
  reviews: LibraryReview[];
}

/** A review as the library holds it: its comparisons and plans resolved. */
export type LibraryReview = Review<Comparison, Plan>;

export interface LoadResult {
  /** Present when the library has no errors (warnings allowed). */
  library?: Library;
  diagnostics: Diagnostic[];
  /** The parts that read without errors, also when other files have some. */
  readParts: Part[];
}

/** YAML files under `dir` at any depth, as library-relative paths with forward slashes, sorted. */
export { yamlFilesUnder } from './library-files.js';

export interface LoadOptions {
  /** Parts read before (part-cache.ts): a part file unchanged since is not read or parsed again. */
  partCache?: PartCache;
  /** Called once, as the first part file not taken from `partCache` is read, with the number of part files. */
  firstRead?(partFiles: number): void;
}

export function loadLibrary(root: string, options: LoadOptions = {}): LoadResult {
  const diagnostics = new DiagnosticList();
  const sources: SourceFile[] = [];
  const read = (path: string, into = diagnostics): SourceFile | undefined => {
    const text = readLibraryFile(root, path, into);
    const source = text === undefined ? undefined : parseYamlSource(path, text, into);
    if (source) sources.push(source);
    return source;
  };
  const cache = options.partCache;
  const filesOf = (folder: string) => (libraryFolder(root, folder, diagnostics) === 'folder' ? yamlFilesUnder(root, folder, diagnostics) : []);

  let settings: FolioSettings | undefined = { ...DEFAULT_SETTINGS };
  if (entryExists(root, 'folio.yaml')) {
    const source = read('folio.yaml');
    settings = source ? readSettings({ source, diagnostics }) : undefined;
  }

  const partsFolder = libraryFolder(root, 'parts', diagnostics);
  if (partsFolder === 'absent') {
    diagnostics.error({ file: 'parts', line: 1, column: 1 }, 'no parts/ folder in the library; each part is a YAML file under parts/');
  }
  const parts: Part[] = [];
  const partsById = new Map<string, Part>();
  // Every id declared, also by files with other errors, so a duplicate is never hidden by them.
  const declared = new Map<string, { id: string; at: SourcePosition }>();
  const unreadableParts = new Map<string, string>();
  const partFiles = partsFolder === 'folder' ? yamlFilesUnder(root, 'parts', diagnostics) : [];
  let firstRead = options.firstRead;
  for (const path of partFiles) {
    const stamp = cache?.stamp(path);
    const cached = cache?.lookup(path, stamp);
    let part: Part | undefined;
    let own: { id: string; at: SourcePosition } | undefined;
    if (cached) {
      ({ part, declared: own } = cached);
      sources.push(part.source);
      for (const d of cached.diagnostics) diagnostics.warning(d, d.message);
    } else {
      firstRead?.(partFiles.length);
      firstRead = undefined;
      // With a cache, the file's own problems are gathered apart, to be kept with the part.
      const fileProblems = cache ? new DiagnosticList() : diagnostics;
      const source = read(path, fileProblems);
      own = source && declaredId(source);
      part = source && readPart({ source, diagnostics: fileProblems });
      if (cache && fileProblems !== diagnostics) {
        const found = fileProblems.sorted();
        for (const d of found) (d.severity === 'error' ? diagnostics.error(d, d.message) : diagnostics.warning(d, d.message));
        if (part && own && fileProblems.errorCount === 0 && found.length <= PER_FILE_LIMIT && found.every((d) => d.file === path)) cache.store(path, stamp, { part, declared: own, diagnostics: found });
        else cache.parsed(path);
      }
    }
    // The id is read once (a cached part answers it through a Proxy, lazy-head.ts): 10,000 parts a build.
    const ownId = own?.id;
    const folded = ownId?.toLowerCase();
    const earlier = folded === undefined ? undefined : declared.get(folded);
    if (own && earlier) {
      const how = earlier.id === ownId ? `duplicate id ${quote(ownId)}` : `id ${quote(ownId!)} differs from ${quote(earlier.id)} only in letter case, and their pages would collide on many file systems`;
      diagnostics.error(own.at, `${how}: already defined at ${formatPosition(earlier.at)}`);
    } else if (own) declared.set(folded!, own);
    if (!part && own && !earlier) unreadableParts.set(ownId!, path);
    if (!part || (own && earlier)) continue;
    partsById.set(part === own ? ownId! : part.id, part);
    parts.push(part);
  }

  loadMeasurementFiles(root, parts, diagnostics);
  if (settings) temperatureCoverage(parts, settings.temperature, diagnostics);

  const unreadable = { parts: unreadableParts, comparisons: new Map<string, string>(), plans: new Map<string, string>() };
  const comparisons: Comparison[] = [];
  const comparisonFiles = filesOf('comparisons');
  for (const path of comparisonFiles) {
    const source = read(path);
    const comparison = source && readComparison({ source, diagnostics, unreadable }, partsById, parts);
    if (comparison) comparisons.push(comparison);
    else unreadable.comparisons.set(fileStem(path, 'comparisons'), path);
  }

  const planned: Plan[] = [];
  for (const path of filesOf('plans')) {
    const source = read(path);
    const plan = source && readPlan({ source, diagnostics, unreadable }, partsById, (settings ?? DEFAULT_SETTINGS).derating, settings?.temperature);
    if (plan) planned.push(plan);
    else {
      const rail = source && declaredText(source, 'rail');
      if (rail) unreadable.plans.set(rail, path);
    }
  }
  const plans = uniqueRails(planned, diagnostics);

  const reviews: LibraryReview[] = [];
  const targets = {
    parts: partsById,
    comparisons: new Map(comparisons.map((c) => [comparisonKey(c), c])),
    plans: new Map(plans.map((p) => [p.rail, p])),
  };
  const reviewFiles = filesOf('reviews');
  for (const path of reviewFiles) {
    const source = read(path);
    const review = source && readReview({ source, diagnostics, unreadable }, targets);
    if (review) reviews.push(review);
  }
  // Two files whose pages would be one folder: "a b.yaml" and "a-b.yaml", "r.yaml" and "R.yml".
  samePageNames(comparisonFiles, 'comparisons', 'comparison', diagnostics);
  samePageNames(reviewFiles, 'reviews', 'review', diagnostics);

  const sorted = diagnostics.sorted();
  if (diagnostics.errorCount > 0 || !settings) return { diagnostics: sorted, readParts: parts };
  return { library: { root, settings, parts, partsById, sources, comparisons, plans, reviews }, diagnostics: sorted, readParts: parts };
}

/** A warning at each part whose temperature characteristic is not specified over the library's whole range. */
function temperatureCoverage(parts: readonly Part[], operating: TemperatureRange, diagnostics: DiagnosticList): void {
  for (const part of parts) {
    if (!temperatureGap(part, operating)) continue;
    const gap = part.spread.temperature && coverageGap(part.spread.temperature, operating, 'the library\'s operating temperatures (folio.yaml "temperature")');
    if (gap) diagnostics.warning(part.spread.temperature!.at, `${part.spread.temperature!.from}: ${gap}`);
  }
}

/** The id a part file declares, when it is a well-formed id, whatever else is wrong with the file. */
function declaredId(source: SourceFile): { id: string; at: SourcePosition } | undefined {
  const contents = source.document.contents;
  if (!isMap(contents)) return undefined;
  const pair = contents.items.find((p) => scalarText(p.key as Node) === 'id');
  const id = declaredText(source, 'id');
  return id === undefined ? undefined : { id, at: positionOf(source, pair!.value as Node) };
}

/** A top-level name field (id, rail) as written, when it is a well-formed name. */
function declaredText(source: SourceFile, field: string): string | undefined {
  const contents = source.document.contents;
  if (!isMap(contents)) return undefined;
  const text = scalarText(contents.items.find((p) => scalarText(p.key as Node) === field)?.value as Node | undefined);
  return text !== undefined && ID_PATTERN.test(text) && text.length <= MAX_ID_LENGTH ? text : undefined;
}

function samePageNames(paths: readonly string[], folder: string, what: string, diagnostics: DiagnosticList): void {
  const taken = new Map<string, string>();
  for (const path of paths) {
    const name = pageName(fileStem(path, folder));
    const earlier = taken.get(name.toLowerCase());
    if (earlier === undefined) {
      taken.set(name.toLowerCase(), path);
      continue;
    }
    diagnostics.error(
      { file: path, line: 1, column: 1 },
      `this ${what}'s page would be ${folder}/${name}/, the same folder as that of ${quote(earlier)} (file names that differ only in letter case, spaces, punctuation or .yaml/.yml make one page name); rename one of the files`,
    );
  }
}
