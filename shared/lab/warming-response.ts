import type { OstremCurve, OstremFamily } from './ostrem';

/** Least-squares slope of y on x. */
export function slope(x: readonly number[], y: readonly number[]): number {
  const n = x.length;
  if (n < 2 || y.length !== n) throw new RangeError('slope: need two or more (x, y) pairs of equal length');
  const mx = x.reduce((s, v) => s + v, 0) / n;
  const my = y.reduce((s, v) => s + v, 0) / n;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < n; i++) {
    sxy += (x[i] - mx) * (y[i] - my);
    sxx += (x[i] - mx) ** 2;
  }
  if (sxx === 0) throw new RangeError('slope: all x values are equal');
  return sxy / sxx;
}

export interface WarmingResponse {
  /** Melt change per °C over the period, mm w.e. °C⁻¹, from the present climate to +3 °C. */
  cleanIcePerC: number;
  snowPerC: number;
  debris: { thicknessM: number; perC: number }[];
  /** At the band's own debris thickness (nearest grid thickness), or null when the band has no debris. */
  bandDebris: { thicknessM: number; perC: number } | null;
}

/**
 * Sensitivity of melt to warming, per surface: the least-squares slope of period melt against
 * the temperature change over the family's curves (0, +1, +2, +3 °C).
 */
export function warmingResponse(family: OstremFamily, bandDebrisThicknessM: number): WarmingResponse {
  const curves: OstremCurve[] = [family.present, ...family.warmer];
  const dt = curves.map((c) => c.temperatureDeltaC);
  const debris = family.present.points.map((p, i) => ({ thicknessM: p.thicknessM, perC: slope(dt, curves.map((c) => c.points[i].meltMm)) }));
  const nearest = bandDebrisThicknessM > 0
    ? debris.reduce((best, d) => (Math.abs(Math.log(d.thicknessM / bandDebrisThicknessM)) < Math.abs(Math.log(best.thicknessM / bandDebrisThicknessM)) ? d : best))
    : null;
  return {
    cleanIcePerC: slope(dt, curves.map((c) => c.cleanIceMeltMm)),
    snowPerC: slope(dt, curves.map((c) => c.snowMeltMm)),
    debris,
    bandDebris: nearest,
  };
}
