// A cached part's source file (part-cache.ts): its path and content hash known, its text and YAML document
// read from the file when first asked for (only `zfolio diff`-style pairing of renamed parts asks for them).

import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { DiagnosticList } from './diagnostics.js';
import { parseYamlSource, type SourceFile } from './source.js';

/** A source whose text and document are read from the file when first asked for. */
export class LazySource implements SourceFile {
  private parsed?: SourceFile;

  constructor(
    private readonly root: string,
    readonly path: string,
    readonly hash: string,
  ) {}

  private load(): SourceFile {
    if (!this.parsed) {
      const text = readFileSync(join(this.root, this.path), 'utf8');
      this.parsed = parseYamlSource(this.path, text, new DiagnosticList());
      if (!this.parsed) throw new Error(`${this.path} changed while it was read and no longer parses; run again`);
    }
    return this.parsed;
  }

  get text() {
    return this.load().text;
  }

  get document() {
    return this.load().document;
  }

  get lines() {
    return this.load().lines;
  }
}
