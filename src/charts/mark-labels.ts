// Labels beside marked points (resonances, peaks, decade marks, a load step's dip) and notes at fixed places
// in the plot, placed together by labels.ts so that none covers another or a curve, and turned into the rows
// the label layers draw: a point's data position with its text and placement, a note's pixel position.

import { FONT_SIZE } from './palette.js';
import { placeLabels, type LabelRequest, type Obstacle, type Placement } from './labels.js';
import type { Row } from './render.js';

/** A label for a marked point. */
export interface MarkLabel {
  /** The point's data position, as the label layer's rows hold it ({f, v}, or {x, v}). */
  at: Row;
  /** The point in px from the plot's top-left corner. */
  x: number;
  y: number;
  text: string;
  /** A shorter wording, shown where the full text fits nowhere (labels.ts). */
  shortText?: string;
  /** Shown even when every position collides. */
  required?: boolean;
  candidates?: Placement[];
}

/** A note at a pixel anchor (x, y) inside the plot, placed at the first of its candidates that is free. */
export interface PlotNote {
  x: number;
  y: number;
  text: string;
  candidates: Placement[];
}

export interface PlacedLabels {
  /** One per label, in the order given: its row, or null where it was dropped (its point stays). */
  labels: (Row | null)[];
  /** The notes that found a place, as pixel rows {x, y, t, al, bl}. */
  notes: Row[];
}

/**
 * Place labels (most important first), then notes, clear of each other and of `obstacles`. `rules` are
 * straight lines across the plot (a band's edges): labels keep clear of them as of a curve; a note, which
 * stands at the plot's side, may come up to one but not across it.
 */
export function placeMarkLabels(labels: readonly MarkLabel[], plot: { width: number; height: number }, obstacles: readonly Obstacle[], notes: readonly PlotNote[] = [], rules: readonly Obstacle[] = []): PlacedLabels {
  const lines = rules.length > 0 ? { lines: { obstacles: rules } } : {};
  const noteLines = rules.length > 0 ? { lines: { obstacles: rules, clearance: 0 } } : {};
  const requests: LabelRequest[] = [
    ...labels.map((l) => ({ x: l.x, y: l.y, text: l.text, ...(l.shortText !== undefined ? { shortText: l.shortText } : {}), fontSize: FONT_SIZE.note, ...(l.required !== undefined ? { required: l.required } : {}), ...(l.candidates ? { candidates: l.candidates } : {}), ...lines })),
    ...notes.map((n) => ({ x: n.x, y: n.y, text: n.text, fontSize: FONT_SIZE.note, candidates: n.candidates, ...noteLines })),
  ];
  const placements = placeLabels(requests, plot, obstacles);
  return {
    labels: labels.map((l, k) => {
      const p = placements[k];
      return p ? { ...l.at, t: p.text, dx: p.dx, dy: p.dy, al: p.align, bl: p.baseline } : null;
    }),
    notes: notes.flatMap((n, k) => {
      const p = placements[labels.length + k];
      return p ? [{ x: n.x + p.dx, y: n.y + p.dy, t: p.text, al: p.align, bl: p.baseline }] : [];
    }),
  };
}

/** The rows of the labels that found a place. */
export function shown(rows: readonly (Row | null)[]): Row[] {
  return rows.filter((r): r is Row => r !== null);
}
