/**
 * Least-squares fit of a full quadratic surface s(x) = c + gᵀx + ½ xᵀAx to scores at points x
 * (any dimension, coordinates scaled to order 1), and the extent of the region where the fitted
 * surface stays within `tolerance` of its maximum: for A negative definite, the half-width along
 * axis i of {x : s(x*) − s(x) ≤ t} is √(2 t (−A)⁻¹ᵢᵢ) (the projection of the ellipsoid; common
 * practice in local sensitivity analysis). Null when A is not negative definite.
 */
export interface QuadraticSurface {
  constant: number;
  gradient: number[];
  /** Symmetric matrix A. */
  curvature: number[][];
}

function terms(x: readonly number[]): number[] {
  const out = [1, ...x];
  for (let i = 0; i < x.length; i++) for (let j = i; j < x.length; j++) out.push(i === j ? 0.5 * x[i] * x[i] : x[i] * x[j]);
  return out;
}

/** Solves M y = b by Gaussian elimination with partial pivoting; null when M is singular. */
export function solveLinear(matrix: number[][], rhs: number[]): number[] | null {
  const n = rhs.length;
  const m = matrix.map((row, i) => [...row, rhs[i]]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(m[r][c]) > Math.abs(m[p][c])) p = r;
    if (Math.abs(m[p][c]) < 1e-12) return null;
    [m[c], m[p]] = [m[p], m[c]];
    for (let r = c + 1; r < n; r++) {
      const f = m[r][c] / m[c][c];
      for (let k = c; k <= n; k++) m[r][k] -= f * m[c][k];
    }
  }
  const y = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = m[r][n];
    for (let k = r + 1; k < n; k++) s -= m[r][k] * y[k];
    y[r] = s / m[r][r];
  }
  return y;
}

export function fitQuadratic(points: readonly number[][], scores: readonly number[]): QuadraticSurface | null {
  const dim = points[0]?.length ?? 0;
  const rows = points.map(terms);
  const width = rows[0]?.length ?? 0;
  if (rows.length < width) return null;
  const normal = Array.from({ length: width }, (_, i) => Array.from({ length: width }, (_, j) => rows.reduce((s, r) => s + r[i] * r[j], 0)));
  const rhs = Array.from({ length: width }, (_, i) => rows.reduce((s, r, k) => s + r[i] * scores[k], 0));
  const c = solveLinear(normal, rhs);
  if (!c) return null;
  const curvature = Array.from({ length: dim }, () => new Array<number>(dim).fill(0));
  let k = 1 + dim;
  for (let i = 0; i < dim; i++) {
    for (let j = i; j < dim; j++) {
      curvature[i][j] = curvature[j][i] = c[k++];
    }
  }
  return { constant: c[0], gradient: c.slice(1, 1 + dim), curvature };
}

export function projectedHalfWidths(surface: QuadraticSurface | null, tolerance: number): number[] | null {
  if (!surface) return null;
  const dim = surface.gradient.length;
  const negated = surface.curvature.map((row) => row.map((v) => -v));
  const widths: number[] = [];
  for (let i = 0; i < dim; i++) {
    const unit = Array.from({ length: dim }, (_, j) => (j === i ? 1 : 0));
    const column = solveLinear(negated, unit);
    if (!column || !(column[i] > 0)) return null;
    widths.push(Math.sqrt(2 * tolerance * column[i]));
  }
  // Negative definite: every leading principal minor of −A positive (Sylvester's criterion).
  for (let size = 1; size <= dim; size++) {
    if (!(determinant(negated.slice(0, size).map((r) => r.slice(0, size))) > 0)) return null;
  }
  return widths;
}

function determinant(m: number[][]): number {
  const n = m.length;
  const a = m.map((r) => [...r]);
  let det = 1;
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(a[r][c]) > Math.abs(a[p][c])) p = r;
    if (a[p][c] === 0) return 0;
    if (p !== c) { [a[c], a[p]] = [a[p], a[c]]; det = -det; }
    det *= a[c][c];
    for (let r = c + 1; r < n; r++) {
      const f = a[r][c] / a[c][c];
      for (let k = c; k < n; k++) a[r][k] -= f * a[c][k];
    }
  }
  return det;
}
