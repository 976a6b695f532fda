import { SPECIFIC_HEAT_WATER, STEFAN_BOLTZMANN, ZERO_CELSIUS_K, SECONDS_PER_HOUR } from './constants';
import { loadPosition, radiusPosition, readClean, readCloudTerm, readImpurity } from './albedo-table';
import { erbsDiffuseFraction } from './diffuse-split';
import { readAt, sameGrid, tablePosition } from './temperature-table';
import { horizonSector, sunlitShare } from './terrain';
import { readCover } from './snow-cover';
import { afterSnowStep, buryUnderSnowfall, IMPURITY_IN } from './impurities';
import { SNOW, stepSnowFrom } from './snow-pack';
import { STEP_IN } from './surface-flux';
import { glacierHour } from './glacier-hour';
import { ACC, AIR_OVER_GLACIER, type LoopContext } from './loop-context';

/** Albedo of snow-free ground under thin snow outside the glacier (rock and soil 0.1–0.3; common practice). */
export const GROUND_ALBEDO = 0.2;
/** Band-mean SWE below which the last snow patches are taken as melted, mm w.e. (assumption). */
export const MELT_OUT_MM = 0.01;

/**
 * New snow lies evenly over the whole band as a fresh layer (covering it fully once it holds
 * FRESH_FULL_COVER_MM) on top of the older snow, whose depth varies across the band (the lognormal
 * depletion curve of snow-cover.ts). Melt takes the fresh layer first. Where nothing melts, wind
 * and settling work the fresh snow into the band's pattern: it joins the older snow with a time
 * scale of FRESH_MERGE_HOURS (assumption; see bandSurfaces). So a summer
 * snowfall briefly whitens bare ice, and a winter's snowfalls build one lognormal pack, with no
 * jump in the snow-covered share either way.
 */
export const FRESH_FULL_COVER_MM = 5;
export const FRESH_MERGE_HOURS = 72;
const MERGE_PER_HOUR = 1 - Math.exp(-1 / FRESH_MERGE_HOURS);

/**
 * Snow-covered share of a band holding `swe` mm w.e. of snow, `fresh` of it in the fresh layer,
 * whose older snow peaked at `peak` (snow-cover.ts plus the fresh layer).
 */
export function snowCover(coverTable: Float64Array, swe: number, fresh: number, peak: number): number {
  const old = swe - fresh;
  // Undepleted older snow and no fresh layer (most of a winter): the table's last node, 1.
  if (fresh <= 0 && peak > 0 && old >= peak) return 1;
  const oldCover = old > 0 && peak > 0 ? readCover(coverTable, old / peak) : 0;
  if (fresh <= 0) return oldCover;
  const freshCover = fresh >= FRESH_FULL_COVER_MM ? 1 : fresh / FRESH_FULL_COVER_MM;
  return oldCover + (1 - oldCover) * freshCover;
}

/**
 * One day of band b: its weather hour by hour (bandWeather), then its snow and glacier through
 * those hours (bandSurfaces). Adds the band's contributions to `c.acc`.
 */
export function bandDay(c: LoopContext, b: number, d: number, month: number): void {
  bandWeather(c, b, d, month);
  bandSurfaces(c, b, d, month);
}

/**
 * The weather of band b through day d, into `c.hours`: air temperature and its kelvin value,
 * precipitation phase, shortwave on the slope, incoming longwave, vapour pressure and the
 * turbulent coefficients. It depends on forcing and terrain only, never on the band's state, so
 * it is worked out for the day before any surface is touched. What all bands share for an hour
 * comes from the per-hour arrays; the band's constants are read once for the day.
 */
