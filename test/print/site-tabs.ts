// Chromium for the browser tests: the system's, started once a file, and tabs on a built site opened from
// the file system as a reader would, each recording console errors and warnings, page errors, failed
// requests and any request outside the site into `problems`.

import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Browser, Page } from 'puppeteer-core';
import { findChrome, launchChrome } from '../../src/print/browser.js';
import { REPO } from '../site-helpers.js';

/** Where browser tests write screenshots for people to look at (ignored by git). */
export const ARTIFACTS = join(REPO, 'test', '.artifacts');

/** The system Chromium, started; a machine without it fails here rather than skipping. */
export async function startChrome(): Promise<Browser> {
  const chrome = findChrome(undefined, process.env);
  // CI installs Debian's chromium.
  if (!('path' in chrome)) throw new Error(`browser tests need Chromium: ${chrome.problem}`);
  mkdirSync(ARTIFACTS, { recursive: true });
  return launchChrome(chrome.path);
}

/** Opens `file` of the site at `site` in a new tab of `browser`, with or without script. */
export function siteTabs(browser: () => Browser, site: () => string, problems: string[]) {
  return async function open(file: string, javascript = true): Promise<Page> {
    const page = await browser().newPage();
    await page.setJavaScriptEnabled(javascript);
    await page.setViewport({ width: 1280, height: 900 });
    const siteUrl = pathToFileURL(site()).href;
    // The page the tab shows when it happens (a test may go on to another page of the site in the same tab).
    const where = () => (page.url().startsWith(siteUrl + '/') ? page.url().slice(siteUrl.length + 1) : file);
    page.on('console', (m) => {
      if (m.type() === 'error' || m.type() === 'warn') problems.push(`${where()}: console ${m.type()}: ${m.text()}`);
    });
    page.on('pageerror', (e) => problems.push(`${where()}: page error: ${(e as Error).message}`));
    page.on('requestfailed', (r) => problems.push(`${where()}: request failed: ${r.url()}`));
    page.on('request', (r) => {
      if (!r.url().startsWith(siteUrl + '/') && !r.url().startsWith('data:')) problems.push(`${where()}: outside request: ${r.url()}`);
    });
    await page.goto(`${siteUrl}/${file}`, { waitUntil: 'load' });
    return page;
  };
}
