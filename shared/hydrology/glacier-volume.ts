import type { ParameterSpec } from '../melt/parameters';
import { HydrologyInputError, type HydrologyIssue } from './errors';
import type { ElevationBand } from './stations';

/**
 * Initial glacier geometry per band: glacier area from the bands, ice thickness given by the user
 * per band or from volume–area scaling V = c A^γ (Bahr et al. 1997, JGR 102:20355; review Bahr,
 * Pfeffer & Kaser 2015, Rev. Geophys. 53:95): γ = 1.375 from theory for valley glaciers, c ≈ 0.034
 * km^(3−2γ) [memory]. Scaling holds for single glaciers, so a catchment with several glaciers
 * should give their areas; one lumped glacier overestimates the volume. Without a thickness per
 * band, the mean thickness V/A is given to every glacier band (an assumption; give thicknesses
 * where a survey or an ice-thickness product exists).
 */

export const VOLUME_AREA = {
  coefficientKm: { default: 0.034, min: 0.02, max: 0.05, unit: 'km^(3−2γ)', source: 'c of V = c A^γ for mountain glaciers, Bahr et al. 1997; Bahr, Pfeffer & Kaser 2015 [memory]' },
  exponent: { default: 1.375, min: 1.25, max: 1.5, unit: '-', source: 'γ of V = c A^γ, 1.375 for valley glaciers from theory (Bahr et al. 1997) [memory]; 1.25 for ice caps' },
} as const satisfies Record<string, ParameterSpec>;

export interface GlacierBand extends ElevationBand {
  /** Share of the band covered by glacier, 0–1. */
  glacierFraction: number;
}

/** Glacier per band: area (km²) and mean ice thickness over that area (m). */
export interface GlacierState {
  areaKm2: Float64Array;
  thicknessM: Float64Array;
}

/**
 * Ice volume of one glacier from its area, km³.
 * @example glacierVolumeKm3(10) // ≈ 0.806 (0.034 · 10^1.375)
 */
export function glacierVolumeKm3(areaKm2: number, coefficientKm: number = VOLUME_AREA.coefficientKm.default, exponent: number = VOLUME_AREA.exponent.default): number {
  if (!(areaKm2 >= 0)) throw new RangeError(`glacierVolumeKm3: area ${areaKm2} km² must be ≥ 0`);
  return coefficientKm * Math.pow(areaKm2, exponent);
}

export interface InitialGlacierOptions {
  /** Mean ice thickness per band, m (wins over scaling). */
  iceThicknessM?: ArrayLike<number>;
  /** Areas of the individual glaciers in the catchment, km², for the volume–area relation (default: one glacier of the bands' total). */
  glacierAreasKm2?: readonly number[];
  coefficientKm?: number;
  exponent?: number;
}

/**
 * Glacier area and thickness per band at the start of a transient run.
 * @throws HydrologyInputError naming a band's fraction or thickness that is out of range, or glacier areas that do not add up
 */
export function initialGlacier(bands: readonly GlacierBand[], options: InitialGlacierOptions = {}): GlacierState {
  const issues: HydrologyIssue[] = [];
  bands.forEach((b, i) => {
    if (!(b.glacierFraction >= 0 && b.glacierFraction <= 1)) issues.push({ path: `bands[${i}].glacierFraction`, message: `${b.glacierFraction} is outside 0 … 1.` });
    if (!(b.areaKm2 > 0)) issues.push({ path: `bands[${i}].areaKm2`, message: 'a band needs an area greater than 0 km².' });
  });
  const given = options.iceThicknessM;
  if (given) {
    if (given.length !== bands.length) issues.push({ path: 'iceThicknessM', message: `${bands.length} thicknesses are needed, one per band; ${given.length} were given.` });
    bands.forEach((b, i) => {
      const h = given[i];
      if (!(h >= 0 && h <= 2000)) issues.push({ path: `iceThicknessM[${i}]`, message: `an ice thickness of ${h} m is outside 0 … 2000 m.` });
      else if (b.glacierFraction > 0 && h === 0) issues.push({ path: `iceThicknessM[${i}]`, message: 'a band with glacier needs an ice thickness above 0 m.' });
    });
  }
  const areaKm2 = Float64Array.from(bands, (b) => b.areaKm2 * b.glacierFraction);
  const totalKm2 = areaKm2.reduce((s, a) => s + a, 0);
  const parts = options.glacierAreasKm2;
  if (!given && parts) {
    const sum = parts.reduce((s, a) => s + a, 0);
    if (parts.some((a) => !(a > 0))) issues.push({ path: 'glacierAreasKm2', message: 'every glacier needs an area greater than 0 km².' });
    else if (Math.abs(sum - totalKm2) > 0.01 * totalKm2 + 1e-9) issues.push({ path: 'glacierAreasKm2', message: `the glaciers add up to ${sum.toFixed(2)} km², but the bands hold ${totalKm2.toFixed(2)} km² of glacier.` });
  }
  if (issues.length > 0) throw new HydrologyInputError(issues);
  if (given) return { areaKm2, thicknessM: Float64Array.from(bands, (b, i) => (b.glacierFraction > 0 ? given[i] : 0)) };
  const volumeKm3 = (parts ?? [totalKm2]).reduce((s, a) => s + glacierVolumeKm3(a, options.coefficientKm, options.exponent), 0);
  const meanM = totalKm2 > 0 ? (volumeKm3 / totalKm2) * 1000 : 0;
  return { areaKm2, thicknessM: Float64Array.from(areaKm2, (a) => (a > 0 ? meanM : 0)) };
}

/** Glacier volume, km³ (Σ area × thickness). */
export function glacierVolumeOf(state: GlacierState): number {
  let v = 0;
  for (let i = 0; i < state.areaKm2.length; i++) v += state.areaKm2[i] * state.thicknessM[i];
  return v / 1000;
}
