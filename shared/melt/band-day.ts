import { SPECIFIC_HEAT_WATER, STEFAN_BOLTZMANN, ZERO_CELSIUS_K, SECONDS_PER_HOUR } from './constants';
import { loadPosition, radiusPosition, readClean, readCloudTerm, readImpurity } from './albedo-table';
import { erbsDiffuseFraction } from './diffuse-split';
import { readTable } from './temperature-table';
import { horizonSector, sunlitShare } from './terrain';
import { readCover } from './snow-cover';
import { buryUnderSnowfall, depositOnSurface, enrichOnLoss } from './impurities';
import { SNOW, stepSnow, stepSnowIndex } from './snow-pack';
import { glacierHour } from './glacier-hour';
import { ACC, type LoopContext } from './loop-context';

/** Albedo of snow-free ground under thin snow outside the glacier (rock and soil 0.1–0.3; common practice). */
export const GROUND_ALBEDO = 0.2;
/** Band-mean SWE below which the last snow patches are taken as melted, mm w.e. (assumption). */
export const MELT_OUT_MM = 0.01;

/**
 * New snow lies evenly over the whole band as a fresh layer (covering it fully once it holds
 * FRESH_FULL_COVER_MM) on top of the older snow, whose depth varies across the band (the lognormal
 * depletion curve of snow-cover.ts). Melt takes the fresh layer first. Where nothing melts, wind
 * and settling work the fresh snow into the band's pattern: it joins the older snow with a time
 * scale of FRESH_MERGE_HOURS (assumption; see mergeFresh). So a summer
 * snowfall briefly whitens bare ice, and a winter's snowfalls build one lognormal pack, with no
 * jump in the snow-covered share either way.
 */
export const FRESH_FULL_COVER_MM = 5;
export const FRESH_MERGE_HOURS = 72;
const MERGE_PER_HOUR = 1 - Math.exp(-1 / FRESH_MERGE_HOURS);

/** Snow-covered share of band b now (snow-cover.ts plus the fresh layer). */
export function coverOf(c: LoopContext, b: number): number {
  const s = c.run.state;
  const fresh = s.freshSweMm[b];
  const old = s.sweMm[b] - fresh;
  const peak = s.peakSweMm[b];
  const oldCover = old > 0 && peak > 0 ? readCover(c.run.cover, old / peak) : 0;
  if (fresh <= 0) return oldCover;
  const freshCover = fresh >= FRESH_FULL_COVER_MM ? 1 : fresh / FRESH_FULL_COVER_MM;
  return oldCover + (1 - oldCover) * freshCover;
}

/** Snowfall of `snow` mm w.e. over band b at air temperature `airC`: it joins the fresh layer. */
export function addSnowfall(c: LoopContext, b: number, snow: number, airC: number, month: number): void {
  const s = c.run.state;
  const p = c.run.params;
  const t = c.run.tables;
  const old = s.sweMm[b];
  const snowC = airC < 0 ? airC : 0;
  const layer = p.snowSurfaceLayerMm;
  if (old <= 0) {
    s.grainRadiusUm[b] = p.freshGrainRadiusUm;
    s.snowSurfaceC[b] = snowC;
    s.snowDeepC[b] = snowC;
  } else {
    s.grainRadiusUm[b] = (s.grainRadiusUm[b] * layer + p.freshGrainRadiusUm * snow) / (layer + snow);
    const surfaceMass = c.layers.surfaceMass;
    const mixed = snow < surfaceMass ? snow : surfaceMass;
    s.snowSurfaceC[b] = (s.snowSurfaceC[b] * (surfaceMass - mixed) + snowC * mixed) / surfaceMass;
  }
  buryUnderSnowfall(s, b, snow, old, layer, t.freshBlackCarbonNgG[b * 12 + month], t.freshDustUgG[b * 12 + month]);
  s.sweMm[b] = old + snow;
  s.freshSweMm[b] += snow;
}

/**
 * An hour without melt works part of the fresh layer into the older snow's pattern. The merged
 * pack's relative SWE (its place on the depletion curve) is the mass-weighted mean of the older
 * snow's and the new snow's (1, undepleted), so a winter's snow on last summer's remnants starts
 * the next melt season almost fully covering the band, while a little new snow on a deep, partly
 * melted pack leaves its depletion where it was.
 */
