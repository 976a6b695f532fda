import { describe, expect, it } from 'vitest';
import { seededRandom } from '../analysis/random';
import { reservoirCoefficients } from './linear-reservoir';
import { DEFAULT_ROUTING_PARAMETERS, routeRunoff, steadyRoutingState, storedVolumeM3, type RunoffBySource, type RoutingParameters } from './runoff-routing';

const zeros = (n: number) => new Float64Array(n);
const only = (source: keyof RunoffBySource, series: Float64Array): RunoffBySource => ({ snow: zeros(series.length), ice: zeros(series.length), debrisIce: zeros(series.length), rain: zeros(series.length), [source]: series });
const noGroundwater: RoutingParameters = { ...DEFAULT_ROUTING_PARAMETERS, groundwaterShareSnow: 0, groundwaterShareRain: 0, groundwaterShareIce: 0, groundwaterShareDebrisIce: 0 };
const total = (v: ArrayLike<number>) => Array.from(v).reduce((s, x) => s + x, 0);
type SourceName = keyof RunoffBySource;
const bySource = (f: (s: SourceName) => Float64Array): RunoffBySource => ({ snow: f('snow'), ice: f('ice'), debrisIce: f('debrisIce'), rain: f('rain') });

describe('linear reservoir (hand-checked against S(t) = S0 e^(−t/k))', () => {
  it('k = 1 day: a day-0 inflow I leaves I e^(−1) that day, I(1 − e^(−1))² the next, then recedes by e^(−1) a day', () => {
    const params = { ...noGroundwater, iceStorageHours: 24 };
    const input = zeros(6);
    input[0] = 1000;
    const out = routeRunoff(only('ice', input), params).volumeM3.ice;
    const e = Math.exp(-1);
    expect(out[0]).toBeCloseTo(1000 * e, 9); // 1 − (k/Δt)(1 − e^(−1)) = e^(−1) for k = Δt
    expect(out[1]).toBeCloseTo(1000 * (1 - e) * (1 - e), 9);
    for (let d = 2; d < 6; d++) expect(out[d] / out[d - 1]).toBeCloseTo(e, 12);
  });

  it('recession follows the stated constant: e^(−24/16) a day for ice, e^(−24/30) for snow, e^(−1/60) for groundwater', () => {
    const input = zeros(40);
    input[0] = 1e6;
    const ice = routeRunoff(only('ice', input), noGroundwater).volumeM3.ice;
    const snow = routeRunoff(only('snow', input), noGroundwater).volumeM3.snow;
    expect(ice[5] / ice[4]).toBeCloseTo(Math.exp(-24 / 16), 12);
    expect(snow[5] / snow[4]).toBeCloseTo(Math.exp(-24 / 30), 12);
    const groundOnly = { ...noGroundwater, groundwaterShareSnow: 0.8 };
    const late = routeRunoff(only('snow', input), groundOnly).volumeM3.snow;
    // After the surface store has emptied (40 days ≫ 30 h) only groundwater recedes.
    expect(late[39] / late[38]).toBeCloseTo(Math.exp(-1 / 60), 9);
  });

  it('lags: the outflow centroid trails the inflow by about k (exact for a continuous linear reservoir); slower stores lag more', () => {
    const centroid = (v: ArrayLike<number>) => Array.from(v).reduce((s, x, i) => s + x * (i + 0.5), 0) / total(v);
    const input = zeros(400);
    input[0] = 1;
    for (const days of [2, 5, 10]) {
      const out = routeRunoff(only('snow', input), { ...noGroundwater, snowRainStorageHours: 24 * days }).volumeM3.snow;
      expect(Math.abs(centroid(out) - 0.5 - days)).toBeLessThan(0.05 * days);
    }
    const fast = routeRunoff(only('ice', input), noGroundwater).volumeM3.ice;
    const slow = routeRunoff(only('snow', input), noGroundwater).volumeM3.snow;
    expect(centroid(slow)).toBeGreaterThan(centroid(fast));
  });

  it('coefficients: keep = e^(−Δt/k), storeInflow = (k/Δt)(1 − keep)', () => {
    expect(reservoirCoefficients(2)).toEqual({ keep: Math.exp(-0.5), storeInflow: 2 * (1 - Math.exp(-0.5)) });
    expect(() => reservoirCoefficients(0)).toThrow(/storage constant/);
  });
});

