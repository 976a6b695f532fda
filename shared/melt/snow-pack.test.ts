import { describe, expect, it } from 'vitest';
import { SNOW, snowConductivity, snowLayers, stepSnow } from './snow-pack';
import { LATENT_HEAT_FUSION, SECONDS_PER_HOUR, SPECIFIC_HEAT_ICE } from './constants';
import { surfaceVapourTable, saturationOverWater } from './vapour';
import { neutralExchange, roughnessForExchange } from './turbulence';
import type { TurbulentAir } from './surface-flux';
import { simulate } from './simulate';
import { steadyClimate } from './fixtures/steady-climate';

const table = surfaceVapourTable();
const layers = snowLayers(350, 0.05);
const exchange = neutralExchange(roughnessForExchange(0.002));

/** Air over the snow: ρa cp CH u and ρa CH u 0.622/P at 5000 m (54 kPa) for CH = 0.002. */
function air(airC: number, humidity: number, windMs: number): TurbulentAir {
  const tk = airC + 273.15;
  return {
    airC, windMs, vapourPa: humidity * saturationOverWater(airC),
    sensibleCoefficient: (54_000 / (287.05 * tk)) * 1005 * 0.002 * windMs,
    vapourCoefficient: (0.622 / (287.05 * tk)) * 0.002 * windMs,
  };
}

/** Runs a pack through `hours` of a daily cycle; returns totals per m². */
function runPack(solid: number, hours: number, weather: (h: number) => { sw: number; lw: number; air: TurbulentAir; rain?: number }) {
  const out = new Float64Array(16);
  let t1 = 0, t2 = 0, liquid = 0, mass = solid;
  let flux = 0, melt = 0, refrozen = 0, drained = 0, vapour = 0;
  const start = { t1, t2 };
  for (let h = 0; h < hours; h++) {
    const w = weather(h);
    stepSnow(out, table, layers, w.air, w.sw, w.lw, w.rain ?? 0, 0, t1, t2, mass, liquid, exchange.drag, exchange.heightOverRoughness, true);
    flux += (w.sw + out[SNOW.netLongwave] + out[SNOW.sensible] + out[SNOW.latent]) * SECONDS_PER_HOUR;
    melt += out[SNOW.melt];
    refrozen += out[SNOW.refrozen];
    drained += out[SNOW.drained];
    vapour += out[SNOW.vapourLoss];
    t1 = out[SNOW.surfaceC];
    t2 = out[SNOW.deepC];
    mass = out[SNOW.solid];
    liquid = out[SNOW.liquid];
  }
  return { flux, melt, refrozen, drained, vapour, t1, t2, mass, liquid, start };
}

const summerDay = (h: number) => {
  const k = h % 24;
  const sun = Math.max(0, Math.cos((2 * Math.PI * (k - 12)) / 24));
  return { sw: 220 * sun, lw: 250, air: air(2 + 4 * Math.cos((2 * Math.PI * (k - 15)) / 24), 0.6, 2) };
};

