// Down-sampling of curves in screen space (Ramer–Douglas–Peucker: Douglas & Peucker, The Canadian
// Cartographer 10(2), 1973). A sweep of 801 points drawn 540 px wide puts several points in each pixel
// column; vega's cost (and the SVG's size) grows with the points, the picture does not. Dropping every
// point that lies within a fraction of a pixel of the chord through its neighbours changes nothing a reader
// can see. Points the caller marks as kept (resonances, band edges, curve ends) always stay.

/** Default tolerance in px: far below a line's width. */
export const SIMPLIFY_TOLERANCE_PX = 0.15;

/**
 * Indices of the points to keep from the polyline (xs[i], ys[i]) in px, ascending. Points with a non-finite
 * coordinate split the line (they are gaps); each defined run is simplified on its own and its ends kept.
 */
export function simplifyPolyline(
  xs: ArrayLike<number>,
  ys: ArrayLike<number>,
  tolerancePx = SIMPLIFY_TOLERANCE_PX,
  keep?: (i: number) => boolean,
): number[] {
  const n = xs.length;
  const marked = new Uint8Array(n);
  let runStart = -1;
  for (let i = 0; i <= n; i++) {
    const defined = i < n && Number.isFinite(xs[i]) && Number.isFinite(ys[i]);
    if (defined && runStart < 0) runStart = i;
    if (!defined && runStart >= 0) {
      markRun(xs, [ys], runStart, i - 1, tolerancePx * tolerancePx, marked);
      runStart = -1;
    }
  }
  const kept: number[] = [];
  for (let i = 0; i < n; i++) {
    const defined = Number.isFinite(xs[i]) && Number.isFinite(ys[i]);
    if (defined && (marked[i] === 1 || (keep !== undefined && keep(i)))) kept.push(i);
  }
  return kept;
}

/**
 * Indices of the points to keep from several polylines over the same x (an envelope's lower and upper
 * edge), ascending: a point is dropped only where every line stays within `tolerancePx` of its chord, so
 * each line is as close to its full self as simplifyPolyline would keep it. Points where any line is not
 * finite split the run.
 */
export function simplifyPolylines(xs: ArrayLike<number>, lines: readonly ArrayLike<number>[], tolerancePx = SIMPLIFY_TOLERANCE_PX): number[] {
  const n = xs.length;
  const defined = (i: number) => Number.isFinite(xs[i]) && lines.every((ys) => Number.isFinite(ys[i]));
  const marked = new Uint8Array(n);
  let runStart = -1;
  for (let i = 0; i <= n; i++) {
    const ok = i < n && defined(i);
    if (ok && runStart < 0) runStart = i;
    if (!ok && runStart >= 0) {
      markRun(xs, lines, runStart, i - 1, tolerancePx * tolerancePx, marked);
      runStart = -1;
    }
  }
  const kept: number[] = [];
  for (let i = 0; i < n; i++) if (marked[i] === 1) kept.push(i);
  return kept;
}

function markRun(xs: ArrayLike<number>, lines: readonly ArrayLike<number>[], first: number, last: number, tol2: number, marked: Uint8Array): void {
  marked[first] = 1;
  marked[last] = 1;
  // An explicit stack: a sweep of many thousand points must not hit the recursion limit.
  const stack: number[] = [first, last];
  while (stack.length > 0) {
    const b = stack.pop()!;
    const a = stack.pop()!;
    if (b - a < 2) continue;
    let worst = -1;
    let worstD2 = tol2;
    for (const ys of lines) {
      const ax = xs[a];
      const ay = ys[a];
      const dx = xs[b] - ax;
      const dy = ys[b] - ay;
      const len2 = dx * dx + dy * dy;
      for (let i = a + 1; i < b; i++) {
        const px = xs[i] - ax;
        const py = ys[i] - ay;
        let d2: number;
        if (len2 === 0) {
          d2 = px * px + py * py;
        } else {
          // Distance to the segment (not the infinite line), so a curve that turns back is kept.
          const t = Math.max(0, Math.min(1, (px * dx + py * dy) / len2));
          const ex = px - t * dx;
          const ey = py - t * dy;
          d2 = ex * ex + ey * ey;
        }
        if (d2 > worstD2) {
          worstD2 = d2;
          worst = i;
        }
      }
    }
    if (worst >= 0) {
      marked[worst] = 1;
      stack.push(a, worst, worst, b);
    }
  }
}
