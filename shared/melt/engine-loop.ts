import { MELTING_SURFACE_LONGWAVE_WM2, SECONDS_PER_HOUR, STEFAN_BOLTZMANN, ZERO_CELSIUS_K } from './constants';
import { MM_PER_JOULE, spendSurplus } from './energy';
import { readTable, tablePosition } from './albedo-table';
import { readEmissivity } from './longwave';
import { debrisSurfaceTemperature } from './debris';
import { extraterrestrialNormal } from './shortwave';
import type { PreparedRun } from './prepare';
import type { SunTrack } from './sun-track';
import type { MeltModel, SimulationResult } from './result';

export interface Progress {
  /** Days simulated so far and in total. */
  day: number;
  dayCount: number;
  fraction: number;
}
export type ProgressCallback = (progress: Progress) => void;

const MODEL_CODE: Record<MeltModel, number> = { 'energy-balance': 0, 'degree-day': 1, 'enhanced-temperature-index': 2 };

/**
 * The simulation loop: every simulated day, every band, every hour. All arrays are allocated before the loop;
 * inside it there is no allocation and the only transcendental call per band is the beam
 * transmission exp(ln ψ / cos Z · P/P0) in daylight (Hock 1999). Albedo and air emissivity come
 * from tables; the sun comes from the per-hour track.
 *
 * Surfaces of a band: snow covers the whole band while SWE > 0; then the glacier shares (clean
 * ice, debris-covered ice) melt and the rest of the band, bare ground, gives no melt. In the hour
 * the snow runs out, the unused share of the hour's melt energy goes to the ice.
 */
