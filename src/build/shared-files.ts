// The files every page of a site loads or links and no page owns: the stylesheet, script and fonts of
// templates/assets, and the part charts' shared specs (spec-download.ts).

import { cpSync } from 'node:fs';
import { join } from 'node:path';
import { SPEC_FOLDER, SWEEP_SPECS } from '../pages/spec-download.js';
import { escapeJsonMarkup } from '../present/escape.js';
import { TEMPLATES_DIR } from './eleventy.js';
import { writeFileDeep } from './output.js';

export function writeSharedFiles(siteDir: string): void {
  cpSync(join(TEMPLATES_DIR, 'assets'), join(siteDir, 'assets'), { recursive: true });
  for (const [file, spec] of Object.entries(SWEEP_SPECS)) writeFileDeep(join(siteDir, SPEC_FOLDER, file), escapeJsonMarkup(JSON.stringify(spec, null, 2)) + '\n');
}
