// The README's worked example of `zfolio diff`, run on a copy of the demo library in a temporary git
// repository: the same edits, the same lines (the commit hash aside, which depends on the copy).

import { cpSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { run } from './fake-io.js';
import { makeRepo, removeTestRepos, useGitEnv } from '../history/git-repo.js';

const DEMO = fileURLToPath(new URL('../../', import.meta.url));
let restore: () => void;

beforeAll(() => {
  restore = useGitEnv();
});
afterAll(() => {
  restore();
  removeTestRepos();
});

/** The console block of the README that runs `command`: the commands before it and the lines it prints. */
function readmeExample(command: string): { steps: string[]; output: string[] } {
  const readme = readFileSync(join(DEMO, 'README.md'), 'utf8');
  const block = readme.split('```console\n').find((b) => b.includes(`$ ${command}\n`));
  if (!block) throw new Error(`no README example runs ${command}`);
  const lines = block.slice(0, block.indexOf('```')).trimEnd().split('\n');
  const at = lines.indexOf(`$ ${command}`);
  return { steps: lines.slice(0, at).map((l) => l.slice(2)), output: lines.slice(at + 1) };
}

const hashless = (line: string) => line.replace(/\([0-9a-f]{12}\)/g, '(HASH)');

it('the README example of zfolio diff prints what the README says', async () => {
  const repo = makeRepo('readme');
  for (const name of ['folio.yaml', 'parts', 'plans', 'comparisons', 'reviews', 'measurements']) cpSync(join(DEMO, name), join(repo.dir, name), { recursive: true });
  repo.commit('the demo library');
  const { steps, output } = readmeExample('npx zfolio diff signed-2026-03');
  expect(steps[0]).toBe('git tag signed-2026-03');
  repo.git('tag', 'signed-2026-03');
  // The edits, as the README's sed lines write them: s/OLD/NEW/ on one file.
  for (const step of steps.slice(1)) {
    const edit = /^sed -i 's\/(.*)\/(.*)\/' (\S+)$/.exec(step);
    expect(edit, step).not.toBeNull();
    const [, from, to, file] = edit!;
    const text = readFileSync(join(repo.dir, file), 'utf8');
    expect(text).toContain(from);
    writeFileSync(join(repo.dir, file), text.replace(from, to));
  }
  const r = await run(['diff', 'signed-2026-03', '--library', repo.dir], '/');
  expect(r.err).toBe('');
  expect(r.code).toBe(0);
  expect(r.out.trimEnd().split('\n').map(hashless)).toEqual(output.map(hashless));
});
