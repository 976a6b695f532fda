/**
 * Dense linear algebra for the few-parameter problems of this folder (2–5 unknowns): Gauss–Jordan
 * elimination with partial pivoting (Golub & Van Loan, Matrix Computations, §3.4 — common practice).
 * Matrices are arrays of rows. Not meant for large systems.
 */

/** Relative pivot size below which a matrix counts as singular. */
const SINGULAR = 1e-12;

/**
 * Inverse of a square matrix, or null when it is singular (a pivot smaller than 10⁻¹² of the
 * largest entry).
 * @example invert([[2, 0], [0, 4]]) // [[0.5, 0], [0, 0.25]]
 */
export function invert(matrix: readonly (readonly number[])[]): number[][] | null {
  const n = matrix.length;
  const a = matrix.map((row, i) => [...row, ...Array.from({ length: n }, (_, j) => (i === j ? 1 : 0))]);
  const scale = Math.max(...matrix.flat().map(Math.abs));
  if (!(scale > 0)) return null;
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(a[r][col]) > Math.abs(a[pivot][col])) pivot = r;
    if (Math.abs(a[pivot][col]) <= SINGULAR * scale) return null;
    [a[col], a[pivot]] = [a[pivot], a[col]];
    const p = a[col][col];
    for (let c = 0; c < 2 * n; c++) a[col][c] /= p;
    for (let r = 0; r < n; r++) {
      if (r === col || a[r][col] === 0) continue;
      const f = a[r][col];
      for (let c = 0; c < 2 * n; c++) a[r][c] -= f * a[col][c];
    }
  }
  return a.map((row) => row.slice(n));
}

/** Aᵀ A for a design matrix given as rows (one row per observation). */
export function normalMatrix(rows: readonly (readonly number[])[]): number[][] {
  const p = rows[0]?.length ?? 0;
  const m = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  for (const row of rows) for (let i = 0; i < p; i++) for (let j = 0; j < p; j++) m[i][j] += row[i] * row[j];
  return m;
}

/** Matrix times vector. */
export function multiply(matrix: readonly (readonly number[])[], vector: readonly number[]): number[] {
  return matrix.map((row) => row.reduce((s, v, j) => s + v * vector[j], 0));
}

export interface LeastSquaresSolution {
  coefficients: number[];
  /** (AᵀA)⁻¹: times the residual variance it is the coefficients' covariance. */
  inverseNormal: number[][];
  residualSumOfSquares: number;
}

/**
 * Ordinary least squares y ≈ A c for a design matrix A given as rows; null when AᵀA is singular
 * (the columns do not determine the coefficients).
 * @example leastSquares([[1, 0], [1, 1], [1, 2]], [1, 3, 5])?.coefficients // [1, 2]
 */
export function leastSquares(rows: readonly (readonly number[])[], y: readonly number[]): LeastSquaresSolution | null {
  const inverseNormal = invert(normalMatrix(rows));
  if (!inverseNormal) return null;
  const aty = inverseNormal.map((_, i) => rows.reduce((s, row, k) => s + row[i] * y[k], 0));
  const coefficients = multiply(inverseNormal, aty);
  const residualSumOfSquares = rows.reduce((s, row, k) => s + (y[k] - row.reduce((t, v, j) => t + v * coefficients[j], 0)) ** 2, 0);
  return { coefficients, inverseNormal, residualSumOfSquares };
}
