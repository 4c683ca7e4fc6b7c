// The visual tokens of every zfolio chart: ink, grid, series colours, dash patterns, type and frame sizes.
// Chosen for a printed datasheet first: dark saturated inks that hold up in greyscale, each series also
// told apart by its dash pattern, so a reader with a colour-vision deficiency or a black-and-white printout
// loses nothing. Every line colour keeps at least 3:1 contrast against white paper (WCAG 2.1, SC 1.4.11,
// non-text contrast), checked in test/charts/palette.test.ts.

/** Text, axis lines and ticks. */
export const INK = '#1b1b1b';
/** Secondary text: axis titles, notes inside the plot. */
export const INK_SOFT = '#4a4a4a';
export const PAPER = '#ffffff';
/** Grid at labelled ticks (decades). */
export const GRID_MAJOR = '#c9c9c9';
/** Grid at unlabelled ticks (2…9 × decade on log axes). */
export const GRID_MINOR = '#ececec';
/** Zero lines (0° phase, X = 0). */
export const ZERO_LINE = '#6d6d6d';

/** The usable band or a rail's frequency band: a translucent tint over the grid, with darker edges. */
export const BAND_FILL = '#7d9ec4';
export const BAND_OPACITY = 0.2;
export const BAND_EDGE = '#4f6f91';

/** The envelope of |Z| over the corners of a spread: a warm tint behind the nominal curve. */
export const SPREAD_FILL = '#c8a76a';
export const SPREAD_OPACITY = 0.38;

/** A series: its colour, its dash pattern (empty = solid) and its line width in px. */
export interface SeriesStyle {
  color: string;
  dash: number[];
  width: number;
}

/** Curves of one part's charts. */
export const PART_SERIES = {
  magnitude: { color: '#1f3d73', dash: [], width: 1.6 },
  resistance: { color: '#b5520b', dash: [6, 3], width: 1.3 },
  phase: { color: '#1f3d73', dash: [], width: 1.6 },
  conductance: { color: '#b5520b', dash: [7, 2, 1.5, 2], width: 1.3 },
  susceptanceCapacitive: { color: '#1f3d73', dash: [], width: 1.6 },
  susceptanceInductive: { color: '#1f3d73', dash: [3, 2.5], width: 1.6 },
  path: { color: '#1f3d73', dash: [], width: 1.6 },
} as const satisfies Record<string, SeriesStyle>;

/** Resonance markers and their labels. */
export const RESONANCE_MARK = '#7a1d3c';
/** A bead's rated impedance at its rated frequency. */
export const RATED_MARK = '#13795b';
/** A rail's target impedance. */
export const TARGET_LINE: SeriesStyle = { color: '#a3152d', dash: [9, 3], width: 1.5 };
/** A rail's total impedance. */
export const RAIL_TOTAL: SeriesStyle = { color: '#1b1b1b', dash: [], width: 1.8 };

/**
 * Curves overlaid on common axes (comparisons, rail branches): eight inks in an order that steps between
 * dark and lighter ones and between warm and cool hues, so neighbours in a key differ in more than hue.
 */
export const OVERLAY_COLORS: readonly string[] = [
  '#1f3d73', // deep blue
  '#b5520b', // burnt orange
  '#7a1d3c', // wine
  '#2f7f6b', // sea green
  '#3f3f3f', // graphite
  '#4d7fb8', // mid blue
  '#6b4a9e', // violet
  '#806000', // dark ochre
];

/** Dash patterns for overlaid curves, one per colour and one more, so greyscale prints stay legible. */
export const OVERLAY_DASHES: readonly number[][] = [
  [],
  [7, 3],
  [2, 2],
  [9, 3, 2, 3],
  [4, 2, 1, 2, 1, 2],
  [12, 4],
  [1, 3],
  [6, 2, 6, 2, 1, 2],
  [3, 4],
];

/** A font stack every platform has some member of; nothing is fetched. */
export const FONT = "Helvetica, Arial, 'Liberation Sans', 'DejaVu Sans', sans-serif";
export const FONT_SIZE = { tick: 10.5, title: 11, note: 10, legend: 10.5 } as const;
