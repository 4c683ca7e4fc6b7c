// YAML files with positions: every node can be traced back to file:line:col for messages.

import { LineCounter, isAlias, isMap, isNode, isScalar, isSeq, parseDocument, type Document, type Node, type YAMLError, type YAMLMap } from 'yaml';
import { sha256Hex } from './sha256.js';
import { quote, type DiagnosticList, type SourcePosition } from './diagnostics.js';
import { MAX_DEPTH, MAX_ITEMS, depthMessage, firstLimitProblem, widthMessage, type LimitProblem } from './yaml-limits.js';

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
  return sha256Hex(text).slice(0, 16);
}

/**
 * Parse one YAML file. All scalars stay strings (the failsafe schema) so that "0402" stays a package name
 * and "104" reaches the unit parser as written. Everything that would make the file mean something other
 * than it shows is refused here, for every kind of file: bare CR line ends, control characters, YAML tags and
 * directives other than "%YAML 1.2", a field given twice in one mapping, and nesting or lists beyond the
 * limits of yaml-limits.ts. Problems go to `diagnostics`; the file is then returned as undefined.
 */
export function parseYamlSource(path: string, text: string, diagnostics: DiagnosticList): SourceFile | undefined {
  const before = diagnostics.errorCount;
  const early = rawTextProblem(text);
  if (early) {
    diagnostics.error(positionInText(path, text, early.offset), early.message);
    return undefined;
  }
  const lines = new LineCounter();
  let document: Document.Parsed;
  try {
    // Duplicate keys are found below, so the message can name the field and where it was first given.
    document = parseDocument(text, { lineCounter: lines, schema: 'failsafe', uniqueKeys: false, prettyErrors: false });
  } catch {
    // The limits above keep the reader's recursion shallow; should it still fail, say so in place of a crash.
    diagnostics.error({ file: path, line: 1, column: 1 }, 'YAML syntax: the file could not be read; it is nested too deeply or is too large');
    return undefined;
  }
  const source: SourceFile = { path, text, hash: contentHash(text), document, lines };
  const at = (offset: number) => positionAtOffset(source, offset);
  const reported = new Set<number>();
  for (const error of document.errors) {
    // One mistake can raise two errors at the same place (a key indented under a value); say it once.
    if (reported.has(error.pos[0])) continue;
    reported.add(error.pos[0]);
    const { offset, message } = syntaxMessage(error, document.errors, text);
    diagnostics.error(at(offset), `YAML syntax: ${message}`);
  }
  if (diagnostics.errorCount > before) return undefined;
  for (const warning of document.warnings) {
    // Tags are reported where they are written, below.
    if (warning.code === 'TAG_RESOLVE_FAILED') continue;
    const message = warning.code === 'BAD_DIRECTIVE' ? `${firstLine(warning.message)}; a library file takes no "%" directives other than "%YAML 1.2"` : firstLine(warning.message);
    diagnostics.error(at(warning.pos[0]), `YAML: ${message}`);
  }
  const version = document.directives?.yaml;
  if (version?.explicit && version.version !== '1.2') {
    diagnostics.error(at(Math.max(0, text.indexOf('%YAML'))), `YAML: "%YAML ${version.version}": zfolio reads YAML 1.2 only; remove the directive`);
  }
  checkNodes(source, diagnostics);
  return diagnostics.errorCount > before ? undefined : source;
}

/** Line ends, control characters and size limits, checked before parsing; the first problem found. */
function rawTextProblem(text: string): LimitProblem | undefined {
  const bareCr = /\r(?!\n)/.exec(text);
  if (bareCr) {
    return { offset: bareCr.index, message: 'a line ends with a bare carriage return (CR, as old Mac files do); save the file with LF or CRLF line ends' };
  }
  const control = RAW_CONTROL.exec(text);
  if (control) return { offset: control.index, message: `a control character (${codePoint(control[0])}) in the file; a library file is plain UTF-8 text` };
  return firstLimitProblem(text);
}

// Every C0 control but tab, LF and CR (CRLF line ends are fine), DEL, and the C1 controls.
const RAW_CONTROL = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f]/;
// In a value, only tab and line feed: a CR or NUL written as an escape ("\r", "\0") is refused too.
const VALUE_CONTROL = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f]/;
const CONTROL_NAMES: Readonly<Record<number, string>> = { 0: 'NUL', 7: 'BEL', 8: 'BS', 11: 'VT', 12: 'FF', 13: 'CR', 27: 'ESC', 127: 'DEL' };

function codePoint(c: string): string {
  const code = c.codePointAt(0) ?? 0;
  const name = CONTROL_NAMES[code];
  return `U+${code.toString(16).toUpperCase().padStart(4, '0')}${name ? `, ${name}` : ''}`;
}

/**
 * One pass over every node, without recursion: nesting depth and width, tags, control characters in values,
 * and keys given twice in one mapping.
 */
