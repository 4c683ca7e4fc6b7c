// YAML files with positions: every node can be traced back to file:line:col for messages.

import { createHash } from 'node:crypto';
import { LineCounter, parseDocument, type Document, type Node } from 'yaml';
import type { DiagnosticList, SourcePosition } from './diagnostics.js';

export interface SourceFile {
  /** Relative to the library root, forward slashes; what messages print. */
  path: string;
  text: string;
  /** First 16 hex digits of the SHA-256 of the file's bytes. */
  hash: string;
  document: Document.Parsed;
  lines: LineCounter;
}

export function contentHash(text: string | Uint8Array): string {
  return createHash('sha256').update(text).digest('hex').slice(0, 16);
}

/**
 * Parse one YAML file. All scalars stay strings (the failsafe schema) so that "0402" stays a package name
 * and "104" reaches the unit parser as written. Syntax errors go to `diagnostics`; the file is then
 * returned as undefined.
 */
export function parseYamlSource(path: string, text: string, diagnostics: DiagnosticList): SourceFile | undefined {
  const lines = new LineCounter();
  const document = parseDocument(text, { lineCounter: lines, schema: 'failsafe', uniqueKeys: true, prettyErrors: false });
  let failed = false;
  for (const error of document.errors) {
    const pos = lines.linePos(error.pos[0]);
    diagnostics.error({ file: path, line: Math.max(1, pos.line), column: Math.max(1, pos.col) }, `YAML syntax: ${firstLine(error.message)}`);
    failed = true;
  }
  if (failed) return undefined;
  return { path, text, hash: contentHash(text), document, lines };
}

function firstLine(message: string): string {
  const line = message.split('\n')[0].trim();
  // The yaml library appends its own "at line L, column C"; the prefix already says where.
  return line.replace(/ at line \d+, column \d+:?$/, '');
}

/** Where a node starts; the file's first character when there is no node. */
export function positionOf(source: SourceFile, node: Node | null | undefined): SourcePosition {
  const offset = node?.range?.[0] ?? 0;
  const { line, col } = source.lines.linePos(offset);
  return { file: source.path, line: Math.max(1, line), column: Math.max(1, col) };
}
