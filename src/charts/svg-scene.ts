// A chart's finished SVG written straight from vega's scene graph: the same bytes as vega's SVG string
// (`view.toSVG()`) put through `finishSvg` (svg-finish.ts, svg-slim.ts), without vega's whole string and
// the passes over it. vega's own string renderer still walks the scene and computes every element's
// attributes (its `mark` method, so every mark kind is written as vega writes it); the markup it is handed
// here finishes each element as it is closed:
//  - the attributes svg-finish drops are never written, every other value is escaped as vega escapes it,
//    its numbers rounded (`roundNumbers`) and an initial value left out (`withoutDefaults`);
//  - the font family is taken off every tag and said once on the root;
//  - an element that draws nothing is dropped when it is closed (its children are final then), a group of
//    lines drawn alike becomes one path (`mergedLines`), and clip paths with the same rectangle are written
//    once, numbered in the order they are first used, which is the order vega writes them;
//  - the underlay is written first in the plot, where finishSvg puts it, then the marks drawn without the
//    dataflow (the axes, axis-scene.ts), by vega's renderer through this same markup.
// Whatever this writer is not sure to write as finishSvg would (a gradient, a link, several font families,
// a group with a fill, text holding "@" or "url(#", a plot it cannot find for the underlay) makes it
// return undefined, and the caller takes vega's string and finishSvg. test/charts/svg-scene.test.ts
// compares the two on every chart kind.

import type { View } from 'vega';
import { attrText, innerText, Renderer, type AttrSet, type Markup, type StringRenderer } from './scene-markup.js';
import { finishedDocument, idPrefix, inertOrThrow, roundNumbers, VEGA_ATTRIBUTES } from './svg-finish.js';
import { mergedLines, withoutDefaults } from './svg-slim.js';
import type { ChartText } from './svg-finish.js';

/** What vega's view keeps privately and its SVG renderer is sized from (vega-view's renderHeadless). */
interface ViewInternals {
  _viewWidth: number;
  _viewHeight: number;
  _origin: [number, number];
}