export function bandWeather(c: LoopContext, b: number, d: number, month: number): void {
  const run = c.run;
  const g = run.geometry;
  const p = run.params;
  const f = run.forcing;
  const sun = c.sun;
  const sw = c.shortwave;
  const a = c.acc;
  const w = c.hours;
  const i = b * 12 + month;
  const temperatureOffset = g.temperatureOffsetK[i];
  const precipitationFactor = g.precipitationMultiplier[i];
  const glacierDelta = g.cleanIceShare[b] > 0 || g.debrisShare[b] > 0 ? g.glacierTemperatureDeltaK[i] : 0;
  const pressureKPa = g.pressureKPa[b];
  const vapourFactor = g.vapourFactor[b];
  const cosSlope = g.cosSlope[b];
  const sinSlopeCosAspect = g.sinSlopeCosAspect[b];
  const sinSlopeSinAspect = g.sinSlopeSinAspect[b];
  const skyView = g.skyView[b];
  const groundView = g.groundView[b];
  const reflected = p.terrainAlbedo * groundView;
  const horizonOffset = g.hasHorizon[b] ? b * g.horizonSectors : -1;
  const width = p.rainSnowTransitionK;
  const snowTop = p.rainSnowThresholdC + width / 2;
  const inverseWidth = width > 0 ? 1 / width : 0;
  // Emissivity and vapour pressure are tabulated on one grid of air temperature: one position serves both.
  const oneGrid = sameGrid(run.emissivity, run.airVapour);

  for (let k = 0, h = d * 24; k < 24; k++, h++) {
    const airC = f.temperatureC[h] + temperatureOffset;
    a[ACC.airTemperature] += airC;
    const precipitation = f.precipitationMm[h] * precipitationFactor;
    let rain = 0;
    let snow = 0;
    if (precipitation > 0) {
      const share = width > 0 ? (snowTop - airC) * inverseWidth : airC < snowTop ? 1 : 0;
      snow = precipitation * (share < 0 ? 0 : share > 1 ? 1 : share);
      rain = precipitation - snow;
      a[ACC.snowfall] += snow;
      a[ACC.rainfall] += rain;
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
    w.rainMm[k] = rain;
    w.snowMm[k] = snow;
    w.globalWm2[k] = global;
    w.windMs[k] = f.windMs[h];
    w.airC[k] = airC;
    airAt(c, b, h, k, oneGrid);
    if (glacierDelta !== 0) {
      w.airC[AIR_OVER_GLACIER + k] = airC + glacierDelta;
      airAt(c, b, h, AIR_OVER_GLACIER + k, oneGrid);
    }
  }
}

/**
 * The air of band b in hour h whose temperature is in slot `slot` of c.hours' air arrays: its
 * kelvin value, the incoming longwave on the band (the sky's over the sky view plus the terrain's,
 * which emits as a black body at air temperature; assumption), vapour pressure at the hour's
 * relative humidity and the turbulent coefficients, into the same slot. Integer arguments only:
 * where V8 does not inline a call it boxes each floating-point argument (shared/melt/README.md, Speed).
 */
function airAt(c: LoopContext, b: number, h: number, slot: number, oneGrid: boolean): void {
  const run = c.run;
  const g = run.geometry;
  const w = c.hours;
  const airC = w.airC[slot];
  const tk = airC + ZERO_CELSIUS_K;
  const tk2 = tk * tk;
  const inverseTk = 1 / tk;
  const wind = run.forcing.windMs[h];
  const exchange = run.params.exchangeCoefficient;
  const position = tablePosition(run.airVapour, airC);
  const skyEmissivity = readAt(run.emissivity, oneGrid ? position : tablePosition(run.emissivity, airC)) * c.clearSkyEmissivityScale[h] + c.overcastEmissivity[h];
  w.airK[slot] = tk;
  w.longInWm2[slot] = (skyEmissivity * g.skyView[b] + g.groundView[b]) * STEFAN_BOLTZMANN * tk2 * tk2;
  w.vapourPa[slot] = run.forcing.relativeHumidity[h] * readAt(run.airVapour, position);
  w.sensibleCoefficient[slot] = g.pressurePa[b] * c.cpOverRd * exchange * inverseTk * wind;
  w.vapourCoefficient[slot] = c.vapourOverRd * exchange * inverseTk * wind;
}

/**
 * Band b's snow and exposed glacier through the 24 hours of day d whose weather is in `c.hours`:
 * snowfall, snow cover, snow albedo (with the thin-snow effect over what lies below), the
 * snowpack's energy and water (stepSnow, or the reference models' index melt), impurities and
 * grain growth, then the glacier the snow leaves exposed (glacierHour). The band's constants are
 * read once for the day, and its snow state is carried through the day in local variables and
 * written back at the end.
 *
 * Snowfall: the new snow joins the fresh layer; its grains mix with the surface layer's and its
 * temperature (at most 0 °C) with the surface layer's, and it buries the surface's impurities.
 * An hour without melt works part of the fresh layer into the older snow's pattern
 * (FRESH_MERGE_HOURS): the merged pack's relative SWE (its place on the depletion curve) is the
 * mass-weighted mean of the older snow's and the new snow's (1, undepleted), so a winter's snow
 * on last summer's remnants starts the next melt season almost fully covering the band, while a
 * little new snow on a deep, partly melted pack leaves its depletion where it was.
 */
export function bandSurfaces(c: LoopContext, b: number, d: number, month: number): void {
  const run = c.run;
  const g = run.geometry;
  const p = run.params;
  const s = run.state;
  const t = run.tables;
  const sw = c.shortwave;
  const a = c.acc;
  const w = c.hours;
  const air = c.air;
  const out = c.scratch;
  const albedoTable = run.albedo;
  const coverTable = run.cover;
  const hasGlacier = g.cleanIceShare[b] > 0 || g.debrisShare[b] > 0;
  const density = p.snowDensityKgM3;
  const thinDepth = p.thinSnowDepthM;
  const thinBelow = 8 * thinDepth;
  // Deeper than this (with a margin far beyond rounding), the depth is past thinBelow without dividing.
  const thinSolid = thinBelow * density * (1 + 1e-9);
  const i = b * 12 + month;
  const ice = t.iceAlbedo[i];
  const patch = g.debrisPatchShare[b];
  const glacier = g.cleanIceShare[b] + g.debrisShare[b];
  // What thin snow lets show through: clean ice, debris patches and the ice between them, ground.
  const below = g.cleanIceShare[b] * ice + g.debrisShare[b] * (patch * p.debrisAlbedo + (1 - patch) * ice) + (1 - glacier) * GROUND_ALBEDO;
  const dustWeight = 1000 * p.dustToBlackCarbon;
  const layerMm = p.snowSurfaceLayerMm;
  const surfaceMass = c.layers.surfaceMass;
  // As a number V8 knows to be one: the grain radius it is assigned to would otherwise be boxed every hour.
  const freshGrain = +p.freshGrainRadiusUm;
  const impurityIn = c.impurityInput;
  impurityIn[IMPURITY_IN.layerMass] = layerMm;
  impurityIn[IMPURITY_IN.scavengingBlackCarbon] = p.scavengingBlackCarbon;
  impurityIn[IMPURITY_IN.scavengingDust] = p.scavengingDust;
  impurityIn[IMPURITY_IN.freshBlackCarbon] = t.freshBlackCarbonNgG[i];
  impurityIn[IMPURITY_IN.freshDust] = t.freshDustUgG[i];
  impurityIn[IMPURITY_IN.depositBlackCarbon] = t.blackCarbonDepositionNgM2Hour[i];
  impurityIn[IMPURITY_IN.depositDust] = t.dustDepositionUgM2Hour[i];
  const deposits = t.blackCarbonDepositionNgM2Hour[i] > 0 || t.dustDepositionUgM2Hour[i] > 0;
  const maxGrain = p.maxGrainRadiusUm;
  const snowIn = c.snowInput;
  snowIn[STEP_IN.drag] = c.snowIceDrag;
  snowIn[STEP_IN.heightOverRoughness] = c.snowIceHeightOverRoughness;

  let lastLoad = NaN;
  let loadPos = 0;
  let swe = s.sweMm[b];
  let liquidMelt = s.liquidMeltMm[b];
  let liquidRain = s.liquidRainMm[b];
  let peak = s.peakSweMm[b];
  let fresh = s.freshSweMm[b];
  let grain = s.grainRadiusUm[b];
  let surfaceC = s.snowSurfaceC[b];
  let deepC = s.snowDeepC[b];

  for (let k = 0, h = d * 24; k < 24; k++, h++) {
    const airC = w.airC[k];
    const rain = w.rainMm[k];
    const snow = w.snowMm[k];
    if (snow > 0) {
      const snowC = airC < 0 ? airC : 0;
      if (swe <= 0) {
        grain = freshGrain;
        surfaceC = snowC;
        deepC = snowC;
      } else {
        grain = (grain * layerMm + freshGrain * snow) / (layerMm + snow);
        const mixed = snow < surfaceMass ? snow : surfaceMass;
        surfaceC = (surfaceC * (surfaceMass - mixed) + snowC * mixed) / surfaceMass;
      }
      impurityIn[IMPURITY_IN.snow] = snow;
      impurityIn[IMPURITY_IN.solid] = swe;
      buryUnderSnowfall(s, b, impurityIn);
      swe += snow;
      fresh += snow;
    }
    const cover = snowCover(coverTable, swe, fresh, peak);
    a[ACC.snowCover] += cover;
    if (cover <= 0 && !hasGlacier) {
      a[ACC.rainRunoff] += rain;
      continue;
    }
    const global = w.globalWm2[k];
    air.airC = airC;
    air.vapourPa = w.vapourPa[k];
    air.windMs = w.windMs[k];
    air.sensibleCoefficient = w.sensibleCoefficient[k];
    air.vapourCoefficient = w.vapourCoefficient[k];

    if (cover > 0) {
      const inverseCover = cover === 1 ? 1 : 1 / cover;
      const solid = swe * inverseCover;
      const meltLiquid = liquidMelt * inverseCover;
      const liquid = meltLiquid + liquidRain * inverseCover;
      a[ACC.rainRunoff] += rain * (1 - cover);

      // Broadband albedo (Gardner & Sharp 2010, tabulated), then the thin-snow effect over what lies below.
      let albedo = 0;
      if (global > 0) {
        const rPos = radiusPosition(grain);
        const clean = readClean(albedoTable, rPos);
        // The surface load changes only when snow falls, melts, sublimates or dust settles: its table position is kept until it does.
        const load = s.surfaceBlackCarbonNgG[b] + dustWeight * s.surfaceDustUgG[b];
        if (load !== lastLoad) {
          lastLoad = load;
          loadPos = loadPosition(load);
        }
        const loaded = clean + readImpurity(albedoTable, rPos, loadPos);
        const tau = sw.cloudOpticalThickness[h];
        albedo = loaded + 0.53 * clean * (1 - loaded) * sw.albedoSunFactor[h];
        if (tau > 0) albedo += readCloudTerm(c.cloudTerm, clean, loaded, tau, sw.cloudLogTerm[h]);
        if (solid < thinSolid) {
          const depth = solid / density;
          if (depth < thinBelow) albedo += (below - albedo) * Math.exp(-depth / thinDepth);
        }
      }
      const absorbed = global * (1 - albedo);

      snowIn[STEP_IN.rain] = rain;
      snowIn[STEP_IN.solid] = solid;
      snowIn[STEP_IN.liquid] = liquid;
      if (c.model === 0) {
        snowIn[STEP_IN.absorbed] = absorbed;
        snowIn[STEP_IN.longIn] = w.longInWm2[k];
        snowIn[STEP_IN.rainHeat] = rain > 0 && airC > 0 ? (SPECIFIC_HEAT_WATER * rain * airC) / SECONDS_PER_HOUR : 0;
        snowIn[STEP_IN.surfaceC] = surfaceC;
        snowIn[STEP_IN.deepC] = deepC;
      } else {
        const index = c.model === 1
          ? (airC > 0 ? (p.degreeDaySnow / 24) * airC : 0)
          : (airC > p.etiThresholdC ? p.etiTemperatureFactor * airC + p.etiShortwaveFactor * absorbed : 0);
        snowIn[STEP_IN.indexMelt] = index > 0 ? index : 0;
      }
      stepSnowFrom(out, snowIn, run.surfaceVapour, c.layers, air, c.stability, c.model !== 0);

      // Water and mass back to the band: what drained, what is held, what left as vapour.
      const melt = out[SNOW.melt];
      const vapour = out[SNOW.vapourLoss];
      const held = out[SNOW.liquid];
      const input = liquid + melt + rain;
      const meltShare = input > 0 ? (meltLiquid + melt) / input : 1;
      const drained = out[SNOW.drained];
      liquidMelt = cover * held * meltShare;
      liquidRain = cover * held * (1 - meltShare);
      a[ACC.snowRunoff] += cover * drained * meltShare;
      a[ACC.rainRunoff] += cover * drained * (1 - meltShare);
      a[ACC.surfaceMelt] += cover * melt;
      a[ACC.refrozen] += cover * out[SNOW.refrozen];
      if (out[SNOW.evaporating] > 0) a[ACC.evaporation] += cover * vapour;
      else a[ACC.sublimation] += cover * vapour;

      // Impurities left behind and deposited; grains grow, faster when wet.
      impurityIn[IMPURITY_IN.melt] = melt;
      impurityIn[IMPURITY_IN.vapour] = vapour;
      impurityIn[IMPURITY_IN.solid] = solid;
      impurityIn[IMPURITY_IN.solidAfter] = out[SNOW.solid];
      if (melt > 0 || vapour > 0 || deposits) afterSnowStep(s, b, impurityIn, deposits);
      surfaceC = out[SNOW.surfaceC];
      deepC = out[SNOW.deepC];
      const wet = melt > 0 || held > 0 || surfaceC > -0.05;
      const grown = grain + (wet ? c.wetGrowth : c.dryGrowth) / (grain * grain);
      grain = Math.min(grown, maxGrain);

      // The snow left, taken from the fresh layer first; without melt the fresh layer settles into the older snow.
      const left = cover * out[SNOW.solid];
      if (left < swe) {
        const rest = fresh - (swe - left);
        fresh = rest > 0 ? rest : 0;
      }
      swe = left;
      if (peak < left - fresh) peak = left - fresh;
      if (melt <= 0 && fresh > 0) {
        const old = swe - fresh;
        const moved = fresh * MERGE_PER_HOUR;
        const relative = old > 0 && peak > 0 ? old / peak : 1;
        const merged = old + moved;
        fresh -= moved;
        peak = (merged * merged) / (old * relative + moved);
      }

      a[ACC.weight] += cover;
      a[ACC.shortwaveIn] += cover * global;
      a[ACC.shortwaveAbsorbed] += cover * absorbed;
      a[ACC.longwaveNet] += cover * out[SNOW.netLongwave];
      a[ACC.sensible] += cover * out[SNOW.sensible];
      a[ACC.latent] += cover * out[SNOW.latent];
      a[ACC.albedoWeighted] += cover * albedo * global;

      if (left < MELT_OUT_MM) {
        a[ACC.snowRunoff] += left + liquidMelt;
        a[ACC.rainRunoff] += liquidRain;
        swe = liquidMelt = liquidRain = peak = fresh = 0;
        surfaceC = deepC = 0;
      }
    } else a[ACC.rainRunoff] += rain;
    if (hasGlacier && cover >= 1) {
      // No glacier exposed: ice and debris start from 0 °C when the snow next leaves them.
      s.iceSurfaceC[b] = s.iceDeepC[b] = 0;
      s.debrisSurfaceC[b] = s.debrisUpperC[b] = s.debrisLowerC[b] = 0;
    } else if (hasGlacier) {
      w.cover[k] = cover;
      glacierHour(c, b, k, month);
    }
  }

  s.sweMm[b] = swe;
  s.liquidMeltMm[b] = liquidMelt;
  s.liquidRainMm[b] = liquidRain;
  s.peakSweMm[b] = peak;
  s.freshSweMm[b] = fresh;
  s.grainRadiusUm[b] = grain;
  s.snowSurfaceC[b] = surfaceC;
  s.snowDeepC[b] = deepC;
}
