// Reading the fields of one YAML mapping, with a message at the right place for everything that is wrong.

import { isMap, isSeq, type Node, type Pair, type YAMLMap, type YAMLSeq } from 'yaml';
import { expectation, parseQuantity, parseRatio } from '../units/parse.js';
import { DIMENSIONS, type Dimension } from '../units/quantity.js';
import { inRange, rangeText } from '../units/ranges.js';
import { quote, type DiagnosticList, type SourcePosition } from './diagnostics.js';
import { positionOf, type SourceFile } from './source.js';
import { describeNode, expectationInBrackets, nearMiss, scalarText } from './found-text.js';

export { describeNode, expectationInBrackets, missingTarget, nearMiss, scalarText } from './found-text.js';

export interface ReadContext {
  source: SourceFile;
  diagnostics: DiagnosticList;
  /**
   * Names declared by files that have errors of their own, with the file: a reference to one of them is
   * not "no such part" (with a misleading "did you mean") but a pointer to the file to fix.
   */
  unreadable?: Readonly<Partial<Record<'parts' | 'plans' | 'comparisons', ReadonlyMap<string, string>>>>;
}

export interface QuantityOptions {
  required?: boolean;
  /** Allow zero (default: values must be strictly positive). */
  allowZero?: boolean;
  /** Allow negative values (default: no). */
  allowNegative?: boolean;
}

export interface TextOptions {
  required?: boolean;
  pattern?: RegExp;
  /** Says what the pattern wants, for the message: "letters, digits, . _ - only". */
  patternHint?: string;
  oneOf?: readonly string[];
  /** What the field holds, for the "missing field" message: 'one of capacitor, inductor, ...'. */
  describe?: string;
  /** Longest text accepted, in characters. */
  maxLength?: number;
  /** Offer a "did you mean" from `oneOf` (default true; off where a wrong guess could mislead, e.g. safety classes). */
  suggest?: boolean;
}

/** Ratios below this are no tolerance or criterion a part is made to; they only feed rounding noise. */
const MIN_RATIO = 1e-6;

function formatNumberPercent(ratio: number): string {
  const percent = ratio * 100;
  return percent <= 1e9 ? `${Number(percent.toPrecision(6))}%` : 'far more than 100%';
}

export class Fields {
  private readonly pairs = new Map<string, Pair<Node, Node | null>>();

  /**
   * @param where the field path for messages, e.g. "parasitics" ('' at the top level)
   */
  constructor(
    readonly ctx: ReadContext,
    readonly node: YAMLMap<Node, Node | null>,
    readonly where: string,
  ) {
    for (const pair of node.items) {
      const key = scalarText(pair.key);
      if (key !== undefined) this.pairs.set(key, pair);
    }
  }

  /** Open a mapping node, or say what was found instead. */
  static of(ctx: ReadContext, node: Node | null | undefined, where: string, at?: SourcePosition): Fields | undefined {
    if (isMap(node)) return new Fields(ctx, node as YAMLMap<Node, Node | null>, where);
    ctx.diagnostics.error(at ?? positionOf(ctx.source, node), `${where ? where + ': ' : ''}expected a mapping of fields, found ${describeNode(node)}`);
    return undefined;
  }

  label(name: string): string {
    return this.where ? `${this.where}.${name}` : name;
  }

  get keys(): string[] {
    return [...this.pairs.keys()];
  }

  has(name: string): boolean {
    return this.pairs.has(name);
  }

  valueNode(name: string): Node | null | undefined {
    return this.pairs.get(name)?.value;
  }

  /** Position of a field's value (or its key when it has none), or of the mapping itself. */
  position(name?: string): SourcePosition {
    if (name === undefined) return positionOf(this.ctx.source, this.node);
    const pair = this.pairs.get(name);
    if (!pair) return positionOf(this.ctx.source, this.node);
    return positionOf(this.ctx.source, pair.value ?? pair.key);
  }

  keyPosition(name: string): SourcePosition {
    const pair = this.pairs.get(name);
    return positionOf(this.ctx.source, pair ? pair.key : this.node);
  }

