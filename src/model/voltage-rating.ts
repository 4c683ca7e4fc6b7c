// A part's voltage rating and its kind: "16V" (DC, the usual reading for ordinary parts), "400V DC",
// "310V AC" (r.m.s., as mains parts are rated), or both as a list: [310V AC, 630V DC].
// An AC rating is not a DC rating: its peak is √2 times the r.m.s. value, and a part rated for AC alone
// states nothing about DC.

import { isSeq, type Node, type YAMLSeq } from 'yaml';
import { formatEng } from '../units/format.js';
import { parseQuantity } from '../units/parse.js';
import { quote } from '../units/quote.js';
import { inRange, rangeText } from '../units/ranges.js';
import { describeNode, scalarText, type Fields } from './fields.js';
import { positionOf } from './source.js';

export type VoltageKind = 'DC' | 'AC';

export interface VoltageRating {
  /** Volts: the DC value, or the r.m.s. value of an AC rating. */
  volts: number;
  kind: VoltageKind;
  /** False for a bare value ("16V"), read as DC. */
  stated: boolean;
}

export type ParsedRating = { ok: true; rating: VoltageRating } | { ok: false; message: string };

const EXPECTED = 'a voltage rating such as 16V, 400V DC or 310V AC';

// The kind after the value: AC, DC (any case, with or without a space, "VAC" too), or the IEC 60417 signs
// ~ (alternating current) and ⎓ (direct current) as parts are marked.
const KIND_SUFFIX = /^(.*?)\s*(AC|DC|~|⎓)$/i;

/** Parse one rating: "16V", "400 V DC", "310VAC", "310 V~". */
export function parseVoltageRating(text: string): ParsedRating {
  const trimmed = text.trim();
  const m = KIND_SUFFIX.exec(trimmed);
  const kind: VoltageKind = m ? (/^(AC|~)$/i.test(m[2]) ? 'AC' : 'DC') : 'DC';
  const value = m ? m[1] : trimmed;
  if (/r\.?m\.?s\.?$|peak$|pk$/i.test(value)) {
    return { ok: false, message: `expected ${EXPECTED} (an AC rating is read as r.m.s.), found ${quote(text)}` };
  }
  const parsed = parseQuantity(value, 'voltage');
  if (!parsed.ok) {
    // Without a kind the value reads as any voltage does (and keeps its hint, e.g. "a current, in A").
    if (!m) return parsed;
    const found = quote(value);
    const hint = parsed.message.includes(found) ? parsed.message.slice(parsed.message.indexOf(found) + found.length) : '';
    return { ok: false, message: `expected ${EXPECTED}, found ${quote(text)}${hint}` };
  }
  if (!(parsed.value > 0)) return { ok: false, message: `expected a voltage rating greater than zero, found ${quote(text)}` };
  if (!inRange(parsed.value, 'voltage')) return { ok: false, message: `expected a voltage rating ${rangeText('voltage')}, the range zfolio computes with, found ${quote(text)}` };
  return { ok: true, rating: { volts: parsed.value, kind, stated: m !== null } };
}

/** "310 V AC", "400 V DC", "16 V" (a bare DC rating stays as it was written). */
export function formatVoltageRating(r: VoltageRating): string {
  const value = formatEng(r.volts, 'voltage');
  return r.stated || r.kind === 'AC' ? `${value} ${r.kind}` : value;
}

/** Read `voltage` from a part's fields: one rating, or a list of at most one of each kind. */
export function readVoltageRatings(root: Fields): VoltageRating[] {
  if (!root.has('voltage')) return [];
  const node = root.valueNode('voltage');
  const items: (Node | null)[] = isSeq(node) ? (node as YAMLSeq<Node | null>).items : [node ?? null];
  if (isSeq(node) && items.length === 0) {
    root.error('voltage', `expected ${EXPECTED}, or a list of them such as [310V AC, 630V DC], found an empty list`);
    return [];
  }
  const out: VoltageRating[] = [];
  for (const item of items) {
    const at = positionOf(root.ctx.source, item ?? node);
    const text = scalarText(item);
    if (text === undefined) {
      root.ctx.diagnostics.error(at, `${root.label('voltage')}: expected ${EXPECTED}, found ${describeNode(item)}`);
      continue;
    }
    const parsed = parseVoltageRating(text);
    if (!parsed.ok) {
      root.ctx.diagnostics.error(at, `${root.label('voltage')}: ${parsed.message}`);
      continue;
    }
    if (out.some((r) => r.kind === parsed.rating.kind)) {
      root.ctx.diagnostics.error(at, `${root.label('voltage')}: a second ${parsed.rating.kind} rating; give at most one AC and one DC rating`);
      continue;
    }
    out.push(parsed.rating);
  }
  return out;
}
