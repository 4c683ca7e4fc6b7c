// Finding and starting the system's Chromium for PDFs. zfolio never downloads a browser.

import { existsSync } from 'node:fs';
import puppeteer, { type Browser } from 'puppeteer-core';

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

export async function launchChrome(executablePath: string): Promise<Browser> {
  return puppeteer.launch({ executablePath, headless: true, args: FLAGS, defaultViewport: { width: 1200, height: 900 } });
}
