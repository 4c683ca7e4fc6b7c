// One Chromium for the browser test files of a run, started by the main process (vitest's global setup) the
// first time a file asks for it and closed when the run ends. A file asks over a unix socket in the run's
// folder and gets the browser's DevTools endpoint (test/print/site-tabs.ts connects to it with a browser
// context of its own). A run with no browser test starts no Chromium and loads no browser driver.
// The test builds that print PDFs ask for a second one (path /print), so that their printing does not share
// a browser with the tests that time pages and screenshots.

import { rmSync } from 'node:fs';
import { createServer, request, type Server } from 'node:http';
import { join } from 'node:path';
import type { Browser } from 'puppeteer-core';

/** The main process's side: answers every request with the endpoint (starting Chromium on the first one). */
export function serveChrome(folder: string): { socket: string; close(): Promise<void> } {
  const socket = join(folder, 'chrome.sock');
  const browsers = new Map<string, Promise<Browser>>();
  const server: Server = createServer((request, response) => {
    const use = request.url === '/print' ? 'print' : 'pages';
    const browser = browsers.get(use) ?? browsers.set(use, startChromium()).get(use)!;
    browser.then(
      (b) => response.end(b.wsEndpoint()),
      (error: unknown) => {
        response.statusCode = 500;
        response.end(error instanceof Error ? error.message : String(error));
      },
    );
  });
  server.listen(socket);
  return {
    socket,
    async close() {
      await new Promise((done) => server.close(done));
      rmSync(socket, { force: true });
      // A Chromium that failed to start has nothing to close.
      for (const browser of browsers.values()) await (await browser.catch(() => undefined))?.close();
    },
  };
}

async function startChromium(): Promise<Browser> {
  const { findChrome, launchChrome } = await import('../../src/print/browser.js');
  const chrome = findChrome(undefined, process.env);
  // CI installs Debian's chromium: a machine without it fails the browser tests rather than skipping them.
  if (!('path' in chrome)) throw new Error(`browser tests need Chromium: ${chrome.problem}`);
  return launchChrome(chrome.path);
}

/** A test file's side: the DevTools endpoint of the shared Chromium for pages, or of the one for printing. */
export function chromeEndpoint(socket: string, use: 'pages' | 'print' = 'pages'): Promise<string> {
  return new Promise((resolve, reject) => {
    const asked = request({ socketPath: socket, path: use === 'print' ? '/print' : '/' }, (response) => {
      let text = '';
      response.setEncoding('utf8');
      response.on('data', (chunk: string) => (text += chunk));
      response.on('end', () => (response.statusCode === 200 ? resolve(text) : reject(new Error(text))));
    });
    asked.on('error', reject);
    asked.end();
  });
}
