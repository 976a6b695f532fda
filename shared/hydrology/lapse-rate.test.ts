import { describe, expect, it } from 'vitest';
import { fitMonthlyLapseRates } from './lapse-rate';
import type { StationClimate } from './stations';

const month = (july: number | null, rest = 0): (number | null)[] => Array.from({ length: 12 }, (_, m) => (m === 6 ? july : rest));

describe('monthly lapse rates from stations', () => {
  it('fits each month by least squares; hand-worked July: (1500, 12), (2500, 5), (3500, 1) → −5.5 K/km, SE 1.5 K/km, r² 0.9528', () => {
    // x̄ = 2500, ȳ = 6, Sxx = 2·10⁶, Sxy = −1.1·10⁴ → b = −0.0055 K/m; residuals 0.5, −1, 0.5 → SSR 1.5,
    // s = √1.5, SE = √1.5/√(2·10⁶) = 8.660·10⁻⁴ K/m; SST = 62 → r² = 1 − 1.5/62 [computed by hand].
    const stations: StationClimate[] = [
      { name: 'Valley', elevationM: 1500, monthlyTemperatureC: month(12) },
      { name: 'Shoulder', elevationM: 2500, monthlyTemperatureC: month(5) },
      { name: 'Col', elevationM: 3500, monthlyTemperatureC: month(1) },
    ];
    const july = fitMonthlyLapseRates(stations, -6.5)[6];
    expect(july.status).toBe('fitted');
    expect(july.lapseRateKPerKm).toBeCloseTo(-5.5, 12);
    expect(july.standardErrorKPerKm).toBeCloseTo(Math.sqrt(1.5) / Math.sqrt(2e6) * 1000, 12);
    expect(july.r2).toBeCloseTo(1 - 1.5 / 62, 12);
    expect(july.n).toBe(3);
  });

  it('with one station the lapse rate is assumed, not fitted, and says so', () => {
    const rates = fitMonthlyLapseRates([{ name: 'Valley', elevationM: 1500, monthlyTemperatureC: month(12) }], -6.5);
    expect(rates.every((r) => r.status === 'assumed' && r.lapseRateKPerKm === -6.5)).toBe(true);
    expect(rates[6].note).toBe('Assumed, not fitted: only one station has data in July.');
  });

  it('a month without data at the second station falls back to the assumed value; the others are fitted', () => {
    const rates = fitMonthlyLapseRates([
      { name: 'Valley', elevationM: 1500, monthlyTemperatureC: month(12, 0) },
      { name: 'Col', elevationM: 3500, monthlyTemperatureC: month(null, -10) },
    ], -5);
    expect(rates[6]).toMatchObject({ status: 'assumed', lapseRateKPerKm: -5, n: 1 });
    expect(rates[0]).toMatchObject({ status: 'fitted', lapseRateKPerKm: -5, standardErrorKPerKm: null, n: 2 });
    expect(rates[0].note).toMatch(/two stations/);
  });

  it('two stations at one elevation cannot give a gradient: the month is named', () => {
    expect(() => fitMonthlyLapseRates([
      { name: 'A', elevationM: 2000, monthlyTemperatureC: month(5) },
      { name: 'B', elevationM: 2000, monthlyTemperatureC: month(6) },
    ], -6.5)).toThrow(/temperature, January.*same position/);
  });
});
