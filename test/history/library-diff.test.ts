// diffLibraries on libraries loaded from plain folders: what counts as a change, renamed parts matched by
// file or by content, folio.yaml changes that move every part's figures, and parts not analysed at all.

import { join } from 'node:path';
import { mkdirSync, writeFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { loadLibrary, type Library } from '../../src/model/library.js';
import { diffLibraries } from '../../src/history/library-diff.js';
import { freshFolder, removeTestRepos } from './git-repo.js';
import { FOLIO, capacitor } from './scenario.js';

afterAll(removeTestRepos);

function library(files: Record<string, string>): Library {
  const root = freshFolder('lib');
  for (const [path, text] of Object.entries(files)) {
    mkdirSync(join(root, path, '..'), { recursive: true });
    writeFileSync(join(root, path), text);
  }
  const { library, diagnostics } = loadLibrary(root);
  expect(diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
  return library!;
}

const base = {
  'folio.yaml': FOLIO,
  'parts/a.yaml': capacitor('TA', '1u', '10m', '0.5n'),
  'parts/b.yaml': capacitor('TB', '100n', '20m', '0.3n'),
};

describe('diffLibraries', () => {
  it('finds no change between a library and itself, and analyses nothing', () => {
    const { diff, analyses } = diffLibraries(library(base), library(base));
    expect(diff).toEqual({ settings: [], parts: { added: [], removed: [], renamed: [], changed: [] }, plans: [], comparisons: { added: [], removed: [], changed: [] }, reviews: { added: [], removed: [], changed: [] } });
    expect(analyses.parts.size).toBe(0);
  });

  it('takes a comment-only edit for no change', () => {
    const { diff } = diffLibraries(library(base), library({ ...base, 'parts/a.yaml': `# a new comment\n${base['parts/a.yaml']}` }));
    expect(diff.parts.changed).toEqual([]);
  });

  it('matches a renamed part by its file, and a moved and renamed one by its content', () => {
    const after = library({
      'folio.yaml': FOLIO,
      'parts/a.yaml': capacitor('TA-2', '1u', '10m', '0.5n'),
      'parts/moved/b.yaml': capacitor('TB-2', '100n', '20m', '0.3n'),
    });
    const { diff } = diffLibraries(library(base), after);
    expect(diff.parts).toEqual({
      added: [],
      removed: [],
      renamed: [
        { from: 'TA', to: 'TA-2' },
        { from: 'TB', to: 'TB-2' },
      ],
      changed: [],
    });
  });

  it('reports a renamed part whose values also changed among the changed parts, by its new id, without the id field', () => {
    const after = library({ ...base, 'parts/a.yaml': capacitor('TA-2', '1u', '10m', '0.7n') });
    const { diff } = diffLibraries(library(base), after);
    expect(diff.parts.renamed).toEqual([{ from: 'TA', to: 'TA-2' }]);
    expect(diff.parts.changed.map((c) => [c.id, c.previousId, c.fields.map((f) => f.path)])).toEqual([['TA-2', 'TA', ['parasitics.esl']]]);
  });

  it('re-analyses every part when folio.yaml changes the sweep, and reports those whose figures moved', () => {
    // The usable band of TA starts at the sweep's first point; starting the sweep higher moves that edge.
    const after = library({ ...base, 'folio.yaml': FOLIO.replace('from: 1k', 'from: 10k') });
    const { diff } = diffLibraries(library(base), after);
    expect(diff.settings).toEqual([{ path: 'sweep.from', before: '1k', after: '10k' }]);
    expect(diff.parts.changed.map((c) => [c.id, c.fields, Object.keys(c.figures)])).toEqual([
      ['TA', [], ['bandFromHz', 'effectiveAtBandMiddle']],
      ['TB', [], ['bandFromHz', 'effectiveAtBandMiddle']],
    ]);
    expect(diff.parts.changed[0].figures.bandFromHz).toEqual({ before: 1000, after: 10000, changePercent: 900 });
  });
});