  error(name: string | undefined, message: string): void {
    this.ctx.diagnostics.error(this.position(name), name ? `${this.label(name)}: ${message}` : message);
  }

  warning(name: string | undefined, message: string): void {
    this.ctx.diagnostics.warning(this.position(name), name ? `${this.label(name)}: ${message}` : message);
  }

  /**
   * Report unknown fields (with a near-miss suggestion) and missing required ones. A required field that an
   * unknown one was taken for ("nominl" for "nominal") is not reported again as missing.
   */
  expect(allowed: readonly string[], required: readonly string[] = [], describeMissing?: (name: string) => string): void {
    const guessed = new Set<string>();
    for (const pair of this.node.items) {
      const key = scalarText(pair.key);
      if (key === undefined) {
        this.ctx.diagnostics.error(positionOf(this.ctx.source, pair.key), `${this.where ? this.where + ': ' : ''}expected a field name, found ${describeNode(pair.key)}`);
        continue;
      }
      if (allowed.includes(key)) continue;
      const guess = nearMiss(key, allowed);
      if (guess) guessed.add(guess);
      const hint = guess ? `; did you mean "${guess}"?` : `; expected one of ${allowed.join(', ')}`;
      this.ctx.diagnostics.error(positionOf(this.ctx.source, pair.key), `unknown field ${quote(this.label(key))}${hint}`);
    }
    for (const name of required) {
      if (this.has(name) || guessed.has(name)) continue;
      const what = describeMissing ? ` (${describeMissing(name)})` : '';
      this.ctx.diagnostics.error(this.position(), `missing field "${this.label(name)}"${what}`);
    }
  }

  /** A physical value in SI base units; undefined (with a message) when absent or wrong. */
  quantity(name: string, dim: Dimension, options: QuantityOptions = {}): number | undefined {
    if (!this.has(name)) {
      if (options.required) this.ctx.diagnostics.error(this.position(), `missing field "${this.label(name)}" (${expectationInBrackets(dim)})`);
      return undefined;
    }
    return readQuantity(this.ctx, this.valueNode(name), this.label(name), dim, options);
  }

  /**
   * A ratio greater than zero ("10%" or 0.1). A bare number above 1 is refused: "10" is ten times, 1000%,
   * and is almost always meant as 10%.
   */
  ratio(name: string): number | undefined {
    if (!this.has(name)) return undefined;
    const node = this.valueNode(name);
    const text = scalarText(node);
    const parsed = parseRatio(text);
    if (!parsed.ok) {
      this.error(name, parsed.message);
      return undefined;
    }
    if (!(parsed.value > 0)) {
      this.error(name, `expected a ratio greater than zero, found ${describeNode(node)}`);
      return undefined;
    }
    if (parsed.value > 1 && text !== undefined && !text.trim().endsWith('%')) {
      const n = text.trim();
      this.error(name, `expected a fraction such as 10% or 0.1, found ${quote(n)}: a bare number is the fraction itself, so ${quote(n, 20)} would mean ${formatNumberPercent(parsed.value)}; write ${n}% if ${n} percent is meant`);
      return undefined;
    }
    if (parsed.value < MIN_RATIO) {
      this.error(name, `expected a ratio of at least 1e-6 (0.0001%), found ${describeNode(node)}`);
      return undefined;
    }
    return parsed.value;
  }

  text(name: string, options: TextOptions = {}): string | undefined {
    if (!this.has(name)) {
      if (options.required) this.ctx.diagnostics.error(this.position(), `missing field "${this.label(name)}"${options.describe ? ` (${options.describe})` : ''}`);
      return undefined;
    }
    const node = this.valueNode(name);
    const value = scalarText(node);
    if (value === undefined || value.trim() === '') {
      this.error(name, `expected text, found ${describeNode(node)}`);
      return undefined;
    }
    if (options.oneOf && !options.oneOf.includes(value)) {
      const guess = options.suggest === false ? undefined : nearMiss(value, options.oneOf);
      this.error(name, `expected one of ${options.oneOf.join(', ')}, found ${quote(value)}${guess ? `; did you mean "${guess}"?` : ''}`);
      return undefined;
    }
    if (options.maxLength !== undefined && [...value].length > options.maxLength) {
      this.error(name, `expected at most ${options.maxLength} characters, found ${quote(value)}`);
      return undefined;
    }
    if (options.pattern && !options.pattern.test(value)) {
      this.error(name, `expected ${options.patternHint ?? `text matching ${options.pattern}`}, found ${quote(value)}`);
      return undefined;
    }
    return value;
  }

