// The key (legend) of a chart: one or more rows above the plot, laid out here so the symbols match the
// curves exactly (same series scales), band swatches and point symbols can sit beside line symbols, and the
// frame's top padding can grow by whole rows when a comparison lists many parts.

import type { Frame } from './frame.js';
import { FONT_SIZE } from './palette.js';
import type { Row } from './render.js';
import { cleanText } from '../present/escape.js';
import { textWidth } from './text-width.js';

export type KeyItem =
  /** A line symbol drawn with the chart's line scales; `style` holds the row fields they read (e.g. {s: 'mag'}). */
  | { kind: 'line'; style: Row; text: string }
  | { kind: 'band'; text: string }
  /** A tinted swatch for the envelope of a spread. */
  | { kind: 'spread'; text: string }
  /** A point symbol: a vega point shape (default circle). */
  | { kind: 'point'; color: string; text: string; shape?: string };

export interface KeyLayout {
  datasets: { keyBands: Row[]; keySpread: Row[]; keyLines: Row[]; keyPoints: Row[]; keyText: Row[] };
  rows: number;
  /** Padding above the plot that holds the key. */
  topPadding: number;
}

const SYMBOL = 26;
const SYMBOL_GAP = 5;
const ITEM_GAP = 18;
const ROW_HEIGHT = 16;
/** Space between the key's last row and the plot. */
const BELOW = 12;

/**
 * Rows of items, left to right, wrapping at `width` px. With `columns`, items align in that many columns
 * of equal width (comparisons: ids of similar length read better as a grid). With `minRows`, the key takes
 * at least that many rows, the empty ones between its entries and the plot (see ChartLayout).
 */
export function layoutKey(items: readonly KeyItem[], width: number, columns?: number, minRows = 0): KeyLayout {
  const datasets: KeyLayout['datasets'] = { keyBands: [], keySpread: [], keyLines: [], keyPoints: [], keyText: [] };
  const size = FONT_SIZE.legend;
  // An entry longer than the key is wide (a band's rule and range on a half-column chart) wraps at its spaces,
  // its lines under one another beside the symbol.
  const lines = items.map((it) => wrapText(cleanText(it.text), width - SYMBOL - SYMBOL_GAP, size));
  const widths = lines.map((ls) => SYMBOL + SYMBOL_GAP + Math.max(...ls.map((l) => textWidth(l, size))));
  const columnWidth = columns ? width / columns : 0;
  const placed: { item: KeyItem; lines: string[]; x: number; row: number }[] = [];
  let x = 0;
  let row = 0;
  /** Rows taken by the tallest entry of the current row. */
  let rowSpan = 1;
  items.forEach((item, i) => {
    const w = columns ? columnWidth : widths[i];
    if (x > 0 && x + w > width + 0.5) {
      row += rowSpan;
      rowSpan = 1;
      x = 0;
    }
    placed.push({ item, lines: lines[i], x, row });
    rowSpan = Math.max(rowSpan, lines[i].length);
    x += columns ? columnWidth : w + ITEM_GAP;
  });
  const rows = Math.max(items.length === 0 ? 0 : row + rowSpan, minRows);
  const topPadding = rows === 0 ? 14 : rows * ROW_HEIGHT + BELOW;
  for (const { item, lines: textLines, x: x0, row: r } of placed) {
    // Rows count upwards from the plot: the last row sits just above it.
    const y = -topPadding + 3 + r * ROW_HEIGHT + ROW_HEIGHT / 2;
    if (item.kind === 'line') datasets.keyLines.push({ x0, x1: x0 + SYMBOL, y, ...item.style });
    else if (item.kind === 'band') datasets.keyBands.push({ x0, x1: x0 + SYMBOL, y0: y - 5, y1: y + 5 });
    else if (item.kind === 'spread') datasets.keySpread.push({ x0, x1: x0 + SYMBOL, y0: y - 5, y1: y + 5 });
    else datasets.keyPoints.push({ x: x0 + SYMBOL / 2, y, c: item.color, sh: item.shape ?? 'circle' });
    textLines.forEach((t, k) => datasets.keyText.push({ x: x0 + SYMBOL + SYMBOL_GAP, y: y + k * ROW_HEIGHT, t }));
  }
  return { datasets, rows, topPadding };
}

/**
 * `text` in lines no wider than `width` px, broken at spaces (a single word longer than that stays whole),
 * but never between a number and the word after it (its unit: "110 MHz").
 */
export function wrapText(text: string, width: number, size: number): string[] {
  if (textWidth(text, size) <= width) return [text];
  const out: string[] = [];
  let line = '';
  for (const word of unbrokenWords(text)) {
    const next = line ? `${line} ${word}` : word;
    if (line && textWidth(next, size) > width) {
      out.push(line);
      line = word;
    } else line = next;
  }
  if (line) out.push(line);
  return out;
}

/** A word that is a number: the word after it is kept on its line. */
const NUMBER = /^[-+−]?\d[\d.,]*$/;

/** The words of `text` between which a line may break: a number and the word after it are one. */
function unbrokenWords(text: string): string[] {
  const words: string[] = [];
  for (const w of text.split(' ')) {
    const last = words.length - 1;
    if (last >= 0 && NUMBER.test(words[last])) words[last] += ` ${w}`;
    else words.push(w);
  }
  return words;
}

/** Columns for a key of many entries of similar length: as many of the widest entry as fit, 1 to 4. */
export function gridColumns(items: readonly KeyItem[], width: number): number {
  const widest = Math.max(...items.map((it) => textWidth(it.text, FONT_SIZE.legend))) + SYMBOL + SYMBOL_GAP + ITEM_GAP;
  return Math.max(1, Math.min(4, Math.floor(width / widest)));
}

/** The frame with its top padding set to hold the key. */
export function frameForKey(f: Frame, key: KeyLayout): Frame {
  return { ...f, padding: { ...f.padding, top: key.topPadding } };
}