function checkNodes(source: SourceFile, diagnostics: DiagnosticList): void {
  const stack: { node: unknown; depth: number }[] = [{ node: source.document.contents, depth: 1 }];
  let tooDeep = false;
  while (stack.length > 0) {
    const { node, depth } = stack.pop()!;
    if (!isNode(node)) continue;
    if (node.tag && !isAlias(node)) {
      diagnostics.error(positionAtOffset(source, tagOffset(source.text, node.range?.[0] ?? 0)), `YAML tag ${quote(shortTag(node.tag))}: tags are not read, every value is taken as written; remove the tag`);
    }
    if (isScalar(node)) {
      const value = node.value === null || node.value === undefined ? '' : String(node.value);
      const control = VALUE_CONTROL.exec(value);
      if (control) diagnostics.error(positionOf(source, node), `this value holds a control character (${codePoint(control[0])}); text takes printable characters, tabs and line breaks only`);
      continue;
    }
    if (!isMap(node) && !isSeq(node)) continue;
    if (depth > MAX_DEPTH) {
      if (!tooDeep) diagnostics.error(positionOf(source, node), depthMessage);
      tooDeep = true;
      continue;
    }
    if (node.items.length > MAX_ITEMS) {
      diagnostics.error(positionOf(source, node), widthMessage);
      continue;
    }
    if (isMap(node)) {
      duplicateKeys(source, node, diagnostics);
      for (const pair of node.items) stack.push({ node: pair.key, depth: depth + 1 }, { node: pair.value, depth: depth + 1 });
    } else for (const item of node.items) stack.push({ node: item, depth: depth + 1 });
  }
}

function duplicateKeys(source: SourceFile, map: YAMLMap, diagnostics: DiagnosticList): void {
  const seen = new Map<string, number>();
  for (const pair of map.items) {
    if (!isScalar(pair.key) || pair.key.range === undefined || pair.key.range === null) continue;
    const key = String(pair.key.value);
    const first = seen.get(key);
    if (first === undefined) {
      seen.set(key, pair.key.range[0]);
      continue;
    }
    const earlier = positionAtOffset(source, first);
    diagnostics.error(positionAtOffset(source, pair.key.range[0]), `duplicate field ${quote(key)}: already given at line ${earlier.line}, column ${earlier.column}; a field may appear only once in a mapping`);
  }
}

/** Where the tag written before the node starting at `offset` begins ("!!float 1n": at the "!"). */
function tagOffset(text: string, offset: number): number {
  const bang = text.lastIndexOf('!', offset);
  if (bang < 0) return offset;
  let start = bang;
  while (start > 0 && !/[\s,[{]/.test(text[start - 1])) start--;
  return start;
}

/** "!!float" for the core schema's tags, the tag as written otherwise. */
function shortTag(tag: string): string {
  return tag.startsWith('tag:yaml.org,2002:') ? `!!${tag.slice('tag:yaml.org,2002:'.length)}` : tag;
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
  // The yaml library appends its own "at line L, column C"; the prefix already says where. Its text may
  // quote the file: keep it short and printable.
  const own = line.replace(/ at line \d+, column \d+:?$/, '');
  return own.length > 160 || /[\u0000-\u001f\u007f-\u009f]/.test(own) ? quote(own, 120).slice(1).replace(/"( \(\d+ characters\))?$/, '$1') : own;
}

/**
 * Line and column of a character offset; the column counts characters (code points), not UTF-16 units.
 * The line comes from the line counter (binary search); astral characters before the offset on its line are
 * counted from an index of their offsets built once per file, so a message costs O(log n) even on a file
 * that is one long line.
 */
function positionAtOffset(source: SourceFile, offset: number): SourcePosition {
  const { line, col } = source.lines.linePos(offset);
  const lineStart = offset - (col - 1);
  const astral = astralOffsets(source);
  const pairs = countBelow(astral, offset) - countBelow(astral, Math.max(0, lineStart));
  return { file: source.path, line: Math.max(1, line), column: Math.max(1, col - pairs) };
}

const astralIndex = new WeakMap<SourceFile, number[]>();

/** Offsets of the high surrogates in the text, ascending. */
function astralOffsets(source: SourceFile): number[] {
  let index = astralIndex.get(source);
  if (!index) {
    index = [];
    const text = source.text;
    for (let i = text.search(/[\ud800-\udbff]/); i >= 0 && i < text.length; i++) {
      const c = text.charCodeAt(i);
      if (c >= 0xd800 && c <= 0xdbff) index.push(i);
    }
    astralIndex.set(source, index);
  }
  return index;
}

/** How many entries of the ascending `sorted` are below `value`. */
function countBelow(sorted: readonly number[], value: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid] < value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** The same before a file is parsed, by scanning the text; used once per file at most. */
function positionInText(file: string, text: string, offset: number): SourcePosition {
  const lineStart = text.lastIndexOf('\n', offset - 1) + 1;
  let line = 1;
  for (let i = text.indexOf('\n'); i >= 0 && i < offset; i = text.indexOf('\n', i + 1)) line++;
  return { file, line, column: [...text.slice(lineStart, offset)].length + 1 };
}

/** Where a node starts; the file's first character when there is no node. */
export function positionOf(source: SourceFile, node: Node | null | undefined): SourcePosition {
  return positionAtOffset(source, node?.range?.[0] ?? 0);
}