const DROPPED = new Set(['class', 'role', 'aria-roledescription', 'aria-hidden', 'aria-label', 'pointer-events']);
/** A path that draws nothing (svg-slim's rules), matched on its attributes once finished. */
const EMPTY_PATH = new Set([' d=""', ' d="" display="none"', ' d="M0,0h0v0h0Z"']);
/** A group's background with no fill or stroke of its own: nothing under the chart's fill="none". */
const BARE_BACKGROUND = /^ d="M0,0h[\d.]+v[\d.]+h-[\d.]+Z"$/;
const ONLY_TRANSFORM = /^ transform="[^"]*"$/;
const CLIP_URL = /^url\(#([^)]+)\)$/;
const UNDERLAY = /^(?:<path [^>]*\/>)*$/;

interface Element {
  tag: string;
  attrs: string;
  content: string;
  /** Whether a child element was opened (vega then closes with an end tag, else with "/>"). */
  child: boolean;
}

/** Where the plot's content group is, to write the underlay first in it (svg-finish's PLOT_CONTENT). */
const enum Plot {
  Root,
  Item,
  Background,
  Content,
  Found,
  Missing,
}

class FinishingMarkup implements Markup {
  private readonly stack: Element[] = [];
  private top: Element = { tag: '', attrs: '', content: '', child: false };
  readonly families = new Set<string>();
  /** Each clip path's finished content, in the order first used; a clip's number is its index + 1. */
  readonly clips: string[] = [];
  private readonly clipNumbers = new Map<string, number>();
  /** Set when this writer cannot promise finishSvg's bytes. */
  unsure = false;
  private plot = Plot.Root;
  private plotElement: Element | undefined;
  private plotFilled = false;
  private backgroundClosed = 0;

  constructor(
    private readonly renderer: StringRenderer,
    private readonly underlay: string,
    /** Scene marks written after the underlay, by vega's renderer (the axes, axis-scene.ts). */
    private readonly over: readonly object[] = [],
  ) {
    if (underlay === '' && over.length === 0) this.plot = Plot.Found;
  }

  open(tag: string, ...sets: AttrSet[]): Markup {
    if (this.top === this.plotElement) this.plotFilled = true;
    this.top.child = true;
    if (this.plot < Plot.Found && this.stack.length > 0) this.findPlot(tag, sets);
    let attrs = '';
    for (const set of sets) {
      if (set == null) continue;
      for (const name in set) {
        const value = set[name];
        if (value == null || DROPPED.has(name)) continue;
        let v = attrText(value + '');
        if (v.includes('.')) v = roundNumbers(v);
        if (name === 'font-family') {
          this.families.add(v);
          continue;
        }
        if ((name === 'opacity' && v === '1') || (name === 'stroke-miterlimit' && v === '4') || (name === 'stroke-dasharray' && v === '')) continue;
        if (name === 'clip-path') v = this.clipRef(v);
        else if (name === 'fill' && tag === 'g' && v !== 'none') this.unsure = true;
        else if (name === 'id' || v.includes('url(')) this.unsure = true;
        attrs += ` ${name}="${v}"`;
      }
    }
    this.stack.push(this.top);
    this.top = { tag, attrs, content: '', child: false };
    if (this.plot === Plot.Found && this.plotElement === undefined && (this.underlay !== '' || this.over.length > 0)) {
      this.plotElement = this.top;
      this.top.content = finishedUnderlay(this.underlay);
      this.top.child = true;
      for (const scene of this.over) this.renderer.mark(this, scene);
      this.plotFilled = false;
    }
    return this;
  }

  close(): Markup {
    const e = this.top;
    this.top = this.stack.pop()!;
    if (e === this.plotElement && !this.plotFilled) this.unsure = true;
    // PLOT_CONTENT's tags follow each other: the one element closed on the way is the background path.
    if (this.plot === Plot.Item || this.plot === Plot.Background || (this.plot === Plot.Content && e.tag !== 'path')) this.plot = Plot.Missing;
    if (this.plot === Plot.Content) this.backgroundClosed++;
    if (this.backgroundClosed > 1) this.plot = Plot.Missing;
    if (this.plot === Plot.Missing) this.unsure = true;
    this.top.content += finishedElement(e);
    return this;
  }

  text(t: unknown): Markup {
    const s = t + '';
    if (this.top.child || s.includes('@') || s.includes('url(#')) this.unsure = true;
    this.top.content += innerText(s);
    return this;
  }

  /** The markup written so far (at the end: the whole body). */
  body(): string {
    return this.top.content;
  }

  /** Whether the underlay found its plot (always, when there is none). */
  placed(): boolean {
    return this.plot === Plot.Found && ((this.underlay === '' && this.over.length === 0) || this.plotElement !== undefined);
  }

  /**
   * Follows vega's opening tags to the plot's content group: the root group's items' group, its
   * background, then the group of its content, each as svg-finish's PLOT_CONTENT expects it.
   */
  private findPlot(tag: string, sets: AttrSet[]): void {
    const named = namedAttributes(sets);
    const only = (name: string, value: string) => named.length === 1 && named[0][0] === name && named[0][1] === value;
    const step = (ok: boolean, next: Plot) => (this.plot = ok ? next : Plot.Missing);
    if (this.plot === Plot.Root) step(tag === 'g' && named[0]?.[0] === 'class' && named[0][1] === 'mark-group role-frame root', Plot.Item);
    else if (this.plot === Plot.Item) step(tag === 'g' && only('transform', 'translate(0,0)'), Plot.Background);
    else if (this.plot === Plot.Background) step(tag === 'path' && named[0]?.[0] === 'class' && named[0][1] === 'background', Plot.Content);
    else if (this.plot === Plot.Content) step(tag === 'g' && named.length === 0, Plot.Found);
    if (this.plot === Plot.Missing) this.unsure = true;
  }

  /** A reference to a clip path, by its number among the distinct clip paths (a placeholder for its id). */
  private clipRef(url: string): string {
    const m = CLIP_URL.exec(url);
    const def = m ? this.renderer._defs.clipping[m[1]] : undefined;
    if (!def || def.path === '') {
      this.unsure = true;
      return url;
    }
    const content = def.path !== undefined ? `<path d="${finishedValue(def.path)}"/>` : `<rect x="0" y="0" width="${finishedValue(def.width ?? 0)}" height="${finishedValue(def.height ?? 0)}"/>`;
    let k = this.clipNumbers.get(content);
    if (k === undefined) {
      this.clips.push(content);
      this.clipNumbers.set(content, (k = this.clips.length));
    }
    return `url(#@${k}@)`;
  }
}

function finishedValue(value: unknown): string {
  const v = attrText(value + '');
  return v.includes('.') ? roundNumbers(v) : v;
}

/** The non-empty attributes of an opening tag, as vega writes them (before any is finished). */
function namedAttributes(sets: AttrSet[]): [string, string][] {
  const out: [string, string][] = [];
  for (const set of sets) {
    if (set == null) continue;
    for (const name in set) if (set[name] != null) out.push([name, set[name] + '']);
  }
  return out;
}

/** An element once its children are final: dropped if it draws nothing, a group of like lines merged. */
function finishedElement(e: Element): string {
  if (e.tag === 'path' && e.content === '' && !e.child && (EMPTY_PATH.has(e.attrs) || BARE_BACKGROUND.test(e.attrs))) return '';
  if (e.tag === 'g' && e.content === '' && (e.attrs === '' || ONLY_TRANSFORM.test(e.attrs))) return '';
  if (!e.child && e.content === '') return `<${e.tag}${e.attrs}/>`;
  const whole = `<${e.tag}${e.attrs}>${e.content}</${e.tag}>`;
  return e.tag === 'g' && e.attrs === '' && e.content.startsWith('<line ') ? mergedLines(whole) : whole;
}

/** The underlay's tags finished as svg-finish finishes vega's (it holds paths only, else undefined). */
function finishedUnderlay(underlay: string): string {
  return underlay.replace(/<[^>]+>/g, (tag) => {
    const edited = withoutDefaults(roundNumbers(tag.replace(VEGA_ATTRIBUTES, '')));
    const attrs = edited.slice('<path'.length, -'/>'.length);
    return EMPTY_PATH.has(attrs) || BARE_BACKGROUND.test(attrs) ? '' : edited;
  });
}

/**
 * The finished SVG of what `view` shows now (after its run), or undefined when it must be written by
 * vega's `toSVG` and `finishSvg` instead. Arguments as finishSvg's.
 */
export function sceneSvg(view: View, text: ChartText, size: { width: number; height: number }, underlay = '', over: readonly object[] = []): string | undefined {
  if (underlay !== '' && (!UNDERLAY.test(underlay) || /font-family=| id=|url\(/.test(underlay))) return undefined;
  const internals = view as unknown as ViewInternals;
  const pad = view.padding() as { left: number; right: number; top: number; bottom: number };
  const width = Math.max(0, internals._viewWidth + pad.left + pad.right);
  const height = Math.max(0, internals._viewHeight + pad.top + pad.bottom);
  const origin = [pad.left + internals._origin[0], pad.top + internals._origin[1]];
  const renderer = new Renderer(view.loader()).initialize(null, width, height, origin, 1);
  const m = new FinishingMarkup(renderer, underlay, over);
  renderer.href = (item) => {
    if (item.href) m.unsure = true;
    return null;
  };
  // vega-scenegraph's SVGStringRenderer._render, with the outer <svg> written by finishedDocument.
  const bg = view.background() as unknown as string | null | undefined;
  if (bg && bg !== 'transparent' && bg !== 'none') m.open('rect', { width, height, fill: bg }).close();
  m.open('g', { fill: 'none', 'stroke-miterlimit': 4 }, { transform: 'translate(' + origin + ')' });
  renderer.mark(m, (view.scenegraph() as unknown as { root: unknown }).root);
  m.close();
  if (m.unsure || !m.placed() || m.families.size > 1 || Object.keys(renderer._defs.gradient).length > 0) return undefined;
  let body = m.body();
  if (m.clips.length > 0) body += '<defs>' + m.clips.map((c, i) => `<clipPath id="@${i + 1}@">${c}</clipPath>`).join('') + '</defs>';
  inertOrThrow(body);
  const prefix = idPrefix(body + '\u0000' + text.title + '\u0000' + text.description);
  if (m.clips.length > 0) body = body.replace(/@(\d+)@/g, (_, k: string) => `${prefix}-${k}`);
  return finishedDocument(body, prefix, m.families.size === 1 ? [...m.families][0] : undefined, text, size);
}

