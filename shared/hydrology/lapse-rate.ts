import { fitLine } from './line-fit';
import { MONTHS, MONTH_NAMES, type StationClimate } from './stations';

/** The temperature gradient of one month. */
export interface MonthlyLapseRate {
  /** 1 = January. */
  month: number;
  /** dT/dz, K km⁻¹ (negative: cooler with height). */
  lapseRateKPerKm: number;
  /** Standard error of the fitted lapse rate, K km⁻¹; null when assumed or fitted through two stations. */
  standardErrorKPerKm: number | null;
  /** Temperature of the fitted line at sea level, °C; null when assumed. */
  interceptC: number | null;
  /** r² of the fit; null when assumed. */
  r2: number | null;
  /** Stations with a value this month. */
  n: number;
  /** 'fitted' by least squares through the stations, or 'assumed' (fewer than two stations). */
  status: 'fitted' | 'assumed';
  /** Plain sentence for the product, e.g. "Assumed, not fitted: only one station has data in May." */
  note: string;
}

/**
 * Per-month temperature lapse rate by least squares over the stations' monthly means
 * (T = a + Γ z; Γ and its standard error in K km⁻¹). Months where fewer than two stations have a
 * value get the assumed lapse rate and say so. Free-air environmental lapse rate −6.5 K km⁻¹
 * (ICAO standard atmosphere); on glaciers in the ablation season often ≈ −5 K km⁻¹ (Gardner et
 * al. 2009, J. Climate) — the caller chooses the assumed value.
 *
 * @param stations checked stations (see checkStations); their `monthlyTemperatureC`
 * @param assumedKPerKm lapse rate for months with fewer than two stations, K km⁻¹
 * @throws HydrologyInputError when two or more stations of a month share one elevation
 * @example fitMonthlyLapseRates([{ name: 'A', elevationM: 2000, monthlyTemperatureC: Array(12).fill(5) }], -6.5)[0].status // 'assumed'
 */
export function fitMonthlyLapseRates(stations: readonly StationClimate[], assumedKPerKm: number): MonthlyLapseRate[] {
  return Array.from({ length: MONTHS }, (_, m) => {
    const points = stations.flatMap((s) => {
      const t = s.monthlyTemperatureC?.[m];
      return t === null || t === undefined ? [] : [{ z: s.elevationM, t }];
    });
    const month = m + 1;
    if (points.length < 2) {
      const why = points.length === 1 ? `only one station has data in ${MONTH_NAMES[m]}` : `no station has data in ${MONTH_NAMES[m]}`;
      return { month, lapseRateKPerKm: assumedKPerKm, standardErrorKPerKm: null, interceptC: null, r2: null, n: points.length, status: 'assumed', note: `Assumed, not fitted: ${why}.` };
    }
    const fit = fitLine(points.map((p) => p.z), points.map((p) => p.t), `stations (temperature, ${MONTH_NAMES[m]})`);
    return {
      month,
      lapseRateKPerKm: fit.slope * 1000,
      standardErrorKPerKm: fit.slopeStandardError === null ? null : fit.slopeStandardError * 1000,
      interceptC: fit.intercept,
      r2: fit.r2,
      n: fit.n,
      status: 'fitted',
      note: fit.n === 2 ? 'Fitted through two stations: the line passes through both, so it has no standard error.' : `Fitted by least squares through ${fit.n} stations.`,
    };
  });
}
