/** Abramowitz & Stegun (1964) 4.4.49 coefficients: arctan on [0, 1] to within 2·10⁻⁸ rad. */
const A2 = -0.3333314528, A4 = 0.1999355085, A6 = -0.1420889944, A8 = 0.1065626393;
const A10 = -0.07528964, A12 = 0.0429096138, A14 = -0.0161657367, A16 = 0.0028662257;

/**
 * arctan(t) in radians, within 2·10⁻⁸ of Math.atan (tested), by the polynomial of Abramowitz &
 * Stegun 4.4.49 on [0, 1] and atan t = π/2 − atan(1/t) above; cheaper in the sky-view loop,
 * which takes one arctangent per cell and direction.
 */
export function fastAtan(t: number): number {
  const negative = t < 0;
  let x = negative ? -t : t;
  const inverted = x > 1;
  if (inverted) x = 1 / x;
  const x2 = x * x;
  const p = x * (1 + x2 * (A2 + x2 * (A4 + x2 * (A6 + x2 * (A8 + x2 * (A10 + x2 * (A12 + x2 * (A14 + x2 * A16))))))));
  const r = inverted ? Math.PI / 2 - p : p;
  return negative ? -r : r;
}
