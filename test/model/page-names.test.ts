// Page folders: safe characters, short whatever the name, the same from build to build, and distinct for
// distinct long names (a hash of the whole name ends a cut one).

import { describe, expect, it } from 'vitest';
import { MAX_PAGE_NAME, fileStem, pageName } from '../../src/model/page-names.js';

describe('page names', () => {
  it('keep a short safe name as it is and turn unsafe runs into "-"', () => {
    expect(pageName('VDD_CORE')).toBe('VDD_CORE');
    expect(pageName('a b')).toBe('a-b');
    expect(pageName('sub/a:b?')).toBe('sub-a-b-');
  });

  it('cut a long name to MAX_PAGE_NAME characters ending in a hash: deterministic and distinct', () => {
    const a = pageName('R'.repeat(300));
    const b = pageName(`${'R'.repeat(299)}S`);
    expect(a.length).toBe(MAX_PAGE_NAME);
    expect(b.length).toBe(MAX_PAGE_NAME);
    expect(a).toBe(pageName('R'.repeat(300)));
    expect(a).not.toBe(b);
    expect(a).toMatch(/^R+-[0-9a-f]{16}$/);
  });

  it('never give "." or ".." or an empty name, which are no folders of their own', () => {
    for (const name of ['.', '..', '']) expect(pageName(name)).toMatch(/^\.*-[0-9a-f]{8}$/);
  });

  it('take a file stem under its folder, either extension', () => {
    expect(fileStem('reviews/dl3.yaml', 'reviews')).toBe('dl3');
    expect(fileStem('comparisons/sub/x.YML', 'comparisons')).toBe('sub/x');
  });
});
