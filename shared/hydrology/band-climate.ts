import { HydrologyInputError, refuse, requireInRange, requireLength } from './errors';
import { checkGlacierDamping, glacierAirTemperatureC, type GlacierDampingParameters } from './glacier-air-temperature';
import { checkProfile, precipitationMultiplier, type PrecipitationProfile } from './precipitation-profile';
import { bandMidM, MONTHS, type ElevationBand } from './stations';

export interface ClimateBand extends ElevationBand {
  /** Share of the band covered by glacier, 0–1 (needed only for on-glacier damping). */
  glacierFraction?: number;
}

export interface BandClimateInput {
  bands: readonly ClimateBand[];
  /** Elevation of the reference station whose series drives the engine, m. */
  referenceElevationM: number;
  /** dT/dz per month, K km⁻¹, January first. */
  lapseRatesKPerKm: readonly number[];
  /** Precipitation profile per month, January first. */
  profiles: readonly PrecipitationProfile[];
  /** On-glacier temperature damping, with the reference station's monthly mean temperature (°C) it is evaluated at. */
  glacierDamping?: GlacierDampingParameters & { referenceMonthlyTemperatureC: readonly number[] };
}

/** Per band × month climate relative to the reference station; band-major (band b, month m at b·12 + m). */
export interface BandClimate {
  bandCount: number;
  /** Free-air temperature at the band's mid-elevation minus the reference station's, K. */
  temperatureOffsetK: Float64Array;
  /** The same over the band's glacier (damped where damping is on; equal to the free-air offset elsewhere), K. */
  glacierTemperatureOffsetK: Float64Array;
  /** Precipitation at the band's mid-elevation as a multiple of the reference station's. */
  precipitationMultiplier: Float64Array;
}

/** Lapse rates outside this range are refused: strong winter inversions reach positive values. */
const LAPSE_RANGE_K_PER_KM = [-15, 10] as const;

/**
 * Temperature offsets and precipitation multipliers for every band and month, from the month's
 * lapse rate and precipitation profile, taken at each band's mid-elevation. With damping on, the
 * glacier offset follows Greuell & Böhm 1998 (see glacierAirTemperatureC) at the month's mean
 * reference temperature — linearised per month, so a day far from the mean is only approximate.
 *
 * @throws HydrologyInputError naming the field (e.g. `profiles[6].peakElevationM`, `lapseRatesKPerKm[0]`)
 * @example bandClimate({ bands: [{ lowerM: 3000, upperM: 3200, areaKm2: 1 }], referenceElevationM: 2100, lapseRatesKPerKm: Array(12).fill(-6), profiles: Array(12).fill({ kind: 'linear', gradientPerKm: 0.5 }) }).temperatureOffsetK[0] // -6
 */
export function bandClimate(input: BandClimateInput): BandClimate {
  const { bands, referenceElevationM: zRef, lapseRatesKPerKm, profiles, glacierDamping } = input;
  if (bands.length === 0) refuse('bands', 'the catchment has no elevation bands.');
  requireInRange(zRef, -500, 9000, 'referenceElevationM', 'The reference elevation', 'm');
  requireLength(lapseRatesKPerKm, MONTHS, 'lapseRatesKPerKm', 'one per month, January first');
  requireLength(profiles, MONTHS, 'profiles', 'one per month, January first');
  lapseRatesKPerKm.forEach((g, m) => requireInRange(g, LAPSE_RANGE_K_PER_KM[0], LAPSE_RANGE_K_PER_KM[1], `lapseRatesKPerKm[${m}]`, 'The lapse rate', 'K per km'));
  profiles.forEach((p, m) => checkProfile(p, bands, zRef, `profiles[${m}]`));
  if (glacierDamping) {
    checkGlacierDamping(glacierDamping, 'glacierDamping');
    requireLength(glacierDamping.referenceMonthlyTemperatureC, MONTHS, 'glacierDamping.referenceMonthlyTemperatureC', 'one per month, January first');
    glacierDamping.referenceMonthlyTemperatureC.forEach((t, m) => requireInRange(t, -60, 45, `glacierDamping.referenceMonthlyTemperatureC[${m}]`, 'The mean temperature', '°C'));
  }
  const glacierTopM = glacierDamping ? glacierTop(bands) : null;
  const n = bands.length;
  const out: BandClimate = { bandCount: n, temperatureOffsetK: new Float64Array(n * MONTHS), glacierTemperatureOffsetK: new Float64Array(n * MONTHS), precipitationMultiplier: new Float64Array(n * MONTHS) };
  for (let b = 0; b < n; b++) {
    const z = bandMidM(bands[b]);
    for (let m = 0; m < MONTHS; m++) {
      const i = b * MONTHS + m;
      // Written as the engine writes its own lapse-rate offset (Γ · Δz in km), so equal gradients give equal numbers.
      const offset = lapseRatesKPerKm[m] * ((z - zRef) / 1000);
      out.temperatureOffsetK[i] = offset;
      out.precipitationMultiplier[i] = precipitationMultiplier(profiles[m], z, zRef);
      out.glacierTemperatureOffsetK[i] = offset;
      if (glacierDamping && glacierTopM !== null && (bands[b].glacierFraction ?? 0) > 0) {
        const tRef = glacierDamping.referenceMonthlyTemperatureC[m];
        const topC = tRef + (lapseRatesKPerKm[m] * (glacierTopM - zRef)) / 1000;
        out.glacierTemperatureOffsetK[i] = glacierAirTemperatureC(topC, tRef + offset, glacierTopM - z, glacierDamping) - tRef;
      }
    }
  }
  return out;
}

/** Upper elevation of the highest band with glacier, m; null without glacier. */
function glacierTop(bands: readonly ClimateBand[]): number | null {
  const issues = bands.flatMap((b, i) => (b.glacierFraction === undefined || (b.glacierFraction >= 0 && b.glacierFraction <= 1) ? [] : [{ path: `bands[${i}].glacierFraction`, message: `${b.glacierFraction} is outside 0 … 1.` }]));
  if (issues.length > 0) throw new HydrologyInputError(issues);
  const glacierised = bands.filter((b) => (b.glacierFraction ?? 0) > 0);
  return glacierised.length > 0 ? Math.max(...glacierised.map((b) => b.upperM)) : null;
}
