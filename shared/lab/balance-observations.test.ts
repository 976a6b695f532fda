import { describe, expect, it } from 'vitest';
import { runoffDepthMm, stakeBandBalances, stakesForPeriod, statedMillimetresWe, statedPercent } from './balance-observations';

describe('observations a water balance is closed against', () => {
  it('read a stated accuracy from its words', () => {
    expect(statedPercent('±15 % at high flows (invented)')).toBe(15);
    expect(statedPercent('not stated')).toBeNull();
    expect(statedMillimetresWe('±0.2 m w.e. (invented)')).toBe(200);
    expect(statedMillimetresWe('± 150 mm w.e.')).toBe(150);
    expect(statedMillimetresWe('±10 %')).toBeNull();
  });

  it('turn daily discharge into a depth over the catchment, bridging missing days linearly (hand-checked)', () => {
    // 1 m³/s for a day over 8.64 km² is 10 mm. Days 2–3 missing between 1 and 4 m³/s: 2 and 3 m³/s.
    const period = { from: '2023-01-01', to: '2023-01-10' };
    const readings = [1, null, null, 4, 1, 1, 1, 1, 1, 1].flatMap((v, d) => (v === null ? [] : [{ date: `2023-01-${String(d + 1).padStart(2, '0')}`, value: v }]));
    expect(() => runoffDepthMm(readings, period, 8.64)).toThrow(/readings on 8 of the 10 days/);
    const eleven = [...readings, { date: '2023-01-02', value: 2 }];
    const r = runoffDepthMm(eleven, period, 8.64);
    expect(r).toEqual({ valueMm: expect.closeTo(10 * (1 + 2 + 3 + 4 + 6), 9), days: 10, filledDays: 1 });
  });

  it('count stakes read over the period (±15 days) and average them per glacier band, the uncertainty over √n', () => {
    const readings = [
      { stake: 'A', elevationM: 4100, from: '2022-10-03', to: '2023-09-28', balanceMWe: -1.2 },
      { stake: 'B', elevationM: 4150, from: '2022-10-01', to: '2023-09-30', balanceMWe: -1.6 },
      { stake: 'C', elevationM: 3500, from: '2022-10-01', to: '2023-09-30', balanceMWe: -3 },
      { stake: 'D', elevationM: 4120, from: '2023-05-01', to: '2023-09-30', balanceMWe: -2 },
    ];
    const inPeriod = stakesForPeriod(readings, { from: '2022-10-01', to: '2023-09-30' });
    expect(inPeriod.map((r) => r.stake)).toEqual(['A', 'B', 'C']);
    const bands = [{ lowerM: 3400, upperM: 3800, glacierFraction: 0 }, { lowerM: 3800, upperM: 4200, glacierFraction: 0.4 }];
    const out = stakeBandBalances(inPeriod, bands, 200);
    expect(out.bandBalances).toEqual([{ band: 1, value: expect.closeTo(-1400, 9), uncertainty: expect.closeTo(200 / Math.SQRT2, 9) }]);
    expect(out.notes[0]).toMatch(/Stake C at 3,500 m lies in no glacier band/);
  });
});
