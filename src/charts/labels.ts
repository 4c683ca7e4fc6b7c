// Placing short labels next to marked points (resonances, decade marks, rail peaks) so that they stay inside
// the plot and clear of each other and of the curves. Greedy, in priority order: each label takes the first
// of its candidate positions that collides with nothing, trying its shorter wording (when it has one) only
// where the full one fits nowhere, then each wording centred above or below its point slid sideways (the
// point still over the words); a label that must be shown takes the position with the least overlap
// instead, others are dropped (their point stays).

import { textWidth } from './text-width.js';

export type Align = 'left' | 'center' | 'right';
export type Baseline = 'top' | 'middle' | 'bottom';

export interface Placement {
  dx: number;
  dy: number;
  align: Align;
  baseline: Baseline;
}

/** Where a label went, and which of its wordings it shows there. */
export interface PlacedLabel extends Placement {
  text: string;
}

export interface LabelRequest {
  /** Anchor in px from the plot's top-left corner. */
  x: number;
  y: number;
  text: string;
  /** A shorter wording ("190 MHz" for "series 190 MHz"), tried at every position where the full text collides. */
  shortText?: string;
  fontSize: number;
  /** Shown even when every position collides. */
  required?: boolean;
  candidates?: Placement[];
  /**
   * Lines this label alone keeps clear of, by `clearance` px (default CLEARANCE, as from every obstacle; 0:
   * it may come up to them, not across).
   */
  lines?: { obstacles: readonly Obstacle[]; clearance?: number };
}

/** A polyline in px that labels should not cover. */
export interface Obstacle {
  xs: ArrayLike<number>;
  ys: ArrayLike<number>;
}

