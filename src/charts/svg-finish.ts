// Turning vega's SVG string into the one zfolio inlines in pages and PDFs:
//  - accessible: role="img", a <title> and a <desc> named by aria-labelledby (WAI-ARIA 1.2 "img" role;
//    SVG 2 §5.9 title and desc);
//  - deterministic and collision-free: vega numbers clip paths with a process-wide counter, so ids depend on
//    what was drawn before and repeat across charts on one page. Every id is renamed from a hash of the
//    chart itself, in order of appearance;
//  - self-contained and inert: no class names (page CSS must not restyle a chart), no xlink namespace, and a
//    check that nothing can fetch or run (no script, foreignObject, href or url() outside the chart's ids).

import { sha256Hex } from '../model/sha256.js';
import type { ChartText } from '../present/chart-descriptions.js';
import { escapeXml } from '../present/escape.js';
import { fixedText } from '../units/digits-text.js';
import { slimSvgBody } from './svg-slim.js';

export type { ChartText } from '../present/chart-descriptions.js';

const ROOT = /^<svg\b[^>]*>/;
const TAG = /<[^>]+>/g;
const ID = / id="([^"]+)"/g;
/** A tag's id (a tag has at most one: XML 1.0 §3.1, unique attribute names). */
const TAG_ID = /<[^>]* id="([^"]+)"/g;
const TEXT_CONTENT = />[^<]*</g;
export const VEGA_ATTRIBUTES = / (?:class|role|aria-roledescription|aria-hidden|aria-label|pointer-events)="[^"]*"/g;

/** A short, stable id prefix derived from the chart's content. */
export function idPrefix(content: string): string {
  return 'zc' + sha256Hex(content).slice(0, 10);
}

/**
 * The start of the plot's content in vega's SVG: the root group's view (its origin the plot's top-left
 * corner) after its background, before the axes and marks it holds.
 */
const PLOT_CONTENT = /<g class="mark-group role-frame root"[^>]*><g transform="translate\(0,0\)"><path class="background"[^>]*\/><g>/;

/**
 * The finished SVG. `size` is the chart's outer size in px; the viewBox keeps that coordinate system so the
 * chart scales to its container (the page sets the displayed width). `underlay` (markup in the plot's px,
 * such as the grid) is drawn first in the plot, under the axes and every mark.
 */
export function finishSvg(raw: string, text: ChartText, size: { width: number; height: number }, underlay = ''): string {
  const root = ROOT.exec(raw);
  if (!root || !raw.endsWith('</svg>')) throw new Error('vega produced no SVG document');
  if (underlay !== '') {
    const plot = PLOT_CONTENT.exec(raw);
    if (!plot) throw new Error('vega’s SVG has no plot to draw the underlay in');
    const at = plot.index + plot[0].length;
    raw = raw.slice(0, at) + underlay + raw.slice(at);
  }
  // Text content cannot hold '<' or '>' (vega escapes them), so every match of TAG is markup: attributes
  // are edited and checked there only, and text from a library file is never touched or misread.
  const slim = slimSvgBody(raw.slice(root[0].length, -'</svg>'.length), (tag) => roundNumbers(tag.replace(VEGA_ATTRIBUTES, '')));
  let body = slim.body;
  const ids = new Map<string, string>();
  for (const m of body.matchAll(TAG_ID)) if (!ids.has(m[1])) ids.set(m[1], '');
  inertOrThrow(body);

  // vega's ids count across the process; number them in order of appearance before anything depends on them.
  if (ids.size > 0) {
    let k = 0;
    for (const id of ids.keys()) ids.set(id, `@${++k}@`);
    body = body.replace(TAG, (tag) =>
      tag.includes('id="') || tag.includes('url(#')
        ? tag.replace(ID, (_, id: string) => ` id="${ids.get(id)}"`).replace(/url\(#([^)]+)\)/g, (_, id: string) => {
            const to = ids.get(id);
            if (to === undefined) throw new Error(`chart SVG refers to an undefined id ${id}`);
            return `url(#${to})`;
          })
        : tag,
    );
  }
  const prefix = idPrefix(body + '\u0000' + text.title + '\u0000' + text.description);
  if (ids.size > 0) body = body.replace(TAG, (tag) => tag.replace(/@(\d+)@/g, (_, k: string) => `${prefix}-${k}`));
  return finishedDocument(body, prefix, slim.fontFamily, text, size);
}

/** The finished document around a finished body: the root element, the title and the description. */
export function finishedDocument(body: string, prefix: string, fontFamily: string | undefined, text: ChartText, size: { width: number; height: number }): string {
  const w = round(size.width);
  const h = round(size.height);
  const titleId = `${prefix}-title`;
  const descId = `${prefix}-desc`;
  return latin1(
    `<svg xmlns="http://www.w3.org/2000/svg" width="${w}" height="${h}" viewBox="0 0 ${w} ${h}" role="img" aria-labelledby="${titleId} ${descId}"${fontFamily === undefined ? '' : ` font-family="${fontFamily}"`}>` +
      `<title id="${titleId}">${escapeXml(text.title)}</title>` +
      `<desc id="${descId}">${escapeXml(text.description)}</desc>` +
      body +
      '</svg>',
  );
}

/**
 * Characters beyond Latin-1 (Ω, −, →) as numeric character references (XML 1.0 §4.1, and HTML, where the
 * SVG is inlined): the same text on screen and to a screen reader. A chart's SVG string then holds one
 * byte a character in V8 rather than two, and a build holds every part's charts until its pages are
 * rendered; a few such characters a chart cost a few bytes on disk.
 */
function latin1(svg: string): string {
  // A surrogate pair is one character (its code point); the search is not Unicode-aware, which costs three
  // times as much and finds the same.
  return svg.replace(/[\ud800-\udbff][\udc00-\udfff]|[^\x00-\xff]/g, (c) => `&#${c.codePointAt(0)};`);
}

/** assertInert on a chart's body, its text content left out (text cannot hold '<' or '>': vega escapes them). */
export function inertOrThrow(body: string): void {
  assertInert(body.replace(TEXT_CONTENT, '><'));
}

/**
 * Throw if markup (text content already removed) could run or load anything: a bug in a chart, never a
 * user error.
 */
export function assertInert(markup: string): void {
  const found = /<\/?(?:script|foreignObject|image|a|style|iframe|use)\b|\shref=|\son[a-z]+=|url\((?!#)|@import/i.exec(markup);
  if (found) throw new Error(`chart SVG holds an active or external reference: ${found[0]}`);
}

/**
 * Coordinates to 1 decimal: a tenth of a px is 0.075 pt (26 µm) on paper and 0.15 device px where a chart
 * is shown largest (a 332 px chart at 500 px), below what either shows; curves are already thinned to
 * 0.15 px (simplify.ts). vega writes some numbers with 15 decimals, which costs bytes and nothing else.
 */
export function roundNumbers(tag: string): string {
  // fixedText writes what String(Number(x.toFixed(1))) does, a rounded zero (-0 too) as "0".
  return tag.replace(/-?\d+\.\d{2,}/g, (n) => fixedText(Number(n), 1));
}

function round(v: number): number {
  return Math.round(v * 100) / 100;
}
