// Finding and starting the system's Chromium for PDFs. zfolio never downloads a browser.

import { existsSync } from 'node:fs';
import puppeteer, { type Browser, type BrowserContext } from 'puppeteer-core';
import { untilDone } from '../on-exit.js';

export const CHROME_ENV = 'ZFOLIO_CHROME';

/** Where a Chromium-family browser usually lives, most likely first. */
const USUAL_PATHS = [
  '/usr/bin/chromium',
  '/usr/bin/chromium-browser',
  '/snap/bin/chromium',
  '/usr/bin/google-chrome-stable',
  '/usr/bin/google-chrome',
  '/Applications/Chromium.app/Contents/MacOS/Chromium',
  '/Applications/Google Chrome.app/Contents/MacOS/Google Chrome',
  'C:\\Program Files\\Google\\Chrome\\Application\\chrome.exe',
  'C:\\Program Files (x86)\\Google\\Chrome\\Application\\chrome.exe',
];

export type BrowserLookup = { path: string } | { problem: string };

/** --chrome PATH first, then $ZFOLIO_CHROME, then the usual install paths. */
export function findChrome(explicit: string | undefined, env: Readonly<Record<string, string | undefined>>): BrowserLookup {
  if (explicit) return existsSync(explicit) ? { path: explicit } : { problem: `--chrome ${explicit}: no such file` };
  const fromEnv = env[CHROME_ENV];
  if (fromEnv) return existsSync(fromEnv) ? { path: fromEnv } : { problem: `${CHROME_ENV}=${fromEnv}: no such file` };
  const found = USUAL_PATHS.find((p) => existsSync(p));
  return found ? { path: found } : { problem: 'no Chromium found' };
}

/** One line that tells the user how to get PDFs. */
export function chromeHint(problem: string): string {
  return `PDFs need Chromium (${problem}): install it (Debian/Ubuntu: sudo apt-get install chromium) or give its path with --chrome PATH or ${CHROME_ENV}=PATH.`;
}

// Flags for a quiet, offline, headless run: no sandbox when run as root in CI containers, and no
// background requests (updates, sync, metrics), which a closed network would refuse anyway.
const FLAGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-dev-shm-usage',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--disable-default-apps',
  '--disable-extensions',
  '--no-first-run',
  '--no-default-browser-check',
  '--metrics-recording-only',
  '--mute-audio',
  '--font-render-hinting=none',
];

/** What printing needs of a browser: new tabs. A Browser, or a context of one (a browser the caller runs). */
export type PrintBrowser = Pick<Browser | BrowserContext, 'newPage'>;

/**
 * The Chromium for a build's PDFs, started: `explicit` (--chrome), else $ZFOLIO_CHROME, else the usual paths;
 * or the line that tells the user why there is none (the caller closes the browser).
 */
export async function chromeForPrinting(explicit: string | undefined, env: Readonly<Record<string, string | undefined>>): Promise<{ browser: Browser } | { problem: string }> {
  const chrome = findChrome(explicit, env);
  if ('problem' in chrome) return { problem: chromeHint(chrome.problem) };
  try {
    return { browser: await launchChrome(chrome.path) };
  } catch (error) {
    if (!(error instanceof ChromeStartError)) throw error;
    return { problem: error.message };
  }
}

/** A Chromium that would not start (not a browser, a broken install, no display libraries...). */
export class ChromeStartError extends Error {}

/** How long a Chromium may take to start before zfolio gives up on it. */
const START_TIMEOUT_MS = 30_000;

/**
 * Start Chromium. zfolio handles Ctrl+C and its kin itself (puppeteer's own handlers would end the process
 * with a status of their choosing); until the browser is closed, a process that ends early kills it.
 */
export async function launchChrome(executablePath: string): Promise<Browser> {
  let browser: Browser;
  try {
    browser = await puppeteer.launch({
      executablePath,
      headless: true,
      args: FLAGS,
      defaultViewport: { width: 1200, height: 900 },
      handleSIGINT: false,
      handleSIGTERM: false,
      handleSIGHUP: false,
      timeout: START_TIMEOUT_MS,
    });
  } catch (error) {
    throw new ChromeStartError(`${executablePath} did not start as Chromium (${startFailure(error)}); give a working one with --chrome PATH or ${CHROME_ENV}=PATH`);
  }
  const done = untilDone(() => browser.process()?.kill('SIGKILL'));
  browser.once('disconnected', done);
  return browser;
}

/**
 * The telling part of puppeteer's launch error, on one line: the exit code, or the system's error, and the
 * first line the program wrote to stderr.
 */
export function startFailure(error: unknown): string {
  const message = error instanceof Error ? error.message : String(error);
  const [head, ...rest] = message.split(/\n\s*stderr:\s*/);
  let what = head.replace(/^Failed to launch the browser process[!:]?/, '').split('\n')[0].trim().replace(/\s+/g, ' ');
  const code = /^Code: (\d+)$/.exec(what);
  if (code) what = `it exited at once with status ${code[1]}`;
  const said = (rest.join('\n').split('\n').map((l) => l.trim()).find((l) => l && !l.startsWith('TROUBLESHOOTING')) ?? '').replace(/\s+/g, ' ');
  const line = [what || 'it did not answer', said && `it said "${said}"`].filter(Boolean).join('; ');
  return line.length > 160 ? `${line.slice(0, 159)}…` : line;
}