function mergeFresh(s: LoopContext['run']['state'], b: number): void {
  const fresh = s.freshSweMm[b];
  const old = s.sweMm[b] - fresh;
  const moved = fresh * MERGE_PER_HOUR;
  const relative = old > 0 && s.peakSweMm[b] > 0 ? old / s.peakSweMm[b] : 1;
  const merged = old + moved;
  s.freshSweMm[b] = fresh - moved;
  s.peakSweMm[b] = (merged * merged) / (old * relative + moved);
}

/** Broadband albedo of band b's snow this hour, with the thin-snow effect over what lies below. */
function snowAlbedoNow(c: LoopContext, b: number, h: number, month: number, solid: number): number {
  const s = c.run.state;
  const p = c.run.params;
  const g = c.run.geometry;
  const sw = c.shortwave;
  const rPos = radiusPosition(s.grainRadiusUm[b]);
  const clean = readClean(c.run.albedo, rPos);
  const impurity = readImpurity(c.run.albedo, rPos, loadPosition(s.surfaceBlackCarbonNgG[b] + 1000 * p.dustToBlackCarbon * s.surfaceDustUgG[b]));
  const loaded = clean + impurity;
  const tau = sw.cloudOpticalThickness[h];
  let albedo = loaded + 0.53 * clean * (1 - loaded) * sw.albedoSunFactor[h];
  if (tau > 0) albedo += readCloudTerm(c.cloudTerm, clean, loaded, tau, sw.cloudLogTerm[h]);
  const depth = solid / p.snowDensityKgM3;
  if (depth < 8 * p.thinSnowDepthM) {
    const ice = c.run.tables.iceAlbedo[b * 12 + month];
    const patch = g.debrisPatchShare[b];
    const glacier = g.cleanIceShare[b] + g.debrisShare[b];
    const below = g.cleanIceShare[b] * ice + g.debrisShare[b] * (patch * p.debrisAlbedo + (1 - patch) * ice) + (1 - glacier) * GROUND_ALBEDO;
    albedo += (below - albedo) * Math.exp(-depth / p.thinSnowDepthM);
  }
  return albedo;
}

