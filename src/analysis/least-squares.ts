// Linear least squares min ‖A·x − b‖ by Householder QR (G. H. Golub, C. F. Van Loan, Matrix Computations,
// 4th ed., 2013, §5.3.3), on a column-major Float64Array: the fits here are a few hundred rows by a few
// dozen columns, solved once per rail with several right-hand sides.

/**
 * Solve for x (columns × rhs.length, column by column) given A (rows × columns, column-major, overwritten)
 * and right-hand sides (each of length rows, overwritten). Columns should be scaled alike (unit norm); a
 * column with no component left after the ones before it gets x = 0 rather than a division by zero.
 */
export function leastSquares(a: Float64Array, rows: number, columns: number, rhs: Float64Array[]): Float64Array[] {
  if (rows < columns) throw new RangeError(`${rows} equations cannot fix ${columns} unknowns`);
  const diagonal = new Float64Array(columns);
  for (let k = 0; k < columns; k++) {
    const col = k * rows;
    let norm = 0;
    for (let i = k; i < rows; i++) norm += a[col + i] * a[col + i];
    norm = Math.sqrt(norm);
    if (norm === 0) {
      diagonal[k] = 0;
      continue;
    }
    // v = x + sign(x_k)·‖x‖·e_k, stored in place; R's diagonal is −sign(x_k)·‖x‖.
    const alpha = a[col + k] >= 0 ? -norm : norm;
    a[col + k] -= alpha;
    let vv = 0;
    for (let i = k; i < rows; i++) vv += a[col + i] * a[col + i];
    diagonal[k] = alpha;
    const reflect = (target: Float64Array, offset: number) => {
      let dot = 0;
      for (let i = k; i < rows; i++) dot += a[col + i] * target[offset + i];
      const f = (2 * dot) / vv;
      for (let i = k; i < rows; i++) target[offset + i] -= f * a[col + i];
    };
    for (let j = k + 1; j < columns; j++) reflect(a, j * rows);
    for (const b of rhs) reflect(b, 0);
  }
  // Back substitution on R (upper triangle above the stored reflectors, diagonal apart).
  const scale = Math.max(...Array.from(diagonal, Math.abs));
  return rhs.map((b) => {
    const x = new Float64Array(columns);
    for (let k = columns - 1; k >= 0; k--) {
      let sum = b[k];
      for (let j = k + 1; j < columns; j++) sum -= a[j * rows + k] * x[j];
      x[k] = Math.abs(diagonal[k]) > 1e-14 * scale ? sum / diagonal[k] : 0;
    }
    return x;
  });
}
