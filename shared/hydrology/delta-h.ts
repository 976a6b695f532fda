/**
 * The Δh-parameterisation of glacier thinning (Huss et al. 2010, HESS 14:815, Eq. 2 [read form];
 * coefficients for three size classes [memory]): the normalised ice-thickness change as a function
 * of the normalised elevation range hr = (zmax − z)/(zmax − zmin) (0 at the glacier top, 1 at the
 * terminus),
 *   Δh = (hr + a)^γ + b (hr + a) + c,
 * with Δh ≈ 0 at the top and ≈ 1 at the terminus. Large glaciers thin mostly at the tongue; small
 * ones thin more evenly over their elevation range.
 */

export type GlacierSizeClass = 'small' | 'medium' | 'large';

export interface DeltaHCoefficients {
  a: number;
  b: number;
  c: number;
  gamma: number;
  /** Area range the class was derived for, km² (Huss et al. 2010). */
  areaKm2: readonly [number, number];
}

export const DELTA_H_COEFFICIENTS: Readonly<Record<GlacierSizeClass, DeltaHCoefficients>> = Object.freeze({
  large: { a: -0.02, b: 0.12, c: 0, gamma: 6, areaKm2: [20, Infinity] },
  medium: { a: -0.05, b: 0.19, c: 0.01, gamma: 4, areaKm2: [5, 20] },
  small: { a: -0.3, b: 0.6, c: 0.09, gamma: 2, areaKm2: [0, 5] },
});

/**
 * Size class of a glacier of the given area (Huss et al. 2010: small < 5 km², medium 5–20 km², large > 20 km²).
 * @example glacierSizeClass(12) // 'medium'
 */
export function glacierSizeClass(areaKm2: number): GlacierSizeClass {
  if (!(areaKm2 >= 0)) throw new RangeError(`glacierSizeClass: area ${areaKm2} km² must be ≥ 0`);
  return areaKm2 < 5 ? 'small' : areaKm2 <= 20 ? 'medium' : 'large';
}

/**
 * Normalised thickness change Δh at normalised elevation hr (0 = top, 1 = terminus), from the
 * published curve, clipped to 0 … 1 (the large-glacier curve dips 0.002 below 0 at the very top).
 * @example normalisedThinning(0.5, 'small') // 0.25 (the small-glacier curve is exactly hr²)
 */
export function normalisedThinning(hr: number, sizeClass: GlacierSizeClass): number {
  if (!(hr >= 0 && hr <= 1)) throw new RangeError(`normalisedThinning: normalised elevation ${hr} is outside 0 … 1`);
  const { a, b, c, gamma } = DELTA_H_COEFFICIENTS[sizeClass];
  const x = hr + a;
  const dh = Math.pow(x, gamma) + b * x + c;
  return dh < 0 ? 0 : dh > 1 ? 1 : dh;
}
