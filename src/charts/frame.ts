// The frame of every zfolio chart: a fixed plot rectangle and the paddings around it that hold the axes and
// the key.

/**
 * The frame of a chart in px. Charts are drawn for the width they print at, so that their type comes out at
 * the size it is set in: one px of the viewBox is one CSS px (1/96 in, 0.75 pt) on paper, and the type sizes
 * of palette.ts (10–11 px) print at 7.5–8.3 pt. A wide chart (a rail, a comparison, a load step) spans the
 * text column, 180 mm on A4 between 15 mm margins (186 mm on Letter), so it is drawn 640 px wide (169 mm)
 * and prints at 1.06 to 1.10 times that; a part's charts stand two to a row, each in half the column less
 * the gap, about 88 mm, so they are drawn 332 px wide (87.8 mm) with the same type. On screen the SVG keeps
 * its viewBox and scales to its column. The plot area and the paddings are fixed so every chart of a kind
 * has the same size and the same plot rectangle, whatever its tick labels.
 */
export interface Frame {
  width: number;
  height: number;
  padding: { left: number; right: number; top: number; bottom: number };
}

const LEFT = 82;
const RIGHT = 24;
export const PLOT_WIDTH = 640 - LEFT - RIGHT;

export function frame(plotWidth: number, plotHeight: number, top = 34, bottom = 42): Frame {
  const padding = { left: LEFT, right: RIGHT, top, bottom };
  return { width: plotWidth, height: plotHeight, padding };
}

/** A half-column chart's paddings: room for a tick label such as "−100 mΩ" and the axis title on the left, half of "10 GHz" on the right. */
const HALF_LEFT = 78;
const HALF_RIGHT = 20;
/** The total width of a chart printed in half the text column. */
export const HALF_CHART_WIDTH = 332;
export const HALF_PLOT_WIDTH = HALF_CHART_WIDTH - HALF_LEFT - HALF_RIGHT;

/** The frame of a chart printed in half the text column (a part's four charts). */
export function halfFrame(plotHeight: number, top = 28, bottom = 40): Frame {
  return { width: HALF_PLOT_WIDTH, height: plotHeight, padding: { left: HALF_LEFT, right: HALF_RIGHT, top, bottom } };
}

/** The total size of a chart with this frame, as written in its viewBox. */
export function outerSize(f: Frame): { width: number; height: number } {
  return { width: f.width + f.padding.left + f.padding.right, height: f.height + f.padding.top + f.padding.bottom };
}
