// Watching a library's inputs (folio.yaml, the YAML files under parts/, comparisons/, plans/, reviews/, and
// the measurement files under measurements/) and the templates, and calling back once per burst of changes.
//
// Each folder gets its own non-recursive fs.watch. Node 20's recursive mode on Linux watches every file
// by its inode, so after an editor saves by writing a new file and renaming it over the old one, later
// edits of that file go unseen; a folder watch sees every name that changes in it. Watching only the
// library's own folders also keeps the output folder, the cache and anything else beside them out.

import { existsSync, readdirSync, statSync, watch, type Dirent, type FSWatcher } from 'node:fs';
import { basename, dirname, join, relative, sep } from 'node:path';

/** Folders of a library whose YAML files are read (see src/model/library.ts). */
export const LIBRARY_FOLDERS = ['parts', 'comparisons', 'plans', 'reviews', 'measurements'] as const;
/** The folder whose files count whatever their name (Touchstone files, not YAML). */
const DATA_FOLDER = 'measurements';
export const FOLIO_FILE = 'folio.yaml';
/** Editors write a file in several steps; wait this long after the last event before acting. */
export const DEFAULT_DEBOUNCE_MS = 150;

export interface WatchOptions {
  libraryRoot: string;
  /** A folder all of whose files count as inputs (the package's templates/). */
  templatesDir?: string;
  /** Folders whose changes never count (the output and cache folders, if they sit inside a watched one). */
  ignore?: string[];
  debounceMs?: number;
  /** Once per burst: the changed inputs, library-relative (templates as templates/...), sorted. */
  onChange(changed: string[]): void;
  /** A folder that could not be watched (for example when the system's watch limit is reached). */
  onError?(error: Error): void;
}

export interface LibraryWatcher {
  /** The folders being watched, sorted (for tests and messages). */
  folders(): string[];
  close(): void;
}

const YAML_FILE = /\.ya?ml$/i;

/**
 * Files editors leave beside the one being edited: hidden files (vim's .x.swp, emacs's .#x, most temp
 * files), backups ending in ~, emacs's #x#, vim's write test 4913, and common temp suffixes.
 */
export function isEditorLeftover(name: string): boolean {
  return name.startsWith('.') || name.endsWith('~') || /^#.*#$/.test(name) || name === '4913' || /\.(sw[a-p]|swx|tmp|crswap)$|___jb_(tmp|old)___$/i.test(name);
}

/** Whether a library-relative path (forward slashes) is a file the library loader reads. */
export function isLibraryInput(path: string): boolean {
  if (path === FOLIO_FILE) return true;
  const segments = path.split('/');
  if (segments.length < 2 || !(LIBRARY_FOLDERS as readonly string[]).includes(segments[0])) return false;
  // The loader skips hidden files and folders at any depth.
  return (segments[0] === DATA_FOLDER || YAML_FILE.test(segments[segments.length - 1])) && !segments.some((s) => isEditorLeftover(s));
}

const isDirectory = (path: string) => {
  try {
    return statSync(path).isDirectory();
  } catch {
    return false;
  }
};

const within = (folder: string, path: string) => path === folder || path.startsWith(folder + sep);

export function watchLibrary(options: WatchOptions): LibraryWatcher {
  const root = options.libraryRoot;
  const templates = options.templatesDir;
  const ignore = options.ignore ?? [];
  const debounceMs = options.debounceMs ?? DEFAULT_DEBOUNCE_MS;
  const watchers = new Map<string, FSWatcher>();
  const changed = new Set<string>();
  let timer: NodeJS.Timeout | undefined;
  let closed = false;

  const label = (path: string) => {
    const base = templates && within(templates, path) ? dirname(templates) : root;
    return relative(base, path).split(sep).join('/');
  };
  const ignored = (path: string) => ignore.some((folder) => within(folder, path));
  const counts = (path: string) => {
    if (templates && within(templates, path)) return !relative(templates, path).split(sep).some(isEditorLeftover);
    return isLibraryInput(label(path));
  };

  const note = (path: string) => {
    changed.add(label(path));
    clearTimeout(timer);
    timer = setTimeout(() => {
      const list = [...changed].sort();
      changed.clear();
      if (!closed) options.onChange(list);
    }, debounceMs);
  };

  const unwatchTree = (folder: string) => {
    for (const [path, watcher] of watchers) {
      if (within(folder, path)) {
        watcher.close();
        watchers.delete(path);
      }
    }
  };

  /** Watch `folder` and every folder under it that the loader (or eleventy) would read. */
  const watchTree = (folder: string) => {
    if (closed || watchers.has(folder) || ignored(folder)) return;
    let watcher: FSWatcher;
    try {
      watcher = watch(folder, { persistent: true }, (_event, name) => onEvent(folder, name));
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'ENOENT') options.onError?.(error as Error);
      return;
    }
    watcher.on('error', () => {
      // The folder went away; its parent's watcher reports that as a change.
      unwatchTree(folder);
    });
    watchers.set(folder, watcher);
    if (folder === root) return;
    let entries: Dirent[] = [];
    try {
      entries = readdirSync(folder, { withFileTypes: true });
    } catch {
      return;
    }
    for (const entry of entries) {
      if (entry.isDirectory() && !isEditorLeftover(entry.name)) watchTree(join(folder, entry.name));
    }
  };

  const onEvent = (folder: string, name: string | Buffer | null) => {
    if (closed) return;
    if (!existsSync(folder)) {
      unwatchTree(folder);
      if (folder !== root) note(folder);
      return;
    }
    if (name === null) return;
    const entry = String(name);
    const path = join(folder, entry);
    if (ignored(path) || isEditorLeftover(entry)) return;
    if (folder === root && entry !== FOLIO_FILE && !(LIBRARY_FOLDERS as readonly string[]).includes(entry)) return;
    if (isDirectory(path)) {
      // A folder created, or moved in: its files are new inputs.
      if (!watchers.has(path)) {
        watchTree(path);
        note(path);
      }
      return;
    }
    if (watchers.has(path)) {
      // A watched folder was removed or moved away.
      unwatchTree(path);
      note(path);
      return;
    }
    if (counts(path)) note(path);
  };

  watchTree(root);
  for (const folder of LIBRARY_FOLDERS) {
    if (isDirectory(join(root, folder))) watchTree(join(root, folder));
  }
  if (templates && isDirectory(templates)) watchTree(templates);

  return {
    folders: () => [...watchers.keys()].sort(),
    close() {
      closed = true;
      clearTimeout(timer);
      for (const watcher of watchers.values()) watcher.close();
      watchers.clear();
    },
  };
}
