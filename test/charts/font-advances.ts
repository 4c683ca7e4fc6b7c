// Advance widths read from a TrueType font file, for checking text-width estimates against a real font:
// the 'head' table's unitsPerEm, the 'cmap' table's format 4 subtable (Unicode BMP to glyph) and the 'hhea'
// and 'hmtx' tables' advance widths (the OpenType specification, tables head, cmap, hhea and hmtx;
// https://learn.microsoft.com/typography/opentype/spec/). Only what those checks need.

import { readFileSync } from 'node:fs';

export interface FontAdvances {
  /** Advance width of a character in em, or undefined when the font has no glyph for it. */
  advanceEm(c: string): number | undefined;
}

export function readFontAdvances(path: string): FontAdvances {
  const b = readFileSync(path);
  const tables = new Map<string, number>();
  const count = b.readUInt16BE(4);
  for (let i = 0; i < count; i++) {
    const at = 12 + 16 * i;
    tables.set(b.toString('latin1', at, at + 4), b.readUInt32BE(at + 8));
  }
  const table = (tag: string) => {
    const at = tables.get(tag);
    if (at === undefined) throw new Error(`${path}: no '${tag}' table`);
    return at;
  };
  const unitsPerEm = b.readUInt16BE(table('head') + 18);
  const longMetrics = b.readUInt16BE(table('hhea') + 34);
  const hmtx = table('hmtx');
  const advanceOfGlyph = (g: number) => b.readUInt16BE(hmtx + 4 * Math.min(g, longMetrics - 1));

  // The Unicode BMP subtable: platform 3 encoding 1, or platform 0, in format 4.
  const cmap = table('cmap');
  let sub = -1;
  for (let i = 0; i < b.readUInt16BE(cmap + 2); i++) {
    const at = cmap + 4 + 8 * i;
    const platform = b.readUInt16BE(at);
    const encoding = b.readUInt16BE(at + 2);
    const offset = cmap + b.readUInt32BE(at + 4);
    if (b.readUInt16BE(offset) === 4 && ((platform === 3 && encoding === 1) || platform === 0)) sub = offset;
  }
  if (sub < 0) throw new Error(`${path}: no format 4 Unicode cmap`);
  const segments = b.readUInt16BE(sub + 6) / 2;
  const ends = sub + 14;
  const starts = ends + 2 * segments + 2;
  const deltas = starts + 2 * segments;
  const rangeOffsets = deltas + 2 * segments;
  const glyphOf = (code: number): number => {
    for (let s = 0; s < segments; s++) {
      if (code > b.readUInt16BE(ends + 2 * s)) continue;
      const start = b.readUInt16BE(starts + 2 * s);
      if (code < start) return 0;
      const delta = b.readUInt16BE(deltas + 2 * s);
      const rangeOffset = b.readUInt16BE(rangeOffsets + 2 * s);
      if (rangeOffset === 0) return (code + delta) & 0xffff;
      const g = b.readUInt16BE(rangeOffsets + 2 * s + rangeOffset + 2 * (code - start));
      return g === 0 ? 0 : (g + delta) & 0xffff;
    }
    return 0;
  };
  return {
    advanceEm(c) {
      const g = glyphOf(c.codePointAt(0)!);
      return g === 0 ? undefined : advanceOfGlyph(g) / unitsPerEm;
    },
  };
}
