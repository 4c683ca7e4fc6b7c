// vega's SVG string renderer as the chart writers use it: its markup interface, its escaping, and scene marks
// written as its own `markup` writes them (svg-scene.ts finishes what it writes as it goes; finishSvg takes
// this raw form).

import type { View } from 'vega';
import { vega } from './vega-runtime.js';

export type AttrSet = Record<string, unknown> | null | undefined;

export interface Markup {
  open(tag: string, ...sets: AttrSet[]): Markup;
  close(): Markup;
  text(t: unknown): Markup;
}

interface ClipDef {
  path?: string;
  width?: number;
  height?: number;
}

export interface StringRenderer {
  _defs: { gradient: Record<string, unknown>; clipping: Record<string, ClipDef> };
  initialize(el: null, width: number, height: number, origin: number[], scaleFactor: number): StringRenderer;
  mark(m: Markup, scene: unknown): void;
  href(item: { href?: unknown }): unknown;
}

export const Renderer = (vega as unknown as { SVGStringRenderer: new (loader?: unknown) => StringRenderer }).SVGStringRenderer;

const NEEDS_ESCAPE = /[&<>"\t\n\r]/;
const NEEDS_ESCAPE_TEXT = /[&<>]/;

/** vega-scenegraph's escaping of text content and of attribute values (its `innerText` and `attrText`). */
export function innerText(s: string): string {
  return NEEDS_ESCAPE_TEXT.test(s) ? s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;') : s;
}
export function attrText(s: string): string {
  if (!NEEDS_ESCAPE.test(s)) return s;
  return innerText(s).replace(/"/g, '&quot;').replace(/\t/g, '&#x9;').replace(/\n/g, '&#xA;').replace(/\r/g, '&#xD;');
}

/**
 * Scene marks as vega's SVG string renderer writes them (its markup, unfinished): what finishSvg expects
 * among vega's own tags, for marks drawn without its dataflow (the axes, axis-scene.ts).
 */
export function rawSceneMarkup(view: View, scenes: readonly object[]): string {
  const renderer = new Renderer(view.loader()).initialize(null, 0, 0, [0, 0], 1);
  renderer.href = () => null;
  let buf = '';
  let outer = '';
  let inner = '';
  const stack: string[] = [];
  // vega-scenegraph's `markup`: a tag is closed with "/>" when nothing was written inside it.
  const m: Markup = {
    open(tag, ...sets) {
      if (outer) buf += `${outer}>${inner}`;
      outer = inner = '';
      stack.push(tag);
      outer = '<' + tag;
      for (const set of sets) for (const name in set ?? {}) if (set![name] != null) outer += ` ${name}="${attrText(set![name] + '')}"`;
      return m;
    },
    close() {
      const tag = stack.pop();
      buf += outer ? outer + (inner ? `>${inner}</${tag}>` : '/>') : `</${tag}>`;
      outer = inner = '';
      return m;
    },
    text(t) {
      inner += innerText(t + '');
      return m;
    },
  };
  for (const scene of scenes) renderer.mark(m, scene);
  return buf;
}