describe('routing by source', () => {
  const random = seededRandom(5);
  const series = (n: number) => Float64Array.from({ length: n }, () => (random() < 0.6 ? 1e5 * random() : 0));
  const year = (): RunoffBySource => ({ snow: series(365), ice: series(365), debrisIce: series(365), rain: series(365) });

  it('conserves volume to 1e-9 each run: Σ outflow + end storage = Σ inflow + start storage', () => {
    const input = year();
    const start = steadyRoutingState({ snow: 5e4, ice: 2e4, debrisIce: 1e4, rain: 3e4 });
    const routed = routeRunoff(input, DEFAULT_ROUTING_PARAMETERS, start);
    const inflow = total(input.snow) + total(input.ice) + total(input.debrisIce) + total(input.rain);
    const balance = total(routed.volumeM3.total) + storedVolumeM3(routed.endState) - inflow - storedVolumeM3(start);
    expect(Math.abs(balance)).toBeLessThan(1e-9 * inflow);
  });

  it('property: routing never changes the total over a long enough period (a year of input, then five dry years)', () => {
    for (let trial = 0; trial < 5; trial++) {
      const input = year();
      const padded = bySource((s) => Float64Array.from({ length: 6 * 365 }, (_, d) => (d < 365 ? input[s][d] : 0)));
      const routed = routeRunoff(padded);
      for (const s of ['snow', 'ice', 'debrisIce', 'rain'] as const) {
        expect(Math.abs(total(routed.volumeM3[s]) - total(input[s]))).toBeLessThan(1e-9 * total(input[s]));
      }
    }
  });

  it('property: more input never lowers the output on any day', () => {
    for (let trial = 0; trial < 20; trial++) {
      const input = year();
      const more: RunoffBySource = { ...input, rain: Float64Array.from(input.rain, (v) => v + (random() < 0.3 ? 5e4 * random() : 0)), ice: Float64Array.from(input.ice, (v) => v + (random() < 0.1 ? 1e4 : 0)) };
      const a = routeRunoff(input).volumeM3.total;
      const b = routeRunoff(more).volumeM3.total;
      let lowest = Infinity;
      for (let d = 0; d < a.length; d++) lowest = Math.min(lowest, b[d] - a[d]);
      expect(lowest).toBeGreaterThanOrEqual(-1e-9);
    }
  });

  it('routed sources add up to the total; discharge is volume / 86400 s; the input stays as it was', () => {
    const input = year();
    const copy = Float64Array.from(input.snow);
    const routed = routeRunoff(input);
    for (let d = 0; d < 365; d += 30) {
      expect(routed.volumeM3.snow[d] + routed.volumeM3.ice[d] + routed.volumeM3.debrisIce[d] + routed.volumeM3.rain[d]).toBeCloseTo(routed.volumeM3.total[d], 6);
      expect(routed.dischargeM3s.total[d]).toBeCloseTo(routed.volumeM3.total[d] / 86400, 9);
    }
    expect(Array.from(input.snow)).toEqual(Array.from(copy));
  });

  it('continuing from the end state gives the same series as one long run', () => {
    const a = year();
    const b = year();
    const joined = bySource((s) => Float64Array.from([...Array.from(a[s]), ...Array.from(b[s])]));
    const whole = routeRunoff(joined).volumeM3.total;
    const first = routeRunoff(a);
    const second = routeRunoff(b, DEFAULT_ROUTING_PARAMETERS, first.endState).volumeM3.total;
    for (let d = 0; d < 365; d += 17) expect(second[d]).toBeCloseTo(whole[365 + d], 6);
  });

  it('a steady inflow started from the steady state gives out what comes in', () => {
    const steady = { snow: 5e4, ice: 2e4, debrisIce: 1e4, rain: 3e4 };
    const input = { snow: new Float64Array(30).fill(5e4), ice: new Float64Array(30).fill(2e4), debrisIce: new Float64Array(30).fill(1e4), rain: new Float64Array(30).fill(3e4) };
    const out = routeRunoff(input, DEFAULT_ROUTING_PARAMETERS, steadyRoutingState(steady)).volumeM3.total;
    for (const v of out) expect(v).toBeCloseTo(11e4, 6);
  });

  it('refuses a negative volume, unequal series and a storage constant out of range, naming the field', () => {
    const bad = only('rain', Float64Array.from([1, -2, 3]));
    expect(() => routeRunoff(bad)).toThrow('runoff.rain[1]: -2 m³ is not a volume ≥ 0.');
    expect(() => routeRunoff({ ...only('rain', zeros(3)), ice: zeros(2) })).toThrow(/runoff.ice: has 2 days; the snow series has 3/);
    expect(() => routeRunoff(only('rain', zeros(3)), { ...DEFAULT_ROUTING_PARAMETERS, iceStorageHours: 0 })).toThrow(/routing.iceStorageHours/);
  });
});
