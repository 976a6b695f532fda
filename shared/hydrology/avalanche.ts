import type { ParameterSpec } from '../melt/parameters';
import { HydrologyInputError, type HydrologyIssue } from './errors';
import { checkParameters, defaultsOf, type ValuesOf } from './parameter-specs';
import { bandMidM, type ElevationBand } from './stations';

/**
 * Gravitational snow transport (avalanching) on elevation bands, after the SnowSlide scheme of
 * Bernhardt & Schulz 2010 (GRL 37, L11502) [memory]: a slope holds snow up to a holding depth
 * that decreases with slope, SHD = c · β^e (snow depth in m, β the slope in degrees; c = 3178.4,
 * e = −1.998), but never less than a minimum depth; snow above it slides to the cell below.
 * Adapted to bands: each band's holding capacity in SWE is SHD(β) · ρsnow, β the band's (release)
 * slope; snow above it moves to the next lower band, and on down the bands while it exceeds their
 * capacity; the lowest band keeps what reaches it. A band holds its snow evenly, so the band's
 * mean slope smooths out steep walls: give the slope of the band's steep part where it is known.
 */

export const AVALANCHE_PARAMETERS = {
  holdingCoefficient: { default: 3178.4, min: 500, max: 10000, unit: 'm deg^−e', source: 'c of SHD = c β^e, Bernhardt & Schulz 2010 (GRL 37, L11502) [memory]' },
  holdingExponent: { default: -1.998, min: -3, max: -1, unit: '-', source: 'e of SHD = c β^e, Bernhardt & Schulz 2010 [memory]' },
  minimumHoldingDepthM: { default: 0.05, min: 0, max: 1, unit: 'm', source: 'snow depth even the steepest slopes hold, Bernhardt & Schulz 2010 [memory]' },
  snowDensityKgM3: { default: 250, min: 100, max: 550, unit: 'kg m⁻³', source: 'density converting the holding depth to SWE; seasonal mountain snow ≈ 200–400 kg m⁻³ (common practice); assumption' },
} as const satisfies Record<string, ParameterSpec>;

export type AvalancheParameters = ValuesOf<typeof AVALANCHE_PARAMETERS>;

export const DEFAULT_AVALANCHE_PARAMETERS = defaultsOf(AVALANCHE_PARAMETERS);

export interface AvalancheBand extends ElevationBand {
  /** Mean slope of the band, degrees. */
  slopeDeg: number;
}

/** Everything the daily step reads, computed once per run. */
export interface AvalanchePlan {
  readonly bandCount: number;
  /** Band indices from the highest band middle to the lowest. */
  readonly order: Int32Array;
  /** The band each band's excess slides into (the next lower one), −1 for the lowest. */
  readonly receiver: Int32Array;
  /** Holding capacity, mm w.e. over the band area (Infinity on flat ground). */
  readonly holdingMm: Float64Array;
  readonly areaKm2: Float64Array;
}

/**
 * Holding capacity of a slope in SWE, mm w.e.: max(SHD_min, c β^e) · ρsnow (m × kg m⁻³ = mm w.e.).
 * @example holdingCapacityMm(40, DEFAULT_AVALANCHE_PARAMETERS) // ≈ 500 (SHD ≈ 2.0 m at 250 kg m⁻³)
 */
export function holdingCapacityMm(slopeDeg: number, params: AvalancheParameters): number {
  if (!(slopeDeg > 0)) return Infinity;
  const depthM = Math.max(params.minimumHoldingDepthM, params.holdingCoefficient * Math.pow(slopeDeg, params.holdingExponent));
  return depthM * params.snowDensityKgM3;
}

/**
 * Prepares avalanching for a catchment's bands.
 * @param releaseSlopeDeg slope per band used for the holding depth (e.g. the band's steep part); default each band's mean slope
 * @throws HydrologyInputError naming the band field or parameter that is out of range
 */
export function planAvalanching(bands: readonly AvalancheBand[], params: AvalancheParameters = DEFAULT_AVALANCHE_PARAMETERS, releaseSlopeDeg?: ArrayLike<number>): AvalanchePlan {
  checkParameters(AVALANCHE_PARAMETERS, params, 'avalanche');
  const issues: HydrologyIssue[] = [];
  if (releaseSlopeDeg && releaseSlopeDeg.length !== bands.length) issues.push({ path: 'releaseSlopeDeg', message: `${bands.length} slopes are needed, one per band; ${releaseSlopeDeg.length} were given.` });
  bands.forEach((b, i) => {
    if (!(b.areaKm2 > 0)) issues.push({ path: `bands[${i}].areaKm2`, message: 'a band needs an area greater than 0 km².' });
    const slope = releaseSlopeDeg ? releaseSlopeDeg[i] : b.slopeDeg;
    if (!(slope >= 0 && slope < 90)) issues.push({ path: releaseSlopeDeg ? `releaseSlopeDeg[${i}]` : `bands[${i}].slopeDeg`, message: `a slope of ${slope}° is outside 0 … 90°.` });
  });
  if (issues.length > 0) throw new HydrologyInputError(issues);
  const n = bands.length;
  const order = Int32Array.from(bands.map((_, i) => i).sort((a, b) => bandMidM(bands[b]) - bandMidM(bands[a])));
  const receiver = new Int32Array(n).fill(-1);
  for (let k = 0; k + 1 < n; k++) receiver[order[k]] = order[k + 1];
  return {
    bandCount: n,
    order,
    receiver,
    holdingMm: Float64Array.from(bands, (b, i) => holdingCapacityMm(releaseSlopeDeg ? releaseSlopeDeg[i] : b.slopeDeg, params)),
    areaKm2: Float64Array.from(bands, (b) => b.areaKm2),
  };
}

/**
 * One day of avalanching, in place: snow above each band's holding capacity slides down band by
 * band, from the top. Writes the day's net change per band (mm w.e. over the band area; + gained,
 * − lost) into `netChangeMm`. Mass is conserved (Σ SWE·area is unchanged) and snow only moves to
 * lower bands. Allocates nothing, so the engine can call it once per simulated day.
 *
 * @param sweMm SWE per band, mm w.e. over the band area (changed in place)
 * @param netChangeMm filled with the day's change per band
 * @returns the snow moved out of bands, mm w.e. × km² (0 on a quiet day)
 * @example const plan = planAvalanching(bands); const net = new Float64Array(bands.length); avalanche(plan, swe, net); // once per day
 */
export function avalanche(plan: AvalanchePlan, sweMm: Float64Array, netChangeMm: Float64Array): number {
  const { order, receiver, holdingMm, areaKm2 } = plan;
  netChangeMm.fill(0);
  let moved = 0;
  for (let k = 0; k < order.length; k++) {
    const b = order[k];
    const r = receiver[b];
    const excess = sweMm[b] - holdingMm[b];
    if (r < 0 || !(excess > 0)) continue;
    const volume = excess * areaKm2[b];
    sweMm[b] = holdingMm[b];
    netChangeMm[b] -= excess;
    const gain = volume / areaKm2[r];
    sweMm[r] += gain;
    netChangeMm[r] += gain;
    moved += volume;
  }
  return moved;
}
