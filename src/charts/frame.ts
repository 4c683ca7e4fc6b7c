// The frame of every zfolio chart: a fixed plot rectangle and the paddings around it that hold the axes and
// the key.

/**
 * The frame of a chart in px. Width 640 px fills an A4 text column of 170 mm at 96 px/in, and the SVG
 * keeps a viewBox so it scales to any column. The plot area and the paddings are fixed so every chart
 * of a kind has the same size and the same plot rectangle, whatever its tick labels.
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

/** The total size of a chart with this frame, as written in its viewBox. */
export function outerSize(f: Frame): { width: number; height: number } {
  return { width: f.width + f.padding.left + f.padding.right, height: f.height + f.padding.top + f.padding.bottom };
}
