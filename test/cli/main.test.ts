// Dispatch, help and exit codes of the zfolio command line (0 ok, 1 bad input, 2 misuse), run in-process.

import { readFileSync } from 'node:fs';
import { afterEach, describe, expect, it } from 'vitest';
import { COMMANDS, mainHelp } from '../../src/cli/main.js';
import { FailedAfterSwap } from '../../src/build/output-guard.js';
import { GOOD_LIBRARY, run } from './fake-io.js';

describe('zfolio', () => {
  it('with no command prints the overview on stderr and exits 2', async () => {
    const r = await run([]);
    expect(r.code).toBe(2);
    expect(r.out).toBe('');
    expect(r.err).toContain('Usage: zfolio COMMAND [options]');
  });

  it('--help lists every command and exits 0', async () => {
    const r = await run(['--help']);
    expect(r.code).toBe(0);
    expect(r.err).toBe('');
    for (const name of ['check', 'figures', 'sweep']) expect(r.out).toMatch(new RegExp(`^  ${name} +\\S`, 'm'));
  });

  it('--version prints the version from package.json', async () => {
    const { version } = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string };
    expect(await run(['--version'])).toEqual({ code: 0, out: `zfolio ${version}\n`, err: '' });
  });

  it('a command named like a property every object has is unknown, not a crash', async () => {
    for (const name of ['constructor', '__proto__', 'toString', 'hasOwnProperty']) {
      const r = await run([name]);
      expect(r.code).toBe(2);
      expect(r.err).toMatch(new RegExp(`^zfolio: unknown command "${name}"; expected one of check`));
    }
    const help = await run(['help', 'constructor']);
    expect(help.code).toBe(0);
    expect(help.out).toMatch(/^zfolio \S+: /);
  });

  it('--from and --to outside the frequencies zfolio computes with, or ambiguous, are misuse (2)', async () => {
    const low = await run(['figures', '--from', '1e-300']);
    expect(low.code).toBe(2);
    expect(low.err.split('\n')[0]).toBe('zfolio figures: --from: expected a frequency from 1 mHz to 1 THz, found "1e-300"');
    const mhz = await run(['figures', '--to', '100mhz']);
    expect(mhz.code).toBe(2);
    expect(mhz.err.split('\n')[0]).toBe('zfolio figures: --to: expected a frequency in Hz (e.g. 10M or 10 MHz), found "100mhz": MHz or mHz? write 100M or 100 MHz for megahertz, or 100 mHz if millihertz is meant');
  });

  it('an unknown command exits 2 and names the commands there are', async () => {
    const r = await run(['chek']);
    expect(r.code).toBe(2);
    expect(r.out).toBe('');
    expect(r.err).toMatch(/^zfolio: unknown command "chek"; expected one of check, figures, sweep\b/);
  });

  it('an unknown option exits 2 and lists the options the command takes', async () => {
    const r = await run(['check', '--bogus']);
    expect(r).toEqual({
      code: 2,
      out: '',
      err: 'zfolio check: unknown option "--bogus" (this command takes --library, --help)\nRun "zfolio check --help" for usage.\n',
    });
  });

  it('a misspelt option gets a "did you mean"', async () => {
    const r = await run(['figures', '--jsn']);
    expect(r.code).toBe(2);
    expect(r.err.split('\n')[0]).toBe('zfolio figures: unknown option "--jsn"; did you mean --json? (this command takes --library, --help, --from, --to, --per-decade, --json)');
  });

  it('a library folder that does not exist is misuse (2)', async () => {
    const r = await run(['check', '--library', 'no-such-folder']);
    expect(r.code).toBe(2);
    expect(r.err).toContain('library folder not found:');
    expect(r.err).toContain('no-such-folder');
  });

  describe.each(['check', 'figures', 'sweep'])('%s --help', (name) => {
    it('prints the usage of the command on stdout and exits 0', async () => {
      const r = await run([name, '--help']);
      expect(r).toEqual({ code: 0, out: (await COMMANDS[name].load()).help, err: '' });
      expect(r.out.startsWith(`Usage: zfolio ${name}`)).toBe(true);
      expect(r.out).toContain('--library DIR');
    });

    it('is also reachable as "zfolio help COMMAND"', async () => {
      expect((await run(['help', name])).out).toBe((await COMMANDS[name].load()).help);
    });
  });

  it('every help text fits a terminal of 80 columns (its default width, common practice)', async () => {
    const wide: string[] = [];
    const texts = [mainHelp(), ...(await Promise.all(Object.values(COMMANDS).map(async (c) => (await c.load()).help)))];
    // Columns counted as characters: every character of the help is one column wide (no tab, no CJK).
    for (const text of texts) for (const line of text.split('\n')) if ([...line].length > 80) wide.push(line);
    expect(texts).toHaveLength(Object.keys(COMMANDS).length + 1);
    expect(texts.join('')).not.toMatch(/\t/);
    expect(wide).toEqual([]);
  });

  it('the fixture library is where commands look by default (the current folder)', async () => {
    expect((await run(['check'], GOOD_LIBRARY)).code).toBe(0);
  });
});

describe('a failure no command expected', () => {
  const failing = (error: unknown) => {
    COMMANDS.failing = { load: async () => ({ run: () => Promise.reject(error), help: '' }), summary: '' };
  };
  afterEach(() => {
    delete COMMANDS.failing;
  });

  it('is one line and exit 1, never a stack trace', async () => {
    failing(new TypeError('cannot read properties of undefined\n    at somewhere (file.js:1:1)'));
    const r = await run(['failing']);
    expect(r).toEqual({ code: 1, out: '', err: 'zfolio failing: internal error: cannot read properties of undefined (set ZFOLIO_DEBUG=1 for details)\n' });
  });

  it('names the file and the system error in words', async () => {
    failing(Object.assign(new Error('ENOSPC: no space left on device, write'), { code: 'ENOSPC', syscall: 'write', path: '/tmp/x/_site/index.html' }));
    expect((await run(['failing'])).err).toBe('zfolio failing: cannot write /tmp/x/_site/index.html: no space left on the device (ENOSPC)\n');
  });

  it('after a build put its new site in place, says what failed and then that the site is the new one', async () => {
    const disk = Object.assign(new Error('ENOSPC: no space left on device, write'), { code: 'ENOSPC', syscall: 'write', path: '/tmp/x/.zfolio-cache/builds/a/root.json' });
    failing(new FailedAfterSwap('/tmp/x/_site', disk));
    const r = await run(['failing']);
    expect(r.code).toBe(1);
    expect(r.err).toBe(
      'zfolio failing: cannot write /tmp/x/.zfolio-cache/builds/a/root.json: no space left on the device (ENOSPC)\n' +
        'zfolio failing: the new site is in place at /tmp/x/_site all the same; the next build may make more of it again\n',
    );
  });

  it('shows the stack under ZFOLIO_DEBUG', async () => {
    failing(new Error('kaput'));
    const r = await run(['failing'], GOOD_LIBRARY, { ZFOLIO_DEBUG: '1' });
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/^zfolio failing: internal error: kaput \(set ZFOLIO_DEBUG=1 for details\)\nError: kaput\n\s+at /);
  });

  it('cuts a very long message', async () => {
    failing(new Error('x'.repeat(100_000)));
    const r = await run(['failing']);
    expect(r.err.length).toBeLessThan(300);
    expect(r.err.split('\n')).toHaveLength(2);
  });
});
