// Watching a library: which files count, one call per burst, and the cases editors and git produce
// (save by rename, new and removed folders). No blind sleeps: each step writes, then waits for the call
// it expects; a "sentinel" write after ignored ones proves nothing was reported in between, because a
// folder's events arrive in order.

import { mkdirSync, mkdtempSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { isEditorLeftover, isLibraryInput, watchLibrary, type LibraryWatcher } from '../../src/serve/watch.js';

describe('isLibraryInput', () => {
  it('counts folio.yaml and YAML files at any depth under the four library folders', () => {
    for (const path of ['folio.yaml', 'parts/a.yaml', 'parts/caps/b.yml', 'comparisons/c.yaml', 'plans/p.YAML', 'reviews/r.yaml']) {
      expect(isLibraryInput(path), path).toBe(true);
    }
  });

  it('counts every file under measurements/, whatever its name (Touchstone files)', () => {
    for (const path of ['measurements/a.s2p', 'measurements/bench/b.s1p', 'measurements/c.ts']) expect(isLibraryInput(path), path).toBe(true);
  });

  it('ignores other files, other folders, hidden files and editor leftovers', () => {
    for (const path of ['other.yaml', 'parts', 'parts/notes.txt', '_site/parts/a.yaml', '.zfolio-cache/x.yaml', 'parts/.a.yaml', 'parts/.a.yaml.swp', 'parts/a.yaml~', 'parts/.hidden/a.yaml', 'templates/part.njk', 'measurements/.a.s2p', 'measurements/a.s2p~', 'measured/a.s2p']) {
      expect(isLibraryInput(path), path).toBe(false);
    }
  });
});

describe('isEditorLeftover', () => {
  it('knows the usual swap, backup and temp names', () => {
    for (const name of ['.a.yaml.swp', '.a.yaml.swx', 'a.yaml~', '#a.yaml#', '.#a.yaml', '4913', 'a.yaml.tmp', 'a.yaml___jb_tmp___']) {
      expect(isEditorLeftover(name), name).toBe(true);
    }
    for (const name of ['a.yaml', 'part.njk', 'folio.css', 'swp.yaml']) expect(isEditorLeftover(name), name).toBe(false);
  });
});

describe('watchLibrary', () => {
  let tmp: string;
  let lib: string;
  let templates: string;
  let watcher: LibraryWatcher;
  const calls: string[][] = [];

  /** Wait (up to 10 s) until the calls number `count`, and return the last. */
  const callNumber = async (count: number) => {
    await vi.waitFor(() => expect(calls.length).toBeGreaterThanOrEqual(count), { timeout: 10_000, interval: 20 });
    expect(calls.length).toBe(count);
    return calls[count - 1];
  };

  beforeAll(() => {
    tmp = mkdtempSync(join(tmpdir(), 'zfolio-watch-'));
    lib = join(tmp, 'lib');
    templates = join(tmp, 'templates');
    for (const folder of ['parts/caps', 'parts/_out', 'comparisons', '_site/parts', '.zfolio-cache']) mkdirSync(join(lib, folder), { recursive: true });
    mkdirSync(templates);
    writeFileSync(join(lib, 'folio.yaml'), 'title: t\n');
    writeFileSync(join(lib, 'parts', 'a.yaml'), 'id: A\n');
    writeFileSync(join(lib, 'parts', 'caps', 'b.yaml'), 'id: B\n');
    writeFileSync(join(templates, 'part.njk'), '{{ x }}\n');
    watcher = watchLibrary({ libraryRoot: lib, templatesDir: templates, ignore: [join(lib, 'parts', '_out')], debounceMs: 100, onChange: (changed) => calls.push(changed) });
  });

  afterAll(() => {
    watcher?.close();
    rmSync(tmp, { recursive: true, force: true });
  });

  it('watches the root, the library folders that exist, and the templates, but not the output or cache', () => {
    expect(watcher.folders()).toEqual([lib, join(lib, 'comparisons'), join(lib, 'parts'), join(lib, 'parts', 'caps'), templates].sort());
  });

  it('reports a burst of writes to one file as one call', async () => {
    for (let i = 0; i < 5; i++) writeFileSync(join(lib, 'parts', 'a.yaml'), `id: A\ntitle: ${i}\n`);
    expect(await callNumber(1)).toEqual(['parts/a.yaml']);
  });

  it('ignores the output and cache folders, editor leftovers and files the loader does not read', async () => {
    writeFileSync(join(lib, '_site', 'parts', 'x.html'), 'x');
    writeFileSync(join(lib, '.zfolio-cache', 'c.json'), '{}');
    writeFileSync(join(lib, 'parts', '_out', 'z.yaml'), 'id: Z\n');
    writeFileSync(join(lib, 'parts', '.a.yaml.swp'), 'swap');
    writeFileSync(join(lib, 'parts', 'a.yaml~'), 'backup');
    writeFileSync(join(lib, 'parts', 'notes.txt'), 'notes');
    writeFileSync(join(lib, 'other.yaml'), 'x: 1\n');
    writeFileSync(join(lib, 'comparisons', 'sentinel.yaml'), 'title: s\n');
    expect(await callNumber(2)).toEqual(['comparisons/sentinel.yaml']);
  });

  it('still sees a file after an editor saves it by renaming a new file over it, and edits after that', async () => {
    writeFileSync(join(lib, 'parts', 'caps', '.b.yaml.tmp'), 'id: B\ntitle: saved\n');
    renameSync(join(lib, 'parts', 'caps', '.b.yaml.tmp'), join(lib, 'parts', 'caps', 'b.yaml'));
    expect(await callNumber(3)).toEqual(['parts/caps/b.yaml']);
    writeFileSync(join(lib, 'parts', 'caps', 'b.yaml'), 'id: B\ntitle: edited in place\n');
    expect(await callNumber(4)).toEqual(['parts/caps/b.yaml']);
  });

  it('reports folio.yaml and template changes, templates under templates/', async () => {
    writeFileSync(join(lib, 'folio.yaml'), 'title: u\n');
    expect(await callNumber(5)).toEqual(['folio.yaml']);
    writeFileSync(join(templates, 'part.njk'), '{{ y }}\n');
    expect(await callNumber(6)).toEqual(['templates/part.njk']);
  });

  it('picks up a library folder created after the start, and files in it', async () => {
    mkdirSync(join(lib, 'plans'));
    expect(await callNumber(7)).toEqual(['plans']);
    writeFileSync(join(lib, 'plans', 'rail.yaml'), 'rail: R\n');
    expect(await callNumber(8)).toEqual(['plans/rail.yaml']);
    mkdirSync(join(lib, 'parts', 'new'));
    expect(await callNumber(9)).toEqual(['parts/new']);
    writeFileSync(join(lib, 'parts', 'new', 'c.yaml'), 'id: C\n');
    expect(await callNumber(10)).toEqual(['parts/new/c.yaml']);
  });

  it('reports a removed folder of parts and stops watching it', async () => {
    rmSync(join(lib, 'parts', 'caps'), { recursive: true });
    const changed = await callNumber(11);
    expect(changed).toContain('parts/caps');
    expect(watcher.folders()).not.toContain(join(lib, 'parts', 'caps'));
  });

  it('reports a removed file', async () => {
    rmSync(join(lib, 'parts', 'a.yaml'));
    expect(await callNumber(12)).toEqual(['parts/a.yaml']);
  });

  it('lets go of every folder when closed', () => {
    const other = watchLibrary({ libraryRoot: lib, onChange: () => {} });
    expect(other.folders().length).toBeGreaterThan(0);
    other.close();
    expect(other.folders()).toEqual([]);
  });
});