/** One hour of band b's snow, given the shortwave on the band and the incoming longwave. */
export function snowHour(c: LoopContext, b: number, h: number, month: number, cover: number, global: number, longIn: number, rain: number, airC: number): void {
  const s = c.run.state;
  const p = c.run.params;
  const a = c.acc;
  const out = c.scratch;
  const w = s.sweMm[b];
  const inverseCover = 1 / cover;
  const solid = w * inverseCover;
  const meltLiquid = s.liquidMeltMm[b] * inverseCover;
  const liquid = meltLiquid + s.liquidRainMm[b] * inverseCover;
  a[ACC.rainRunoff] += rain * (1 - cover);
  const albedo = global > 0 ? snowAlbedoNow(c, b, h, month, solid) : 0;
  const absorbed = global * (1 - albedo);
  if (c.model === 0) {
    const rainHeat = rain > 0 && airC > 0 ? (SPECIFIC_HEAT_WATER * rain * airC) / SECONDS_PER_HOUR : 0;
    stepSnow(out, c.run.surfaceVapour, c.layers, c.air, absorbed, longIn, rain, rainHeat, s.snowSurfaceC[b], s.snowDeepC[b], solid, liquid,
      c.snowIceDrag, c.snowIceHeightOverRoughness, c.stability);
  } else {
    const melt = c.model === 1
      ? (airC > 0 ? (p.degreeDaySnow / 24) * airC : 0)
      : (airC > p.etiThresholdC ? p.etiTemperatureFactor * airC + p.etiShortwaveFactor * absorbed : 0);
    stepSnowIndex(out, c.layers, melt > 0 ? melt : 0, rain, solid, liquid);
  }
  const melt = out[SNOW.melt];
  const vapour = out[SNOW.vapourLoss];
  const input = liquid + melt + rain;
  const meltShare = input > 0 ? (meltLiquid + melt) / input : 1;
  const drained = out[SNOW.drained];
  s.liquidMeltMm[b] = cover * out[SNOW.liquid] * meltShare;
  s.liquidRainMm[b] = cover * out[SNOW.liquid] * (1 - meltShare);
  a[ACC.snowRunoff] += cover * drained * meltShare;
  a[ACC.rainRunoff] += cover * drained * (1 - meltShare);
  a[ACC.surfaceMelt] += cover * melt;
  a[ACC.refrozen] += cover * out[SNOW.refrozen];
  if (out[SNOW.evaporating] > 0) a[ACC.evaporation] += cover * vapour;
  else a[ACC.sublimation] += cover * vapour;

  if (melt > 0 || vapour > 0) enrichOnLoss(s, b, melt, vapour, solid, p.snowSurfaceLayerMm, p.scavengingBlackCarbon, p.scavengingDust);
  const depositBc = c.run.tables.blackCarbonDepositionNgM2Hour[b * 12 + month];
  const depositDust = c.run.tables.dustDepositionUgM2Hour[b * 12 + month];
  if (depositBc > 0 || depositDust > 0) depositOnSurface(s, b, depositBc, depositDust, out[SNOW.solid], p.snowSurfaceLayerMm);
  const r = s.grainRadiusUm[b];
  const wet = melt > 0 || out[SNOW.liquid] > 0 || out[SNOW.surfaceC] > -0.05;
  const grown = r + (wet ? c.wetGrowth : c.dryGrowth) / (r * r);
  s.grainRadiusUm[b] = grown < p.maxGrainRadiusUm ? grown : p.maxGrainRadiusUm;
  s.snowSurfaceC[b] = out[SNOW.surfaceC];
  s.snowDeepC[b] = out[SNOW.deepC];
  const left = cover * out[SNOW.solid];
  if (left < w) {
    const fresh = s.freshSweMm[b] - (w - left);
    s.freshSweMm[b] = fresh > 0 ? fresh : 0;
  }
  s.sweMm[b] = left;
  if (s.peakSweMm[b] < left - s.freshSweMm[b]) s.peakSweMm[b] = left - s.freshSweMm[b];
  if (melt <= 0 && s.freshSweMm[b] > 0) mergeFresh(s, b);

  a[ACC.weight] += cover;
  a[ACC.shortwaveIn] += cover * global;
  a[ACC.shortwaveAbsorbed] += cover * absorbed;
  a[ACC.longwaveNet] += cover * out[SNOW.netLongwave];
  a[ACC.sensible] += cover * out[SNOW.sensible];
  a[ACC.latent] += cover * out[SNOW.latent];
  a[ACC.albedoWeighted] += cover * albedo * global;

  if (left < MELT_OUT_MM) {
    a[ACC.snowRunoff] += left + s.liquidMeltMm[b];
    a[ACC.rainRunoff] += s.liquidRainMm[b];
    s.sweMm[b] = s.liquidMeltMm[b] = s.liquidRainMm[b] = s.peakSweMm[b] = s.freshSweMm[b] = 0;
    s.snowSurfaceC[b] = s.snowDeepC[b] = 0;
  }
}

/**
 * Sets the turbulent air of hour h at air temperature `airC` (c.air) and returns the incoming
 * longwave on the band: the sky's, seen over the sky view, plus the terrain's, which emits as a
 * black body at air temperature (assumption).
 */
function airAt(c: LoopContext, h: number, airC: number, skyView: number, groundView: number, sensibleScale: number, vapourScale: number): number {
  const run = c.run;
  const f = run.forcing;
  const air = c.air;
  const tk = airC + ZERO_CELSIUS_K;
  const tk2 = tk * tk;
  const inverseTk = 1 / tk;
  const skyEmissivity = readTable(run.emissivity, airC) * c.clearSkyEmissivityScale[h] + c.overcastEmissivity[h];
  const wind = f.windMs[h];
  air.airC = airC;
  air.vapourPa = f.relativeHumidity[h] * readTable(run.airVapour, airC);
  air.windMs = wind;
  air.sensibleCoefficient = sensibleScale * inverseTk * wind;
  air.vapourCoefficient = vapourScale * inverseTk * wind;
  return (skyEmissivity * skyView + groundView) * STEFAN_BOLTZMANN * tk2 * tk2;
}

/**
 * One day of band b, hour by hour: precipitation phase, snowfall, radiation on the slope, the
 * snow and the exposed glacier. Adds the band's contributions to `c.acc`. The band's constants
 * are read once for the day; what all bands share for an hour comes from the per-hour arrays.
 * Where the band climate cools the air over snow-free glacier (katabatic damping), the glacier
 * hour gets its own air temperature, longwave and exchange coefficients.
 */
