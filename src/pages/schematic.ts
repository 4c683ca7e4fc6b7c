// A small schematic of a part's model, drawn as SVG from its element tree: series parts in a row,
// parallel parts stacked between two rails. Resistors are drawn as rectangles (IEC 60617 style).

import type { Element } from '../circuit/element.js';
import { formatEng } from '../units/format.js';
import { escapeXml } from '../present/escape.js';
import { textWidth } from '../charts/text-width.js';

interface Drawing {
  /** Wires and symbols (stroked). */
  geometry: string;
  /** Value labels (filled text). */
  labels: string;
}

interface Block {
  width: number;
  height: number;
  /** The block drawn with its origin at (x, y); ports at (0, height/2) and (width, height/2). */
  draw(x: number, y: number): Drawing;
}

const join = (parts: Drawing[]): Drawing => ({ geometry: parts.map((p) => p.geometry).join(''), labels: parts.map((p) => p.labels).join('') });
const wires = (geometry: string): Drawing => ({ geometry, labels: '' });

const LEAF_HEIGHT = 44;
const SYMBOL_WIDTH = 36;
const WIRE = 10;
const RAIL_MARGIN = 10;
const STACK_GAP = 6;
const FONT_SIZE = 10;
/** Room a value label keeps on each side, within its element's width. */
const LABEL_SIDE = 5;
/** The label's baseline, from the top of its element's row; its text's descent ends 2.4 units below it. */
const LABEL_BASELINE = 9;
/** Half the height of a capacitor's plates: their top stays 2.6 units below the label above them. */
const PLATE_HALF = 8;
/** Drawn at 1.5× its user units, so 10-unit labels read as 15 px text. */
const SCALE = 1.5;

const line = (x1: number, y1: number, x2: number, y2: number) => `<path d="M${r(x1)} ${r(y1)}H${r(x2)}${y2 !== y1 ? `V${r(y2)}` : ''}"/>`;
const onGrid = (v: number) => Math.round(v * 10) / 10;
const r = (v: number) => String(onGrid(v));

function symbol(type: Element['type'], cx: number, cy: number): string {
  const half = SYMBOL_WIDTH / 2;
  switch (type) {
    case 'R':
      return `${line(cx - half, cy, cx - 12, cy)}<rect x="${r(cx - 12)}" y="${r(cy - 5)}" width="24" height="10"/>${line(cx + 12, cy, cx + half, cy)}`;
    case 'L': {
      const arcs = [0, 1, 2, 3].map(() => 'a3 3 0 0 1 6 0').join('');
      return `${line(cx - half, cy, cx - 12, cy)}<path d="M${r(cx - 12)} ${r(cy)}${arcs}"/>${line(cx + 12, cy, cx + half, cy)}`;
    }
    case 'C':
      return `${line(cx - half, cy, cx - 3, cy)}<path d="M${r(cx - 3)} ${r(cy - PLATE_HALF)}V${r(cy + PLATE_HALF)}M${r(cx + 3)} ${r(cy - PLATE_HALF)}V${r(cy + PLATE_HALF)}"/>${line(cx + 3, cy, cx + half, cy)}`;
    default:
      return '';
  }
}

const UNIT = { R: 'resistance', L: 'inductance', C: 'capacitance' } as const;

function leaf(element: Element & { type: 'R' | 'L' | 'C' }, name: string): Block {
  const value = element.type === 'R' ? element.ohms : element.type === 'L' ? element.henries : element.farads;
  const label = `${name} ${formatEng(value, UNIT[element.type])}`;
  // textWidth errs wide for the sans-serif fonts pages use, so the label clears the rails beside it.
  const width = Math.max(SYMBOL_WIDTH + 2 * WIRE, textWidth(label, FONT_SIZE) + 2 * LABEL_SIDE);
  return {
    width,
    height: LEAF_HEIGHT,
    draw(x, y) {
      // The symbol's centre on the 0.1-unit grid the numbers are written to, so that its pieces, each placed
      // from the centre, meet exactly (a rectangle's side and its lead rounded apart left a 0.1-unit gap).
      const cy = onGrid(y + LEAF_HEIGHT / 2);
      const cx = onGrid(x + width / 2);
      return {
        geometry: `${line(x, cy, cx - SYMBOL_WIDTH / 2, cy)}${symbol(element.type, cx, cy)}${line(cx + SYMBOL_WIDTH / 2, cy, x + width, cy)}`,
        labels: `<text x="${r(cx)}" y="${r(y + LABEL_BASELINE)}">${escapeXml(label)}</text>`,
      };
    },
  };
}

