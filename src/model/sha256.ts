// SHA-256 in hex of a text or bytes: part files' content hashes, reuse keys, record shard names. A rebuild of
// 10,000 parts takes some 20,000 of them (each part's key, its charts' cache key, the keys of the pages that
// list it); Node's one-call `hash` (20.12 and later) makes no Hash object for each, and gives the same digest
// as `createHash`, used where it is missing.

import * as crypto from 'node:crypto';

const oneCall = (crypto as { hash?: (algorithm: string, data: string | Uint8Array, encoding: 'hex') => string }).hash;

/** SHA-256 of `data` (a string as UTF-8) as 64 hex digits. */
export function sha256Hex(data: string | Uint8Array): string {
  return oneCall ? oneCall('sha256', data, 'hex') : crypto.createHash('sha256').update(data).digest('hex');
}
