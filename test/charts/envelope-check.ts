// Checking a thinned envelope in tests: every point of the full envelope lies within a tolerance (px) of
// the polyline the kept rows draw, on the chart's own log-log plot (width × height across fDomain × yDomain).

type Rows = Record<string, unknown>[];

interface PlotSpec {
  width: number;
  height: number;
  params: { name: string; value: unknown }[];
}

/** Distance from (px, py) to the segment (ax, ay)–(bx, by). */
function segmentDistance(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const dx = bx - ax;
  const dy = by - ay;
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / len2));
  return Math.hypot(px - ax - t * dx, py - ay - t * dy);
}

/**
 * The largest distance (px) of a full envelope's points from the drawn edges, and whether every kept row
 * carries the full envelope's values at its index to 6 significant digits.
 */
export function envelopeMiss(spec: object, rows: Rows, frequencies: ArrayLike<number>, min: ArrayLike<number>, max: ArrayLike<number>): { worstPx: number; exact: boolean } {
  const s = spec as PlotSpec;
  const param = (name: string) => s.params.find((p) => p.name === name)!.value as [number, number];
  const [f0, f1] = param('fDomain');
  const [y0, y1] = param('yDomain');
  const px = (f: number) => (s.width * Math.log10(f / f0)) / Math.log10(f1 / f0);
  const py = (v: number) => (s.height * Math.log10(v / y0)) / Math.log10(y1 / y0);
  const index = rows.map((r) => r.i as number);
  const exact = rows.every((r, k) => {
    const i = index[k];
    const six = (x: number) => Number(x.toPrecision(6));
    return r.f === six(frequencies[i]) && r.v === six(min[i]) && r.v2 === six(max[i]);
  });
  let worstPx = 0;
  for (let k = 0; k + 1 < rows.length; k++) {
    const [a, b] = [rows[k], rows[k + 1]];
    for (let i = index[k]; i <= index[k + 1]; i++) {
      for (const [edge, key] of [[min, 'v'], [max, 'v2']] as const) {
        const d = segmentDistance(px(frequencies[i]), py(edge[i]), px(a.f as number), py(a[key] as number), px(b.f as number), py(b[key] as number));
        worstPx = Math.max(worstPx, d);
      }
    }
  }
  return { worstPx, exact };
}
