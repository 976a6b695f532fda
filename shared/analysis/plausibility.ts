import type { SimulationResult } from '../melt/result';

/**
 * Figures a reviewing glaciologist checks a run against, computed from the run itself.
 *  - Implied degree-day factors (mm w.e. d⁻¹ K⁻¹): net snowmelt per m² of snow (surface melt less
 *    what refroze) on days the band was snow-covered and its ripe pack drained (the ablation days
 *    such factors are measured on), and clean-ice melt per m² of exposed ice on days at least half of it was snow-free, over the positive degree-days of the band's daily mean air temperature
 *    on those days (the definition of Hock 2003, J. Hydrol. 282:104, whose review gives their ranges).
 *  - Mean incoming shortwave on the glacier's snow and ice, W m⁻², over chosen months, to set
 *    beside automatic-weather-station climatologies.
 * Bands contribute in proportion to their degree-days (and area), so bands that barely melt
 * do not dominate.
 */
/**
 * Published ranges whole seasons are judged against, [low, high]:
 *  - degree-day factors reviewed by Hock 2003 (J. Hydrol. 282:104), mm w.e. d⁻¹ K⁻¹ [memory];
 *  - runoff added by black carbon and dust on polluted High Mountain Asian glaciers, a share of
 *    the baseline's (e.g. Kaspari et al. 2014; Li et al. 2017; Zhang et al. 2018) [memory].
 */
export const PUBLISHED_RANGES = {
  snowDegreeDayFactor: [2.5, 11.6],
  iceDegreeDayFactor: [6.6, 20],
  darkeningAddedRunoff: [0.05, 0.4],
} as const satisfies Record<string, readonly [number, number]>;

export interface ImpliedDegreeDayFactors {
  snow: number | null;
  ice: number | null;
}

const FULL_COVER = 0.95;
/** Ice days: at least half of the band snow-free (melt is per m² of exposed ice either way). */
const NO_COVER = 0.5;

export function impliedDegreeDayFactors(result: SimulationResult): ImpliedDegreeDayFactors {
  const { bandDay: f, bands, dayCount: nd, bandCount } = result;
  let snowMelt = 0, snowDegrees = 0, iceMelt = 0, iceDegrees = 0;
  for (let b = 0; b < bandCount; b++) {
    const area = bands.areaM2[b];
    const cleanShare = bands.cleanIceAreaM2[b] / area;
    for (let d = 0; d < nd; d++) {
      const i = b * nd + d;
      const degrees = f.airTemperatureC[i];
      if (degrees <= 0) continue;
      const cover = f.snowCoverFraction[i];
      if (cover >= FULL_COVER && f.snowMeltMm[i] > 0) {
        snowMelt += area * (f.surfaceMeltMm[i] - f.refrozenMm[i]) / cover;
        snowDegrees += area * degrees;
      } else if (cover <= NO_COVER && cleanShare > 0) {
        iceMelt += area * f.iceMeltMm[i] / (cleanShare * (1 - cover));
        iceDegrees += area * degrees;
      }
    }
  }
  return { snow: snowDegrees > 0 ? snowMelt / snowDegrees : null, ice: iceDegrees > 0 ? iceMelt / iceDegrees : null };
}

/** Mean incoming shortwave on snow and ice of glacier bands over days in the given months (0–11), W m⁻². */
export function glacierShortwave(result: SimulationResult, months: readonly number[]): number | null {
  const { bandDay: f, bands, dayCount: nd, bandCount, startDate } = result;
  const start = Date.parse(`${startDate}T00:00:00Z`);
  let sum = 0, weight = 0;
  for (let d = 0; d < nd; d++) {
    if (!months.includes(new Date(start + d * 86_400_000).getUTCMonth())) continue;
    for (let b = 0; b < bandCount; b++) {
      const glacier = bands.cleanIceAreaM2[b] + bands.debrisAreaM2[b];
      if (glacier <= 0) continue;
      sum += glacier * f.incomingShortwaveWm2[b * nd + d];
      weight += glacier;
    }
  }
  return weight > 0 ? sum / weight : null;
}
