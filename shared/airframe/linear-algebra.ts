/**
 * The few dense linear-algebra steps the allocation needs. Matrices are row-major arrays of rows;
 * sizes here are at most 4 × 16, so clarity beats speed.
 */

export type Matrix = number[][];

/** Element (r, c); throws instead of returning undefined so index slips fail loudly. */
function at(m: Matrix, r: number, c: number): number {
  const v = m[r]?.[c];
  if (v === undefined) throw new RangeError(`matrix index (${r}, ${c}) out of range`);
  return v;
}

/** Product A·B; columns of A must equal rows of B. */
export function multiply(a: Matrix, b: Matrix): Matrix {
  const rows = a.length;
  const inner = b.length;
  const cols = b[0]?.length ?? 0;
  const out: Matrix = [];
  for (let r = 0; r < rows; r++) {
    const row = new Array<number>(cols).fill(0);
    for (let c = 0; c < cols; c++) {
      let s = 0;
      for (let k = 0; k < inner; k++) s += at(a, r, k) * at(b, k, c);
      row[c] = s;
    }
    out.push(row);
  }
  return out;
}

/** Transpose. */
export function transpose(a: Matrix): Matrix {
  const rows = a.length;
  const cols = a[0]?.length ?? 0;
  const out: Matrix = [];
  for (let c = 0; c < cols; c++) {
    const row = new Array<number>(rows);
    for (let r = 0; r < rows; r++) row[r] = at(a, r, c);
    out.push(row);
  }
  return out;
}

/** Product A·v. */
export function multiplyVector(a: Matrix, v: readonly number[]): number[] {
  return a.map((row) => row.reduce((s, x, i) => s + x * (v[i] ?? 0), 0));
}

/**
 * Inverse of a small square matrix by Gauss–Jordan elimination with partial pivoting.
 * Throws when the matrix is singular to working precision (relative pivot below 1e-12).
 */
export function invert(m: Matrix): Matrix {
  const n = m.length;
  const work = m.map((row, r) => {
    if (row.length !== n) throw new RangeError('invert needs a square matrix');
    const aug = new Array<number>(2 * n).fill(0);
    for (let c = 0; c < n; c++) aug[c] = at(m, r, c);
    aug[n + r] = 1;
    return aug;
  });
  let scale = 0;
  for (const row of m) for (const v of row) scale = Math.max(scale, Math.abs(v));
  if (scale === 0) throw new RangeError('matrix is singular');
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) {
      if (Math.abs(at(work, r, col)) > Math.abs(at(work, pivot, col))) pivot = r;
    }
    if (Math.abs(at(work, pivot, col)) < 1e-12 * scale) throw new RangeError('matrix is singular');
    const tmp = work[col]!;
    work[col] = work[pivot]!;
    work[pivot] = tmp;
    const prow = work[col]!;
    const p = at(work, col, col);
    for (let c = 0; c < 2 * n; c++) prow[c] = prow[c]! / p;
    for (let r = 0; r < n; r++) {
      if (r === col) continue;
      const row = work[r]!;
      const f = row[col]!;
      if (f === 0) continue;
      for (let c = 0; c < 2 * n; c++) row[c] = row[c]! - f * prow[c]!;
    }
  }
  return work.map((row) => row.slice(n));
}