  /** A list of short texts, or a single text standing for a list of one. */
  textList(name: string): string[] {
    if (!this.has(name)) return [];
    const node = this.valueNode(name);
    const single = scalarText(node);
    if (single !== undefined) return [single];
    if (!isSeq(node)) {
      this.error(name, `expected a list of words, found ${describeNode(node)}`);
      return [];
    }
    const out: string[] = [];
    for (const item of (node as YAMLSeq<Node>).items) {
      const text = scalarText(item);
      if (text === undefined || text.trim() === '') {
        this.ctx.diagnostics.error(positionOf(this.ctx.source, item), `${this.label(name)}: expected a word, found ${describeNode(item)}`);
      } else out.push(text);
    }
    return out;
  }

  map(name: string, options: { required?: boolean } = {}): Fields | undefined {
    if (!this.has(name)) {
      if (options.required) this.ctx.diagnostics.error(this.position(), `missing field "${this.label(name)}"`);
      return undefined;
    }
    return Fields.of(this.ctx, this.valueNode(name), this.label(name), this.position(name));
  }

  seq(name: string, options: { required?: boolean } = {}): YAMLSeq<Node> | undefined {
    if (!this.has(name)) {
      if (options.required) this.ctx.diagnostics.error(this.position(), `missing field "${this.label(name)}" (a list)`);
      return undefined;
    }
    const node = this.valueNode(name);
    if (!isSeq(node)) {
      this.error(name, `expected a list, found ${describeNode(node)}`);
      return undefined;
    }
    return node as YAMLSeq<Node>;
  }
}

/** Read a quantity from any node (also list items), with the field label for messages. */
export function readQuantity(ctx: ReadContext, node: Node | null | undefined, label: string, dim: Dimension, options: QuantityOptions = {}): number | undefined {
  const at = positionOf(ctx.source, node);
  const text = scalarText(node);
  if (text === undefined) {
    ctx.diagnostics.error(at, `${label}: expected ${expectation(dim)}, found ${describeNode(node)}`);
    return undefined;
  }
  const parsed = parseQuantity(text, dim);
  if (!parsed.ok) {
    ctx.diagnostics.error(at, `${label}: ${parsed.message}${rkmHint(text, dim)}`);
    return undefined;
  }
  const { value } = parsed;
  const allowZero = options.allowZero ?? false;
  const allowNegative = options.allowNegative ?? false;
  if ((value < 0 && !allowNegative) || (value === 0 && !allowZero)) {
    const noun = dim === 'ratio' ? 'a number' : DIMENSIONS[dim].noun;
    const want = allowZero ? 'of zero or more' : 'greater than zero';
    ctx.diagnostics.error(at, `${label}: expected ${noun} ${want}, found ${quote(text)}`);
    return undefined;
  }
  if (value !== 0 && !inRange(value, dim)) {
    ctx.diagnostics.error(at, `${label}: expected ${DIMENSIONS[dim].noun} ${rangeText(dim)}, the range zfolio computes with, found ${quote(text)}`);
    return undefined;
  }
  return value;
}

/** Why "4R7" fails outside a resistance field: IEC 60062 uses R as the decimal point of ohms only. */
function rkmHint(text: string, dim: Dimension): string {
  const m = /^(\d*)R(\d*)$/.exec(text.trim());
  if (!m || dim === 'resistance' || dim === 'ratio' || (m[1] === '' && m[2] === '')) return '';
  const digits = `${m[1] || '0'}.${m[2] || '0'}`;
  return `; "R" marks the decimal point in resistances only (IEC 60062); for ${DIMENSIONS[dim].noun} write ${digits} with an SI prefix, e.g. ${digits}u or ${m[1] || '0'}u${m[2] || '0'}`;
}
