// The hash of a reuse key's text: SHA-256 in hex. A rebuild of 10,000 parts takes some 20,000 of them (each
// part's key, its charts' cache key, the keys of the pages that list it); Node's one-call `hash` (20.12 and
// later) makes no Hash object for each, and gives the same digest as `createHash`, used where it is missing.

import * as crypto from 'node:crypto';

const oneCall = (crypto as { hash?: (algorithm: string, data: string, encoding: 'hex') => string }).hash;

/** SHA-256 of `text` (UTF-8) as 64 hex digits. */
export function sha256Hex(text: string): string {
  return oneCall ? oneCall('sha256', text, 'hex') : crypto.createHash('sha256').update(text).digest('hex');
}
