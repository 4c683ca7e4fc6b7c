// An invented library in three states for the history tests (made-up values typical of the kind, common
// practice; no real product): the library lives in lib/ of a repository, so the tests also cover a library
// below the repository's top.

import { makeRepo, type TestRepo } from './git-repo.js';

export const FOLIO = `title: History test library (invented)
sweep: {from: 1k, to: 1G, per-decade: 50}
`;

export function capacitor(id: string, nominal: string, esr: string, esl: string, title = `${nominal} test capacitor`): string {
  return `# Invented part for the history tests.
id: ${id}
kind: capacitor
title: ${title}
nominal: ${nominal}
voltage: 16V
parasitics: {esr: ${esr}, esl: ${esl}}
`;
}

export function rail(count100n: number): string {
  return `# Invented rail for the history tests.
rail: VDD_T
voltage: 1.0V
target: 25m
band: {from: 1M, to: 100M}
mounting: 0.2nH
capacitors:
  - {part: TC-1U, count: 6}
  - {part: TC-100N, count: ${count100n}}
`;
}

export const COMPARISON = (title: string) => `title: ${title}
parts: [TC-1U, TC-100N]
`;

export const REVIEW = (title: string) => `title: ${title}
date: 2026-01-10
board: Test board (invented)
reviewers: [{name: A. Person}]
covers: {plans: [VDD_T]}
decisions: [Measure the rail.]
`;

/** Revision one: tag v1. */
export function writeRevisionOne(repo: TestRepo): void {
  repo.write('README.txt', 'a repository holding a library in lib/\n');
  repo.write('lib/folio.yaml', FOLIO);
  repo.write('lib/parts/c-1u.yaml', capacitor('TC-1U', '1u', '8m', '0.5n'));
  repo.write('lib/parts/c-100n.yaml', capacitor('TC-100N', '100n', '20m', '0.3n'));
  repo.write('lib/parts/c-10n.yaml', capacitor('TC-10N', '10n', '40m', '0.25n'));
  repo.write('lib/parts/c-old.yaml', capacitor('TC-OLD', '4.7u', '6m', '0.8n'));
  repo.write('lib/parts/c-name.yaml', capacitor('TC-NAME-A', '470n', '12m', '0.4n'));
  repo.write('lib/plans/rail.yaml', rail(10));
  repo.write('lib/comparisons/pair.yaml', COMPARISON('1 µF and 100 nF'));
  repo.write('lib/reviews/first.yaml', REVIEW('First review'));
}

/** Revision two: TC-100N's ESL up, TC-OLD removed, TC-NAME-A renamed TC-NAME-B, TC-NEW added, fewer 100 nF on the rail. */
export function writeRevisionTwo(repo: TestRepo): void {
  repo.write('lib/parts/c-100n.yaml', capacitor('TC-100N', '100n', '20m', '0.6n'));
  repo.remove('lib/parts/c-old.yaml');
  repo.write('lib/parts/c-name.yaml', capacitor('TC-NAME-B', '470n', '12m', '0.4n'));
  repo.write('lib/parts/c-new.yaml', capacitor('TC-NEW', '2.2u', '7m', '0.45n'));
  repo.write('lib/plans/rail.yaml', rail(4));
  repo.write('lib/comparisons/pair.yaml', COMPARISON('1 µF against 100 nF'));
  repo.write('lib/reviews/second.yaml', REVIEW('Second review'));
}

/** Uncommitted edits: TC-10N's ESR changed, a new untracked part. */
export function writeWorkTreeEdits(repo: TestRepo): void {
  repo.write('lib/parts/c-10n.yaml', capacitor('TC-10N', '10n', '60m', '0.25n'));
  repo.write('lib/parts/c-wt.yaml', capacitor('TC-WT', '22n', '30m', '0.3n'));
}

/** A new repository holding revision one, committed and tagged v1, and revision two written but not committed. */
export function scenarioAtRevisionTwo(name: string): TestRepo {
  const repo = makeRepo(name);
  writeRevisionOne(repo);
  repo.commit('revision one');
  repo.git('tag', 'v1');
  writeRevisionTwo(repo);
  return repo;
}
