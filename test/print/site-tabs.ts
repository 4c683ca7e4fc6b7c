// Chromium for the browser tests: the system's, one for the whole run (test/setup/shared-chrome.ts), in which
// each file works in a browser context of its own (its own tabs, storage and cache); and tabs on a built site
// opened from the file system as a reader would, each recording console errors and warnings, page errors,
// failed requests and any request outside the site into `problems`.

import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import puppeteer, { type BrowserContext, type Page } from 'puppeteer-core';
import { inject } from 'vitest';
import { chromeEndpoint } from '../setup/shared-chrome.js';
import { REPO } from '../site-helpers.js';

/** Where browser tests write screenshots for people to look at (ignored by git). */
export const ARTIFACTS = join(REPO, 'test', '.artifacts');

/**
 * A screenshot of what `page` shows, written to ARTIFACTS as `name` for people to look at, when the run has
 * ZFOLIO_TEST_SCREENSHOTS=1. No check reads these, and they cost Chromium's CPU: the eight of
 * browser.test.ts (six of them whole pages) took 10 s of it, 34.6 s against 24.4 s for the file without
 * them (scripts/tree-cpu.mjs, load 15 to 18).
 */
export async function keepScreenshot(page: Page, name: string, fullPage = false): Promise<void> {
  if (process.env.ZFOLIO_TEST_SCREENSHOTS !== '1') return;
  await page.screenshot({ path: join(ARTIFACTS, name), fullPage });
}

/**
 * A context of its own in the run's Chromium (started on the first call of the run); a machine without
 * Chromium fails here rather than skipping. Close it with `stopChrome`. Test builds that print ask for the
 * run's other Chromium, `'print'`, to give as their `pdf.browser`.
 */
export async function startChrome(use: 'pages' | 'print' = 'pages'): Promise<BrowserContext> {
  mkdirSync(ARTIFACTS, { recursive: true });
  // The viewport zfolio's own launch gives a new tab (src/print/browser.ts).
  const browser = await puppeteer.connect({ browserWSEndpoint: await chromeEndpoint(inject('chromeSocket'), use), defaultViewport: { width: 1200, height: 900 } });
  return browser.createBrowserContext();
}

/** Closes the file's context with every tab in it, and its connection; the shared Chromium goes on. */
export async function stopChrome(context: BrowserContext | undefined): Promise<void> {
  if (!context) return;
  const browser = context.browser();
  await context.close();
  await browser.disconnect();
}

/**
 * Opens `file` of the site at `site`, with or without script, in the tab of this `open`: one tab going from
 * page to page rather than a tab a page (a new tab costs Chromium about a second of CPU: ten tabs opened on
 * about:blank took 10 s more than none, at load 10 to 13). A test that closes it gets a new one next time;
 * a memo that reads pages while a test holds another (a walk through pages) takes a `siteTabs` of its own.
 */
export function siteTabs(browser: () => BrowserContext, site: () => string, problems: string[]) {
  let tab: Page | undefined;
  /** The file last opened in the tab. */
  let opened = '';
  const newTab = async (): Promise<Page> => {
    const page = await browser().newPage();
    const siteUrl = pathToFileURL(site()).href;
    // The page the tab shows when it happens (a test may go on to another page of the site in the same tab).
    const where = () => (page.url().startsWith(siteUrl + '/') ? page.url().slice(siteUrl.length + 1) : opened);
    page.on('console', (m) => {
      if (m.type() === 'error' || m.type() === 'warn') problems.push(`${where()}: console ${m.type()}: ${m.text()}`);
    });
    page.on('pageerror', (e) => problems.push(`${where()}: page error: ${(e as Error).message}`));
    page.on('requestfailed', (r) => problems.push(`${where()}: request failed: ${r.url()}`));
    page.on('request', (r) => {
      if (!r.url().startsWith(siteUrl + '/') && !r.url().startsWith('data:')) problems.push(`${where()}: outside request: ${r.url()}`);
    });
    return page;
  };
  return async function open(file: string, javascript = true): Promise<Page> {
    if (!tab || tab.isClosed()) tab = await newTab();
    opened = file;
    await tab.setJavaScriptEnabled(javascript);
    await tab.setViewport({ width: 1280, height: 900 });
    await tab.goto(`${pathToFileURL(site()).href}/${file}`, { waitUntil: 'load' });
    return tab;
  };
}