function seriesBlock(children: Block[]): Block {
  const width = children.reduce((sum, c) => sum + c.width, 0) + WIRE * (children.length - 1);
  const height = Math.max(...children.map((c) => c.height));
  return {
    width,
    height,
    draw(x, y) {
      const out: Drawing[] = [];
      let cx = x;
      children.forEach((c, i) => {
        if (i > 0) {
          out.push(wires(line(cx, y + height / 2, cx + WIRE, y + height / 2)));
          cx += WIRE;
        }
        out.push(c.draw(cx, y + (height - c.height) / 2));
        cx += c.width;
      });
      return join(out);
    },
  };
}

function parallelBlock(children: Block[]): Block {
  const inner = Math.max(...children.map((c) => c.width));
  const width = inner + 2 * RAIL_MARGIN;
  const height = children.reduce((sum, c) => sum + c.height, 0) + STACK_GAP * (children.length - 1);
  return {
    width,
    height,
    draw(x, y) {
      const out: Drawing[] = [];
      let cy = y;
      const mids: number[] = [];
      for (const c of children) {
        const cx = x + RAIL_MARGIN + (inner - c.width) / 2;
        const mid = cy + c.height / 2;
        mids.push(mid);
        out.push(wires(line(x + RAIL_MARGIN, mid, cx, mid)), c.draw(cx, cy), wires(line(cx + c.width, mid, x + width - RAIL_MARGIN, mid)));
        cy += c.height + STACK_GAP;
      }
      const top = mids[0];
      const bottom = mids[mids.length - 1];
      const midY = y + height / 2;
      out.push(
        wires(`<path d="M${r(x + RAIL_MARGIN)} ${r(top)}V${r(bottom)}M${r(x + width - RAIL_MARGIN)} ${r(top)}V${r(bottom)}"/>`),
        wires(line(x, midY, x + RAIL_MARGIN, midY) + line(x + width - RAIL_MARGIN, midY, x + width, midY)),
      );
      return join(out);
    },
  };
}

/** Leaves without a role name are numbered by type in drawing order: R1, R2, L1, C1. */
function layout(element: Element, counters: Record<string, number>): Block {
  switch (element.type) {
    case 'R':
    case 'L':
    case 'C': {
      counters[element.type] = (counters[element.type] ?? 0) + 1;
      return leaf(element, element.name ?? `${element.type}${counters[element.type]}`);
    }
    case 'series':
      return seriesBlock(element.parts.map((p) => layout(p, counters)));
    case 'parallel':
      return parallelBlock(element.parts.map((p) => layout(p, counters)));
  }
}

/** The schematic as a standalone inline SVG, with terminals drawn as small circles at both ends. */
export function schematicSvg(element: Element, title: string): string {
  const block = layout(element, {});
  const pad = 12;
  const width = block.width + 2 * pad;
  const height = block.height + 2 * 6;
  const mid = 6 + block.height / 2;
  const { geometry, labels } = block.draw(pad, 6);
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" class="schematic" role="img" viewBox="0 0 ${r(width)} ${r(height)}" width="${r(width * SCALE)}" height="${r(height * SCALE)}">` +
    `<title>${escapeXml(title)}</title>` +
    `<g fill="none" stroke="currentColor" stroke-width="1.2">${line(4, mid, pad, mid)}${line(pad + block.width, mid, width - 4, mid)}${geometry}</g>` +
    `<g fill="currentColor" font-family="sans-serif" font-size="${FONT_SIZE}" text-anchor="middle">${labels}</g>` +
    `<circle cx="4" cy="${r(mid)}" r="2.5" fill="#fff" stroke="currentColor"/><circle cx="${r(width - 4)}" cy="${r(mid)}" r="2.5" fill="#fff" stroke="currentColor"/>` +
    `</svg>`
  );
}
