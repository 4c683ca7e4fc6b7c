// When a build prunes the chart cache. Pruning keeps only the entries the build used, so a build that prunes
// keys every part and comparison it carries over and lists the cache folder: at 10,000 parts, 10,000 part
// keys, 900 comparison keys and a listing of 11,000 entries, which a rebuild after one edit otherwise does not
// need. Such a rebuild writes a handful of entries (the edited part's charts, its family's comparison) and
// leaves as many stale. The ledger, a small file in the cache folder, counts the entries written since the last
// pruning; a build prunes when they reach a PRUNE_SHARE-th of the entries that pruning kept, and at least
// MIN_WRITTEN, so the stale entries stay under about that share of the cache. A ledger that is missing or
// unreadable makes the build prune (and write one).

import { readdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { writeAtomically } from '../model/atomic-file.js';
import { CACHE_ENTRY_EXTENSION } from './chart-cache-entry.js';

/** The ledger's name in the cache folder; pruning leaves it there. */
export const LEDGER_FILE = 'ledger.json';

/** Prune once the entries written since the last pruning reach this fraction of those it kept… */
export const PRUNE_SHARE = 32;
/** …and at least this many. */
export const MIN_WRITTEN = 32;

interface Ledger {
  format: 1;
  /** Entries the last pruning kept. */
  held: number;
  /** Entries written since. */
  written: number;
}

function readLedger(dir: string): Ledger | undefined {
  try {
    const ledger = JSON.parse(readFileSync(join(dir, LEDGER_FILE), 'utf8')) as Partial<Ledger> | null;
    const count = (n: unknown) => typeof n === 'number' && Number.isInteger(n) && n >= 0;
    return ledger?.format === 1 && count(ledger.held) && count(ledger.written) ? (ledger as Ledger) : undefined;
  } catch {
    return undefined;
  }
}

function writeLedger(dir: string, ledger: Ledger): void {
  try {
    writeAtomically(join(dir, LEDGER_FILE), `${JSON.stringify(ledger)}\n`);
  } catch {
    // Not written: the next build prunes.
  }
}

/** Whether a build with this cache folder prunes it: its ledger missing, unreadable or due. */
export function pruneDue(dir: string): boolean {
  const ledger = readLedger(dir);
  return !ledger || ledger.written >= Math.max(MIN_WRITTEN, ledger.held / PRUNE_SHARE);
}

/**
 * Remove every file of the cache folder but the entries named by `used` (keys) and the ledger: entries of
 * another format or name, and any left in part, go too. With `ledger`, a ledger of what is kept is written.
 */
export function pruneCache(dir: string, used: ReadonlySet<string>, ledger: boolean): void {
  let held = 0;
  for (const name of readdirSync(dir)) {
    if (name === LEDGER_FILE) continue;
    if (name.endsWith(CACHE_ENTRY_EXTENSION) && used.has(name.slice(0, -CACHE_ENTRY_EXTENSION.length))) held++;
    else rmSync(join(dir, name), { force: true });
  }
  if (ledger) writeLedger(dir, { format: 1, held, written: 0 });
}

/** Count `written` more entries in the ledger (read again: another build may have counted since). */
export function countWritten(dir: string, written: number): void {
  const ledger = readLedger(dir);
  // Without a ledger the next build prunes anyway.
  if (ledger && written > 0) writeLedger(dir, { ...ledger, written: ledger.written + written });
}