describe('snowpack surface energy balance (two layers, implicit step)', () => {
  it('closes energy: Σ fluxes = Lf (melt − refrozen) + heat stored in the layers, to 10⁻⁶ of the fluxes', () => {
    const r = runPack(5000, 24 * 10, summerDay);
    const m1 = layers.surfaceMass;
    const m2 = layers.deepMass;
    const stored = SPECIFIC_HEAT_ICE * (m1 * (r.t1 - r.start.t1) + m2 * (r.t2 - r.start.t2));
    const balance = LATENT_HEAT_FUSION * (r.melt - r.refrozen) + stored;
    expect(Math.abs(r.flux - balance)).toBeLessThan(1e-6 * Math.abs(r.flux) + 1e-3);
  });
  it('a 10 m w.e. pack and a 1 m w.e. pack melt the same at the surface under the same weather (within 1 %)', () => {
    const deep = runPack(10_000, 24 * 20, summerDay);
    const shallow = runPack(1_000, 24 * 20, summerDay);
    expect(deep.melt).toBeGreaterThan(10);
    expect(Math.abs(deep.melt - shallow.melt) / deep.melt).toBeLessThan(0.01);
  });
  it('night-time cooling chills the surface layer, not the whole pack: after a clear night a dry pack\'s surface is below −3 °C, the layer below within 0.5 K of 0 °C', () => {
    const r = runPack(3000, 10, () => ({ sw: 0, lw: 200, air: air(-6, 0.5, 2) }));
    expect(r.t1).toBeLessThan(-3);
    expect(r.t2).toBeGreaterThan(-0.5);
  });
  it('a wet pack refreezes its held water at night instead of cooling: the surface stays at 0 °C while water is left', () => {
    const r = runPack(3000, 24 + 3, (h) => (h < 24 ? summerDay(h) : { sw: 0, lw: 200, air: air(-6, 0.5, 2) }));
    expect(r.liquid).toBeGreaterThan(0);
    expect(r.refrozen).toBeGreaterThan(0);
    expect(r.t1).toBeGreaterThan(-0.5);
  });
  it('rain on a cold pack refreezes and warms it: 5 mm of rain into a pack at −8 °C refreezes and releases 5 · Lf', () => {
    const out = new Float64Array(16);
    const calm = { ...air(0.5, 1, 0.5), sensibleCoefficient: 0, vapourCoefficient: 0 };
    const lw = 315.6 + 4 * 5.670374419e-8 * 265.15 ** 3 * (265.15 - 273.15) + 0; // about what a −8 °C surface emits
    stepSnow(out, table, layers, calm, 0, lw, 5, 0, -8, -8, 1000, 0, exchange.drag, exchange.heightOverRoughness, false);
    expect(out[SNOW.refrozen]).toBeCloseTo(5, 6);
    expect(out[SNOW.drained]).toBe(0);
    expect(out[SNOW.surfaceC]).toBeGreaterThan(-8);
  });
  it('meltwater is held up to the holding capacity (5 % of the active layers) before any drains', () => {
    const r = runPack(2000, 24 * 3, summerDay);
    const capacity = 0.05 * (layers.surfaceMass + layers.deepMass);
    expect(r.melt).toBeGreaterThan(capacity);
    expect(r.liquid).toBeLessThanOrEqual(capacity + 1e-9);
    expect(r.drained + r.liquid + r.refrozen).toBeCloseTo(r.melt, 6);
  });
  it('dry windy air sublimates snow at the rate reported on high Asian glaciers: 0.5–3 mm w.e. a day at −5 °C, RH 30 %, 6 m s⁻¹ (Stigter et al. 2018, ≈ 1–2 mm d⁻¹ on windy dry days) [memory]', () => {
    const r = runPack(2000, 24, (h) => ({ sw: 200 * Math.max(0, Math.cos((2 * Math.PI * (h - 12)) / 24)), lw: 180, air: air(-5, 0.3, 6) }));
    expect(r.vapour).toBeGreaterThan(0.5);
    expect(r.vapour).toBeLessThan(3);
  });
  it('saturated calm air exchanges almost no vapour (< 0.1 mm a day)', () => {
    const r = runPack(2000, 24, () => ({ sw: 0, lw: 305, air: air(-1, 1, 0.5) }));
    expect(Math.abs(r.vapour)).toBeLessThan(0.1);
  });
  it('snow conductivity follows Sturm et al. 1997 (0.18 W m⁻¹ K⁻¹ at 350 kg m⁻³) [memory]', () => {
    expect(snowConductivity(350)).toBeCloseTo(0.138 - 1.01 * 0.35 + 3.233 * 0.35 ** 2, 12);
  });
});

describe('a whole band: surface melt does not depend on pack depth', () => {
  it('two bands with 1 and 10 m w.e. of snow melt the same over a summer month (within 2 %)', () => {
    const r = simulate(steadyClimate({ days: 30, start: '2022-07-01', meanC: 3, bands: [{ glacierFraction: 0 }, { glacierFraction: 0 }], initialSweMm: [1000, 10_000] }));
    const t = r.bandTotals.surfaceMeltMm;
    expect(t[0]).toBeGreaterThan(100);
    expect(Math.abs(t[0] - t[1]) / t[1]).toBeLessThan(0.02);
  });
});