export function runHours(run: PreparedRun, sun: SunTrack, model: MeltModel, result: SimulationResult, onProgress?: ProgressCallback): void {
  const { params: p, geometry: g, forcing: f, tables, emissivity, timeline } = run;
  const modelCode = MODEL_CODE[model];
  const nb = g.count;
  const nd = timeline.dayCount;
  const out = result.bandDay;
  const { cosZenith, sinZenithCosAzimuth, sinZenithSinAzimuth, beamExponent, albedoSunFactor } = sun;
  const { temperatureC, precipitationMm, cloudFactor, clearSkyEmissivityScale, overcastEmissivity, sensibleScale } = f;
  const { temperatureOffsetC, precipitationFactor, pressurePa, pressureRatio, cosSlope, sinSlopeCosAspect, sinSlopeSinAspect,
    skyView, groundView, cleanIceShare, debrisShare, debrisConductance, debrisThicknessM } = g;

  const swe = Float64Array.from(run.initialSweMm);
  const grain = new Float64Array(nb).fill(p.freshGrainRadiusUm);
  const coldContent = new Float64Array(nb);
  const debrisFactor = Float64Array.from(debrisThicknessM, (h) => p.debrisHalfThicknessM / (p.debrisHalfThicknessM + h));

  const diffuseRatio = p.diffuseFraction / (1 - p.diffuseFraction);
  const terrainAlbedo = p.terrainAlbedo;
  const snowTop = p.rainSnowThresholdC + p.rainSnowTransitionK / 2;
  const snowWidth = p.rainSnowTransitionK;
  const freshGrain = p.freshGrainRadiusUm;
  const surfaceLayer = p.snowSurfaceLayerMm;
  const maxGrain = p.maxGrainRadiusUm;
  const grainScale = 1e9 / (4 * Math.PI) / 24; // µm per hour from mm³ per day: dr = dV/(4πr²)
  const wetGrowth = p.wetGrainGrowthMm3PerDay * grainScale;
  const dryGrowth = p.dryGrainGrowthMm3PerDay * grainScale;
  const iceLayer = p.iceSurfaceLayerMm;
  const debrisAlbedo = p.debrisAlbedo;
  const debrisEmissivity = p.debrisEmissivity;
  const debrisEmission = debrisEmissivity * STEFAN_BOLTZMANN;
  const ddfSnowHour = p.degreeDaySnow / 24;
  const ddfIceHour = p.degreeDayIce / 24;
  const etiThreshold = p.etiThresholdC;
  const etiTemperature = p.etiTemperatureFactor;
  const etiShortwave = p.etiShortwaveFactor;

  for (let d = 0; d < nd; d++) {
    const month = timeline.months[d];
    const snowClean = tables.snow[month].clean;
    const snowImpurity = tables.snow[month].impurity;
    const iceAlbedo = tables.iceAlbedo[month];
    const topNormal = extraterrestrialNormal(timeline.daysOfYear[d]);
    const firstHour = d * 24;

    // Bands do not exchange mass or energy, so each band runs through the day's 24 hours in turn;
    // everything shared by the bands for an hour was computed once, before this loop, by hour.
    for (let b = 0; b < nb; b++) {
      const tOffset = temperatureOffsetC[b];
      const pFactor = precipitationFactor[b];
      const pressure = pressurePa[b];
      const pRatio = pressureRatio[b];
      const cb = cosSlope[b];
      const sca = sinSlopeCosAspect[b];
      const ssa = sinSlopeSinAspect[b];
      const sky = skyView[b];
      const ground = groundView[b];
      const cleanShare = cleanIceShare[b];
      const debrisPart = debrisShare[b];
      const conductance = debrisConductance[b];
      const debrisReduction = debrisFactor[b];
      const hasGlacier = cleanShare > 0 || debrisPart > 0;
      let bandSwe = swe[b];
      let r = grain[b];
      let snowMelt = 0, iceMelt = 0, debrisMelt = 0, rain = 0, snowfall = 0;
      let cover = 0, swIn = 0, swAbs = 0, lwNet = 0, sensible = 0, albedoSum = 0;

      for (let h = firstHour; h < firstHour + 24; h++) {
        const tb = temperatureC[h] + tOffset;
        const pb = precipitationMm[h] * pFactor;
        if (pb > 0) {
          const share = snowWidth > 0 ? (snowTop - tb) / snowWidth : tb < snowTop ? 1 : 0;
          const snow = pb * (share < 0 ? 0 : share > 1 ? 1 : share);
          if (snow > 0) {
            r = bandSwe > 0 ? (r * surfaceLayer + freshGrain * snow) / (surfaceLayer + snow) : freshGrain;
            bandSwe += snow;
            snowfall += snow;
          }
          rain += pb - snow;
        }
        if (bandSwe <= 0 && !hasGlacier) continue; // bare ground: nothing to melt, no flux to report

        const cosZ = cosZenith[h];
        let global = 0;
        if (cosZ > 0) {
          const beam = topNormal * Math.exp(beamExponent[h] * pRatio);
          const beamHorizontal = beam * cosZ;
          const cosI = cb * cosZ + sca * sinZenithCosAzimuth[h] + ssa * sinZenithSinAzimuth[h];
          const diffuse = beamHorizontal * diffuseRatio;
          global = ((cosI > 0 ? beam * cosI : 0) + diffuse * sky + terrainAlbedo * (beamHorizontal + diffuse) * ground) * cloudFactor[h];
        }
        const tk = tb + ZERO_CELSIUS_K;
        const tk2 = tk * tk;
        const longIn = (readEmissivity(emissivity, tb) * clearSkyEmissivityScale[h] + overcastEmissivity[h]) * STEFAN_BOLTZMANN * tk2 * tk2;
        const sensibleCoef = (pressure / tk) * sensibleScale[h];

        let exposure = 1;
        if (bandSwe > 0) {
          const pos = tablePosition(r);
          const clean = readTable(snowClean, pos);
          const alb = clean + 0.53 * clean * (1 - clean) * albedoSunFactor[h] + readTable(snowImpurity, pos);
          const absorbed = global * (1 - alb);
          let melt: number;
          if (modelCode === 0) {
            const lw = longIn - MELTING_SURFACE_LONGWAVE_WM2;
            const qh = sensibleCoef * tb;
            melt = spendSurplus(absorbed + lw + qh, coldContent, b, bandSwe, tb) * MM_PER_JOULE;
            lwNet += lw;
            sensible += qh;
          } else if (modelCode === 1) {
            melt = tb > 0 ? ddfSnowHour * tb : 0;
          } else {
            melt = tb > etiThreshold ? etiTemperature * tb + etiShortwave * absorbed : 0;
          }
          if (melt >= bandSwe) {
            snowMelt += bandSwe;
            exposure = (melt - bandSwe) / melt;
            bandSwe = 0;
          } else {
            snowMelt += melt;
            bandSwe -= melt;
            exposure = 0;
            const grown = r + (tb > 0 || melt > 0 ? wetGrowth : dryGrowth) / (r * r);
            r = grown < maxGrain ? grown : maxGrain;
          }
          cover += 1;
          swIn += global;
          swAbs += absorbed;
          albedoSum += alb * global;
        }
        if (exposure <= 0) continue;

        if (cleanShare > 0) {
          const absorbed = global * (1 - iceAlbedo);
          let melt: number;
          if (modelCode === 0) {
            const lw = longIn - MELTING_SURFACE_LONGWAVE_WM2;
            const qh = sensibleCoef * tb;
            const q = absorbed + lw + qh;
            melt = (exposure < 1 ? (q > 0 ? q * SECONDS_PER_HOUR * exposure : 0) : spendSurplus(q, coldContent, b, iceLayer, tb)) * MM_PER_JOULE;
            if (exposure === 1) { lwNet += cleanShare * lw; sensible += cleanShare * qh; }
          } else if (modelCode === 1) {
            melt = tb > 0 ? ddfIceHour * tb * exposure : 0;
          } else {
            melt = tb > etiThreshold ? (etiTemperature * tb + etiShortwave * absorbed) * exposure : 0;
          }
          iceMelt += cleanShare * melt;
          if (exposure === 1) {
            cover += cleanShare;
            swIn += cleanShare * global;
            swAbs += cleanShare * absorbed;
            albedoSum += cleanShare * iceAlbedo * global;
          }
        }
        if (debrisPart > 0) {
          const absorbed = global * (1 - debrisAlbedo);
          let melt: number;
          if (modelCode === 0) {
            const ts = debrisSurfaceTemperature(absorbed, longIn, tb, sensibleCoef, conductance, debrisEmissivity);
            melt = ts > 0 ? conductance * ts * SECONDS_PER_HOUR * MM_PER_JOULE * exposure : 0;
            if (exposure === 1) {
              const tsk = ts + ZERO_CELSIUS_K;
              const tsk2 = tsk * tsk;
              lwNet += debrisPart * (longIn - debrisEmission * tsk2 * tsk2);
              sensible += debrisPart * sensibleCoef * (tb - ts);
            }
          } else if (modelCode === 1) {
            melt = tb > 0 ? ddfIceHour * tb * debrisReduction * exposure : 0;
          } else {
            melt = tb > etiThreshold ? (etiTemperature * tb + etiShortwave * global * (1 - iceAlbedo)) * debrisReduction * exposure : 0;
          }
          debrisMelt += debrisPart * melt;
          if (exposure === 1) {
            cover += debrisPart;
            swIn += debrisPart * global;
            swAbs += debrisPart * absorbed;
            albedoSum += debrisPart * debrisAlbedo * global;
          }
        }
      }

      swe[b] = bandSwe;
      grain[b] = r;
      const i = b * nd + d;
      out.snowMeltMm[i] = snowMelt;
      out.iceMeltMm[i] = iceMelt;
      out.debrisIceMeltMm[i] = debrisMelt;
      out.rainMm[i] = rain;
      out.snowfallMm[i] = snowfall;
      out.sweMm[i] = bandSwe;
      out.incomingShortwaveWm2[i] = cover > 0 ? swIn / cover : 0;
      out.netShortwaveWm2[i] = cover > 0 ? swAbs / cover : 0;
      out.absorbedShortwaveWm2[i] = swAbs / 24;
      out.netLongwaveWm2[i] = cover > 0 ? lwNet / cover : 0;
      out.sensibleHeatWm2[i] = cover > 0 ? sensible / cover : 0;
      out.albedo[i] = swIn > 0 ? albedoSum / swIn : 0;
    }
    if (onProgress && (d === nd - 1 || (d + 1 < nd && timeline.months[d + 1] !== month))) {
      onProgress({ day: d + 1, dayCount: nd, fraction: (d + 1) / nd });
    }
  }
}