export function bandDay(c: LoopContext, b: number, d: number, month: number): void {
  const run = c.run;
  const g = run.geometry;
  const p = run.params;
  const f = run.forcing;
  const sun = c.sun;
  const sw = c.shortwave;
  const a = c.acc;
  const temperatureOffset = g.temperatureOffsetK[b * 12 + month];
  const precipitationFactor = g.precipitationMultiplier[b * 12 + month];
  const glacierDelta = g.glacierTemperatureDeltaK[b * 12 + month];
  const hasGlacier = g.cleanIceShare[b] > 0 || g.debrisShare[b] > 0;
  const pressureKPa = g.pressureKPa[b];
  const vapourFactor = g.vapourFactor[b];
  const cosSlope = g.cosSlope[b];
  const sinSlopeCosAspect = g.sinSlopeCosAspect[b];
  const sinSlopeSinAspect = g.sinSlopeSinAspect[b];
  const skyView = g.skyView[b];
  const groundView = g.groundView[b];
  const reflected = p.terrainAlbedo * groundView;
  const horizonOffset = g.hasHorizon[b] ? b * g.horizonSectors : -1;
  const sensibleScale = g.pressurePa[b] * c.cpOverRd * p.exchangeCoefficient;
  const vapourScale = c.vapourOverRd * p.exchangeCoefficient;
  const width = p.rainSnowTransitionK;
  const snowTop = p.rainSnowThresholdC + width / 2;
  const inverseWidth = width > 0 ? 1 / width : 0;

  for (let h = d * 24; h < d * 24 + 24; h++) {
    const airC = f.temperatureC[h] + temperatureOffset;
    a[ACC.airTemperature] += airC;
    const precipitation = f.precipitationMm[h] * precipitationFactor;
    let rain = 0;
    if (precipitation > 0) {
      const share = width > 0 ? (snowTop - airC) * inverseWidth : airC < snowTop ? 1 : 0;
      const snow = precipitation * (share < 0 ? 0 : share > 1 ? 1 : share);
      rain = precipitation - snow;
      a[ACC.snowfall] += snow;
      a[ACC.rainfall] += rain;
      if (snow > 0) addSnowfall(c, b, snow, airC, month);
    }
    const cover = coverOf(c, b);
    a[ACC.snowCover] += cover;
    if (cover <= 0 && !hasGlacier) {
      a[ACC.rainRunoff] += rain;
      continue;
    }

    // Shortwave on the slope: ASCE-EWRI clear sky × cloud index, split by Erbs et al., beam cut by horizons.
    let global = 0;
    const cosZ = sun.cosZenith[h];
    if (cosZ > 0) {
      const kb = 0.98 * Math.exp(sw.pressureTerm[h] * pressureKPa + sw.vapourTerm[h] * vapourFactor);
      const kdA = 0.35 - 0.36 * kb;
      const kdB = 0.18 + 0.82 * kb;
      const clearness = sw.cloudIndex[h] * (kb + (kdA < kdB ? kdA : kdB));
      const horizontal = clearness * sw.topHorizontalWm2[h];
      const diffuse = horizontal * erbsDiffuseFraction(clearness);
      const cosI = cosSlope * cosZ + sinSlopeCosAspect * sun.sinZenithCosAzimuth[h] + sinSlopeSinAspect * sun.sinZenithSinAzimuth[h];
      let direct = cosI > 0 ? (horizontal - diffuse) * sw.inverseCosZenith[h] * cosI : 0;
      if (direct > 0 && horizonOffset >= 0) {
        direct *= sunlitShare(g.horizonDeg, (horizonOffset + horizonSector(sun.azimuthDeg[h], g.horizonSectors)) * 5, sun.elevationDeg[h]);
      }
      global = direct + diffuse * skyView + reflected * horizontal;
    }
    const longIn = airAt(c, h, airC, skyView, groundView, sensibleScale, vapourScale);

    if (cover > 0) snowHour(c, b, h, month, cover, global, longIn, rain, airC);
    else a[ACC.rainRunoff] += rain;
    if (!hasGlacier) continue;
    if (glacierDelta === 0) glacierHour(c, b, month, 1 - cover, global, longIn, airC, airC + ZERO_CELSIUS_K);
    else {
      const glacierC = airC + glacierDelta;
      const glacierLongIn = airAt(c, h, glacierC, skyView, groundView, sensibleScale, vapourScale);
      glacierHour(c, b, month, 1 - cover, global, glacierLongIn, glacierC, glacierC + ZERO_CELSIUS_K);
    }
  }
}