interface Box {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

const GAP = 5;

/** How far a label above or below its point may be moved sideways to stay inside the plot, px. */
const NUDGE = 6;

/** How far inside a slid label's ends its point stays, px (slidPlace). */
const SLIDE_KEEP = 4;

/** Right, left, above, below, then the diagonals. */
export const AROUND: Placement[] = [
  { dx: GAP + 2, dy: 0, align: 'left', baseline: 'middle' },
  { dx: -GAP - 2, dy: 0, align: 'right', baseline: 'middle' },
  { dx: 0, dy: -GAP - 1, align: 'center', baseline: 'bottom' },
  { dx: 0, dy: GAP + 1, align: 'center', baseline: 'top' },
  { dx: GAP, dy: -GAP, align: 'left', baseline: 'bottom' },
  { dx: GAP, dy: GAP, align: 'left', baseline: 'top' },
  { dx: -GAP, dy: -GAP, align: 'right', baseline: 'bottom' },
  { dx: -GAP, dy: GAP, align: 'right', baseline: 'top' },
];

/** For a dip (series resonance): below first, then beside, then above. */
export const BELOW_FIRST: Placement[] = [
  { dx: 0, dy: 8, align: 'center', baseline: 'top' },
  { dx: 7, dy: 5, align: 'left', baseline: 'top' },
  { dx: -7, dy: 5, align: 'right', baseline: 'top' },
  { dx: 7, dy: 0, align: 'left', baseline: 'middle' },
  { dx: -7, dy: 0, align: 'right', baseline: 'middle' },
  { dx: 0, dy: -8, align: 'center', baseline: 'bottom' },
  // Further out, clear of a second curve passing close by.
  { dx: 7, dy: 16, align: 'left', baseline: 'top' },
  { dx: -7, dy: 16, align: 'right', baseline: 'top' },
  { dx: 0, dy: 20, align: 'center', baseline: 'top' },
  { dx: 0, dy: -20, align: 'center', baseline: 'bottom' },
];

/** For a peak (parallel resonance): above first, then beside, then below. */
export const ABOVE_FIRST: Placement[] = [
  { dx: 0, dy: -8, align: 'center', baseline: 'bottom' },
  { dx: 7, dy: -5, align: 'left', baseline: 'bottom' },
  { dx: -7, dy: -5, align: 'right', baseline: 'bottom' },
  { dx: 7, dy: 0, align: 'left', baseline: 'middle' },
  { dx: -7, dy: 0, align: 'right', baseline: 'middle' },
  { dx: 0, dy: 8, align: 'center', baseline: 'top' },
  { dx: 7, dy: -16, align: 'left', baseline: 'bottom' },
  { dx: -7, dy: -16, align: 'right', baseline: 'bottom' },
  { dx: 0, dy: -20, align: 'center', baseline: 'bottom' },
  { dx: 0, dy: 20, align: 'center', baseline: 'top' },
];

function boxOf(r: LabelRequest, p: Placement, text = r.text): Box {
  const w = textWidth(text, r.fontSize);
  const h = r.fontSize * 1.15;
  const x = r.x + p.dx;
  const y = r.y + p.dy;
  const x0 = p.align === 'left' ? x : p.align === 'right' ? x - w : x - w / 2;
  const y0 = p.baseline === 'top' ? y : p.baseline === 'bottom' ? y - h : y - h / 2;
  return { x0, y0, x1: x0 + w, y1: y0 + h };
}

function overlapArea(a: Box, b: Box): number {
  const w = Math.min(a.x1, b.x1) - Math.max(a.x0, b.x0);
  const h = Math.min(a.y1, b.y1) - Math.max(a.y0, b.y0);
  return w > 0 && h > 0 ? w * h : 0;
}

/** Does the segment (ax, ay)–(bx, by) cross the box? Liang–Barsky clipping. */
export function segmentHitsBox(ax: number, ay: number, bx: number, by: number, box: Box): boolean {
  let t0 = 0;
  let t1 = 1;
  const dx = bx - ax;
  const dy = by - ay;
  const edges: [number, number][] = [
    [-dx, ax - box.x0],
    [dx, box.x1 - ax],
    [-dy, ay - box.y0],
    [dy, box.y1 - ay],
  ];
  for (const [p, q] of edges) {
    if (p === 0) {
      if (q < 0) return false;
    } else {
      const t = q / p;
      if (p < 0) {
        if (t > t1) return false;
        if (t > t0) t0 = t;
      } else {
        if (t < t0) return false;
        if (t < t1) t1 = t;
      }
    }
  }
  return true;
}

/**
 * Room kept between a label and a line, px: a box that merely touches a line reads as struck through once
 * the glyphs' own overhang and the line's width are drawn.
 */
const CLEARANCE = 2.5;

/** How many segments of `obstacles` come within `clearance` of the box; with `first`, stops at one. */
function hitsObstacles(tight: Box, obstacles: readonly Obstacle[], clearance = CLEARANCE, first = false): number {
  const box = { x0: tight.x0 - clearance, y0: tight.y0 - clearance, x1: tight.x1 + clearance, y1: tight.y1 + clearance };
  let hits = 0;
  for (const o of obstacles) {
    for (let i = 1; i < o.xs.length; i++) {
      const ax = o.xs[i - 1];
      const ay = o.ys[i - 1];
      const bx = o.xs[i];
      const by = o.ys[i];
      if (!Number.isFinite(ax + ay + bx + by)) continue;
      if (Math.max(ax, bx) < box.x0 || Math.min(ax, bx) > box.x1 || Math.max(ay, by) < box.y0 || Math.min(ay, by) > box.y1) continue;
      if (segmentHitsBox(ax, ay, bx, by, box)) {
        hits++;
        if (first) return hits;
      }
    }
  }
  return hits;
}

/**
 * A placement for each request (null: not shown). `plot` is the plot size in px; labels keep a margin
 * of 2 px inside it. Requests are handled in the order given: put the important ones first.
 */
export function placeLabels(
  requests: readonly LabelRequest[],
  plot: { width: number; height: number },
  obstacles: readonly Obstacle[] = [],
  avoid: readonly Box[] = [],
): (PlacedLabel | null)[] {
  const placed: Box[] = [...avoid];
  return requests.map((r) => {
    const short = r.shortText;
    const chosen =
      freePlace(r, r.text) ??
      (short !== undefined ? freePlace(r, short) : null) ??
      slidPlace(r, r.text) ??
      (short !== undefined ? slidPlace(r, short) : null) ??
      (r.required ? leastCovering(r) : null);
    if (chosen === null) return null;
    placed.push(boxOf(r, chosen, chosen.text));
    return chosen;
  });

  /** What a placement collides with, weighted. */
  function cost(r: LabelRequest, p: Placement, text: string): number {
    const box = boxOf(r, p, text);
    const outside = Math.max(0, 2 - box.x0) + Math.max(0, box.x1 - plot.width + 2) + Math.max(0, 2 - box.y0) + Math.max(0, box.y1 - plot.height + 2);
    let c = outside * 1000;
    for (const q of placed) c += overlapArea(box, q) * 10;
    const lines = r.lines ? hitsObstacles(box, r.lines.obstacles, r.lines.clearance) : 0;
    return c + (hitsObstacles(box, obstacles) + lines) * 50;
  }
  /**
   * Whether a placement collides with nothing (its cost is 0), asked the cheap ways first and stopping at the
   * first collision. Binding a part's four charts (the demo's 38 parts, ten rounds) took 3.9 ms with labels
   * slid (slidPlace) and every collision counted, 2.4 to 2.6 ms this way, 2.7 ms before labels were slid.
   */
  function free(r: LabelRequest, p: Placement, text: string): boolean {
    const box = boxOf(r, p, text);
    if (box.x0 < 2 || box.x1 > plot.width - 2 || box.y0 < 2 || box.y1 > plot.height - 2) return false;
    for (const q of placed) if (overlapArea(box, q) > 0) return false;
    if (r.lines && hitsObstacles(box, r.lines.obstacles, r.lines.clearance, true) > 0) return false;
    return hitsObstacles(box, obstacles, CLEARANCE, true) === 0;
  }
  /** The first candidate where `text` collides with nothing (nudged inside the plot, see nudged()). */
  function freePlace(r: LabelRequest, text: string): PlacedLabel | null {
    for (const candidate of r.candidates ?? AROUND) {
      const p = nudged(r, candidate, text);
      if (free(r, p, text)) return { ...p, text };
    }
    return null;
  }
  /**
   * Where no candidate is free: a label centred above or below its point slid sideways, 2 px at a time, as
   * far as keeps the point over the words (SLIDE_KEEP px inside their ends), nearest first. A resonance near
   * the plot's end with a band edge just before it leaves no room for the label centred, but some beside.
   */
  function slidPlace(r: LabelRequest, text: string): PlacedLabel | null {
    const reach = textWidth(text, r.fontSize) / 2 - SLIDE_KEEP;
    for (let shift = 2; shift <= reach; shift += 2) {
      for (const candidate of r.candidates ?? AROUND) {
        if (candidate.align !== 'center' || candidate.baseline === 'middle') continue;
        for (const sign of [1, -1]) {
          const p = { ...candidate, dx: candidate.dx + sign * shift };
          if (free(r, p, text)) return { ...p, text };
        }
      }
    }
    return null;
  }
  /**
   * A label above or below its point that sticks out of the plot's side by at most NUDGE px, moved back in
   * (its point stays under or over it); any other placement as it is. Beside a point (middle baseline) a
   * move would put the text over the point, so those stay.
   */
  function nudged(r: LabelRequest, p: Placement, text: string): Placement {
    if (p.baseline === 'middle') return p;
    const box = boxOf(r, p, text);
    const left = 2 - box.x0;
    const right = box.x1 - (plot.width - 2);
    if (left > 0 && left <= NUDGE && right + left <= 0) return { ...p, dx: p.dx + left };
    if (right > 0 && right <= NUDGE && left + right <= 0) return { ...p, dx: p.dx - right };
    return p;
  }
  /** For a label that must be shown: its full wording where it covers least. */
  function leastCovering(r: LabelRequest): PlacedLabel | null {
    let best: { p: Placement; c: number } | null = null;
    for (const p of r.candidates ?? AROUND) {
      const c = cost(r, p, r.text);
      if (best === null || c < best.c) best = { p, c };
    }
    return best && { ...best.p, text: r.text };
  }
}

/** The box a placed label covers (in the wording it was placed with), for callers that keep other marks clear of it. */
export function labelBox(r: LabelRequest, p: Placement | PlacedLabel): Box {
  return boxOf(r, p, 'text' in p ? p.text : r.text);
}
