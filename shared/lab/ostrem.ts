import { simulate } from '../melt/simulate';
import { DEFAULT_PARAMETERS, PARAMETER_RANGES } from '../melt/parameters';
import { logSpaced, surfacesInput, type BandSite } from './site';

/** Debris thicknesses of the curve: log-spaced from the engine's thinnest debris (5 mm) to 1 m; 0 m is clean ice. */
export const OSTREM_THICKNESSES_M = logSpaced(0.005, 1, 24);

/** Snow water equivalent that no season melts through, so the snow surface stays snow. */
const DEEP_SNOW_MM = 20_000;

export interface OstremPoint {
  thicknessM: number;
  meltMm: number;
}

export interface OstremCurve {
  label: string;
  temperatureDeltaC: number;
  debrisAlbedo: number;
  /** Melt under debris over the period, mm w.e., one point per thickness. */
  points: OstremPoint[];
  cleanIceMeltMm: number;
  snowMeltMm: number;
  /** The thickness with the most melt. */
  peak: OstremPoint;
  /** Thickness where melt under debris falls to clean-ice melt; null when no debris melts more than clean ice. */
  criticalThicknessM: number | null;
}

export interface OstremOptions {
  temperatureDeltaC?: number;
  debrisAlbedo?: number;
  label?: string;
}

/**
 * The Østrem curve (Østrem 1959, Geogr. Ann. 41:228): ice melt under debris against debris
 * thickness, computed by the engine's energy balance with debris conduction (Nicholson & Benn
 * 2006) for the chosen band's weather. One engine run holds every thickness as its own copy of
 * the band, plus a clean-ice copy and a deep-snow copy for reference.
 */
export function ostremCurve(site: BandSite, options: OstremOptions = {}): OstremCurve {
  const temperatureDeltaC = options.temperatureDeltaC ?? 0;
  const debrisAlbedo = options.debrisAlbedo ?? site.parameters?.debrisAlbedo ?? DEFAULT_PARAMETERS.debrisAlbedo;
  const surfaces = [
    { glacierFraction: 1, debrisFraction: 0, debrisThicknessM: 0 },
    { glacierFraction: 1, debrisFraction: 0, debrisThicknessM: 0 },
    ...OSTREM_THICKNESSES_M.map((h) => ({ glacierFraction: 1, debrisFraction: 1, debrisThicknessM: h })),
  ];
  const initialSwe = surfaces.map((_, i) => (i === 1 ? DEEP_SNOW_MM : 0));
  const input = surfacesInput({ ...site, parameters: { ...site.parameters, debrisAlbedo } }, surfaces, initialSwe, { scenario: { temperatureDeltaC } });
  const totals = simulate(input).bandTotals;
  const points = OSTREM_THICKNESSES_M.map((thicknessM, i) => ({ thicknessM, meltMm: totals.debrisIceMeltMm[i + 2] }));
  const cleanIceMeltMm = totals.iceMeltMm[0];
  return {
    label: options.label ?? 'Present climate',
    temperatureDeltaC,
    debrisAlbedo,
    points,
    cleanIceMeltMm,
    snowMeltMm: totals.snowMeltMm[1],
    peak: points.reduce((best, p) => (p.meltMm > best.meltMm ? p : best), points[0]),
    criticalThicknessM: criticalThickness(points, cleanIceMeltMm),
  };
}

/**
 * First thickness past the peak where melt drops to the clean-ice value, interpolated linearly in
 * log thickness between the two grid points around the crossing.
 */
export function criticalThickness(points: OstremPoint[], cleanIceMeltMm: number): number | null {
  const peakIndex = points.reduce((best, p, i) => (p.meltMm > points[best].meltMm ? i : best), 0);
  if (points[peakIndex].meltMm <= cleanIceMeltMm) return null;
  for (let i = peakIndex + 1; i < points.length; i++) {
    const a = points[i - 1];
    const b = points[i];
    if (b.meltMm <= cleanIceMeltMm) {
      const t = (a.meltMm - cleanIceMeltMm) / (a.meltMm - b.meltMm);
      return Math.exp(Math.log(a.thicknessM) + t * (Math.log(b.thicknessM) - Math.log(a.thicknessM)));
    }
  }
  return null;
}

/** Warming steps of the family of curves, °C. */
export const WARMING_STEPS_C = [1, 2, 3] as const;

/** How much darker the "darker debris" curve is: half the albedo in force, no lower than the parameter's minimum. */
export function darkerDebrisAlbedo(albedo: number): number {
  return Math.max(PARAMETER_RANGES.debrisAlbedo.min, Math.round((albedo / 2) * 100) / 100);
}

export interface OstremFamily {
  present: OstremCurve;
  warmer: OstremCurve[];
  darker: OstremCurve;
}

/** The curve for the present climate, at +1, +2 and +3 °C, and with darker debris. */
export function ostremFamily(site: BandSite): OstremFamily {
  const present = ostremCurve(site);
  return {
    present,
    warmer: WARMING_STEPS_C.map((dt) => ostremCurve(site, { temperatureDeltaC: dt, label: `+${dt} °C` })),
    darker: ostremCurve(site, { debrisAlbedo: darkerDebrisAlbedo(present.debrisAlbedo), label: `Darker debris (albedo ${darkerDebrisAlbedo(present.debrisAlbedo).toFixed(2)})` }),
  };
}
