// Review files: what they cover must exist, dates are ISO 8601, and every problem has its file:line:col.

import { cpSync, mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { formatDiagnostic } from '../../src/model/diagnostics.js';
import { loadLibrary } from '../../src/model/library.js';
import { REPO, tempDir } from '../site-helpers.js';

/** The rail fixture library plus one comparison and the given review file. */
function libraryWithReview(review: string) {
  const root = tempDir('review');
  cpSync(join(REPO, 'test/fixtures/rail-library'), root, { recursive: true });
  mkdirSync(join(root, 'comparisons'));
  writeFileSync(join(root, 'comparisons', 'small-caps.yaml'), 'title: Small ceramics\nparts: [RT-C-100N, RT-C-10N]\n');
  mkdirSync(join(root, 'reviews'));
  writeFileSync(join(root, 'reviews', 'r.yaml'), review);
  return loadLibrary(root);
}

const GOOD = `title: Test board power review
date: 2026-11-24
board: Test board rev A
reviewers: [{name: Ada Invented, role: power}, Bo Madeup]
covers:
  plans: [VDD_TEST]
  comparisons: [small-caps]
  parts: [RT-C-100N, RT-L-1U]
decisions: [Keep the core rail as placed.]
open-points:
  - {text: Measure the rail, owner: Bo Madeup, due: 2026-12-10}
  - Check the bead
`;

describe('a review file', () => {
  it('resolves its plans, comparisons and parts', () => {
    const { library, diagnostics } = libraryWithReview(GOOD);
    expect(diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
    const [review] = library!.reviews;
    expect(review.plans.map((p) => p.rail)).toEqual(['VDD_TEST']);
    expect(review.comparisons.map((c) => c.title)).toEqual(['Small ceramics']);
    expect(review.parts.map((p) => p.id)).toEqual(['RT-C-100N', 'RT-L-1U']);
    expect(review.reviewers).toEqual([{ name: 'Ada Invented', role: 'power' }, { name: 'Bo Madeup' }]);
    expect(review.openPoints).toEqual([{ text: 'Measure the rail', owner: 'Bo Madeup', due: '2026-12-10' }, { text: 'Check the bead' }]);
  });

  it('naming an unknown part fails with the review file\'s line and column', () => {
    const { library, diagnostics } = libraryWithReview(GOOD.replace('parts: [RT-C-100N, RT-L-1U]', 'parts: [RT-C-100N, RT-L-1X]'));
    expect(library).toBeUndefined();
    expect(diagnostics.map(formatDiagnostic)).toContain('reviews/r.yaml:8:22: covers.parts: no part with id "RT-L-1X" in the library; did you mean "RT-L-1U"?');
  });

  it('naming an unknown plan or comparison fails likewise', () => {
    const { diagnostics } = libraryWithReview(GOOD.replace('plans: [VDD_TEST]', 'plans: [VDD_TSET]').replace('comparisons: [small-caps]', 'comparisons: [big-caps]'));
    const lines = diagnostics.map(formatDiagnostic);
    expect(lines).toContain('reviews/r.yaml:6:11: covers.plans: no rail plan "VDD_TSET" in the library; did you mean "VDD_TEST"?');
    expect(lines.some((l) => l.startsWith('reviews/r.yaml:7:17: covers.comparisons: no comparison file "big-caps"'))).toBe(true);
  });

  it('may name the revision of the previous review, and says where; a name that cannot be a revision is refused at its place', () => {
    const { library } = libraryWithReview(`${GOOD}since: review-2026-03\n`);
    const [review] = library!.reviews;
    expect(review.since).toBe('review-2026-03');
    expect(review.sinceAt).toEqual({ file: 'reviews/r.yaml', line: 13, column: 8 });
    expect(libraryWithReview(GOOD).library!.reviews[0].since).toBeUndefined();
    const { diagnostics } = libraryWithReview(`${GOOD}since: --all\n`);
    expect(diagnostics.map(formatDiagnostic)).toContain('reviews/r.yaml:13:8: since: expected a git revision such as v1.2, a branch, HEAD~3 or a commit hash, found "--all"');
  });

  it('wants an ISO date and something to cover', () => {
    const { diagnostics } = libraryWithReview('title: T\ndate: 24.11.2026\nboard: B\ncovers: {}\n');
    const lines = diagnostics.map(formatDiagnostic);
    expect(lines).toContain('reviews/r.yaml:2:7: date: expected a date written YYYY-MM-DD, found "24.11.2026"');
    expect(lines.some((l) => l.startsWith('reviews/r.yaml:4:9:') && l.includes('at least one part, comparison or rail plan'))).toBe(true);
  });

  it('reports unknown fields with a suggestion', () => {
    const { diagnostics } = libraryWithReview(GOOD.replace('decisions:', 'decision:'));
    expect(diagnostics.map(formatDiagnostic)).toContain('reviews/r.yaml:9:1: unknown field "decision"; did you mean "decisions"?');
  });
});
