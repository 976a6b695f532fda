/**
 * Cloud: from a cloudiness series to the share of clear-sky radiation that gets through, and back,
 * and the cloud optical thickness the snow-albedo cloud term needs.
 */

/**
 * Cloud transmission of global radiation, Kasten & Czeplak 1980 [memory]: G/Gclear = 1 − 0.75 n^3.4.
 *
 * @param cloudiness n, 0 … 1
 */
export function cloudTransmission(cloudiness: number): number {
  return 1 - 0.75 * Math.pow(cloudiness, 3.4);
}

/** Cloudiness that Kasten & Czeplak's relation gives for a clear-sky index G/Gclear (clamped to 0 … 1). */
export function cloudinessFromTransmission(clearSkyIndex: number): number {
  if (clearSkyIndex >= 1) return 0;
  if (clearSkyIndex <= 0.25) return 1;
  return Math.pow((1 - clearSkyIndex) / 0.75, 1 / 3.4);
}

/**
 * Cloud optical thickness τ from the cloud's transmission t = G/Gclear, two-stream approximation
 * for a conservatively scattering layer, t = 1 / (1 + 0.75 (1 − g) τ) with asymmetry g = 0.85
 * (e.g. Bohren 1987) [memory]; 0 for a clear sky, capped at 100.
 */
export function cloudOpticalThickness(clearSkyIndex: number): number {
  if (clearSkyIndex >= 1) return 0;
  const t = clearSkyIndex > 0.01 ? clearSkyIndex : 0.01;
  return Math.min(100, (1 / t - 1) / (0.75 * (1 - 0.85)));
}
