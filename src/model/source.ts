// YAML files with positions: every node can be traced back to file:line:col for messages.

import { createHash } from 'node:crypto';
import { LineCounter, isScalar, parseDocument, visit, type Document, type Node, type YAMLError } from 'yaml';
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
 * and "104" reaches the unit parser as written. Syntax errors (and a field given twice in one mapping) go
 * to `diagnostics`; the file is then returned as undefined.
 */
export function parseYamlSource(path: string, text: string, diagnostics: DiagnosticList): SourceFile | undefined {
  const lines = new LineCounter();
  // Duplicate keys are found below, so the message can name the field and where it was first given.
  const document = parseDocument(text, { lineCounter: lines, schema: 'failsafe', uniqueKeys: false, prettyErrors: false });
  const at = (offset: number) => positionAtOffset(path, text, lines, offset);
  let failed = false;
  const reported = new Set<number>();
  for (const error of document.errors) {
    // One mistake can raise two errors at the same place (a key indented under a value); say it once.
    if (reported.has(error.pos[0])) continue;
    reported.add(error.pos[0]);
    const { offset, message } = syntaxMessage(error, document.errors, text);
    diagnostics.error(at(offset), `YAML syntax: ${message}`);
    failed = true;
  }
  if (failed) return undefined;
  visit(document, {
    Map(_, map) {
      const seen = new Map<string, number>();
      for (const pair of map.items) {
        if (!isScalar(pair.key) || pair.key.range === undefined || pair.key.range === null) continue;
        const key = String(pair.key.value);
        const first = seen.get(key);
        if (first === undefined) {
          seen.set(key, pair.key.range[0]);
          continue;
        }
        const earlier = at(first);
        diagnostics.error(at(pair.key.range[0]), `duplicate field "${key}": already given at line ${earlier.line}, column ${earlier.column}; a field may appear only once in a mapping`);
        failed = true;
      }
    },
  });
  if (failed) return undefined;
  return { path, text, hash: contentHash(text), document, lines };
}

/** Plain words for the YAML mistakes people make in hand-written files; the parser's own text otherwise. */
function syntaxMessage(error: YAMLError, all: readonly YAMLError[], text: string): { offset: number; message: string } {
  const own = firstLine(error.message);
  switch (error.code) {
    case 'MULTILINE_IMPLICIT_KEY':
    case 'BLOCK_AS_IMPLICIT_KEY': {
      const multiline = all.find((e) => e.pos[0] === error.pos[0] && e.code === 'MULTILINE_IMPLICIT_KEY');
      if (multiline) {
        // A value ran on into the next line and a key there: that key is indented further than its siblings.
        return { offset: firstNonBlank(text, multiline.pos[1]), message: 'this key is indented further than the keys above it; keys of one mapping start at the same column' };
      }
      return { offset: error.pos[0], message: 'a plain value cannot contain ": "; put the value in quotes' };
    }
    case 'TAB_AS_INDENT':
      return { offset: error.pos[0], message: 'a tab is used for indentation; indent with spaces' };
    case 'BAD_INDENT':
      if (/^Flow map/.test(own)) return { offset: error.pos[0], message: 'a flow mapping "{...}" above is not closed; expected "}" before this line' };
      if (/^Flow sequence/.test(own)) return { offset: error.pos[0], message: 'a flow list "[...]" above is not closed; expected "]" before this line' };
      if (/^All mapping items/.test(own)) return { offset: firstNonBlank(text, error.pos[0]), message: 'this key does not line up with the keys above it; keys of one mapping start at the same column' };
      return { offset: error.pos[0], message: own };
    case 'MULTIPLE_DOCS':
      return { offset: error.pos[0], message: 'a second document ("---") in one file; expected one document per file' };
    case 'MISSING_CHAR':
      if (/^Missing closing "/.test(own)) return { offset: error.pos[0], message: 'a quoted value above is not closed; expected a closing "' };
      if (/^Missing closing '/.test(own)) return { offset: error.pos[0], message: "a quoted value above is not closed; expected a closing '" };
      return { offset: error.pos[0], message: own };
    default:
      return { offset: error.pos[0], message: own };
  }
}

/** The first character that is not a space or tab on the line holding `offset`. */
function firstNonBlank(text: string, offset: number): number {
  const lineStart = text.lastIndexOf('\n', offset - 1) + 1;
  return lineStart + (/^[ \t]*/.exec(text.slice(lineStart))?.[0].length ?? 0);
}

function firstLine(message: string): string {
  const line = message.split('\n')[0].trim();
  // The yaml library appends its own "at line L, column C"; the prefix already says where.
  return line.replace(/ at line \d+, column \d+:?$/, '');
}

/** Line and column of a character offset; the column counts characters (code points), not UTF-16 units. */
function positionAtOffset(file: string, text: string, lines: LineCounter, offset: number): SourcePosition {
  const { line, col } = lines.linePos(offset);
  const lineStart = offset - (col - 1);
  const column = [...text.slice(Math.max(0, lineStart), offset)].length + 1;
  return { file, line: Math.max(1, line), column: Math.max(1, column) };
}

/** Where a node starts; the file's first character when there is no node. */
export function positionOf(source: SourceFile, node: Node | null | undefined): SourcePosition {
  return positionAtOffset(source.path, source.text, source.lines, node?.range?.[0] ?? 0);
}
