// Loads every case of the bad-input corpus (test/fixtures/bad-inputs) into a copy of its base library and
// returns the messages the case's own file produced, as the corpus test compares them.

import { cpSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { formatDiagnostic, type Diagnostic } from '../../src/model/diagnostics.js';
import { loadLibrary } from '../../src/model/library.js';

export const CORPUS = fileURLToPath(new URL('../fixtures/bad-inputs/', import.meta.url));
export const FOLDERS = ['parts', 'plans', 'reviews', 'comparisons', 'folio'] as const;

export interface CaseResult {
  /** "parts/tag-float.yaml": where the case lives in the corpus, and how expected.txt names it. */
  name: string;
  /** The case's own messages, as `name:line:col: message`. */
  lines: string[];
  /** Messages about any other file of the library (there should be none). */
  others: Diagnostic[];
  errors: number;
}

export function corpusCases(): string[] {
  return FOLDERS.flatMap((folder) => readdirSync(join(CORPUS, folder)).filter((f) => f.endsWith('.yaml')).sort().map((f) => `${folder}/${f}`));
}

/** A copy of the base library that cases are dropped into one at a time; `done` removes it. */
export function baseCopy(): { root: string; done: () => void } {
  const root = mkdtempSync(join(tmpdir(), 'zfolio-bad-'));
  cpSync(join(CORPUS, 'base'), root, { recursive: true });
  return { root, done: () => rmSync(root, { recursive: true, force: true }) };
}

/** Load one case: the base library at `root` with the case file at its place (folio cases become folio.yaml). */
export function runCase(root: string, name: string): CaseResult {
  const [folder, file] = name.split('/');
  const placed = folder === 'folio' ? 'folio.yaml' : `${folder}/${file}`;
  const original = folder === 'folio' ? readFileSync(join(root, placed)) : undefined;
  cpSync(join(CORPUS, name), join(root, placed));
  try {
    const { diagnostics } = loadLibrary(root);
    const own = diagnostics.filter((d) => d.file === placed);
    return {
      name,
      lines: own.map((d) => formatDiagnostic({ ...d, file: name })),
      others: diagnostics.filter((d) => d.file !== placed),
      errors: own.filter((d) => d.severity === 'error').length,
    };
  } finally {
    if (original) writeFileSync(join(root, placed), original);
    else rmSync(join(root, placed));
  }
}
