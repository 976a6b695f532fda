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
 * The hour loop: every simulated hour, every band. All arrays are allocated before the loop;
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
  const acc = Array.from({ length: 11 }, () => new Float64Array(nb));
  const [snowMelt, iceMelt, debrisMelt, rain, snowfall, coverHours, swIn, swAbs, lwNet, sensible, albedoSum] = acc;
  const debrisFactor = Float64Array.from(debrisThicknessM, (h) => p.debrisHalfThicknessM / (p.debrisHalfThicknessM + h));

  const diffuseRatio = p.diffuseFraction / (1 - p.diffuseFraction);
  const snowTop = p.rainSnowThresholdC + p.rainSnowTransitionK / 2;
  const snowWidth = p.rainSnowTransitionK;
  const maxGrain = p.maxGrainRadiusUm;
  const grainScale = 1e9 / (4 * Math.PI) / 24; // µm per hour from mm³ per day: dr = dV/(4πr²)
  const wetGrowth = p.wetGrainGrowthMm3PerDay * grainScale;
  const dryGrowth = p.dryGrainGrowthMm3PerDay * grainScale;
  const debrisEmission = p.debrisEmissivity * STEFAN_BOLTZMANN;
  const ddfSnowHour = p.degreeDaySnow / 24;
  const ddfIceHour = p.degreeDayIce / 24;

  for (let d = 0; d < nd; d++) {
    const month = timeline.months[d];
    const snowTable = tables.snow[month];
    const iceAlbedo = tables.iceAlbedo[month];
    const topNormal = extraterrestrialNormal(timeline.daysOfYear[d]);
    for (let a = 0; a < acc.length; a++) acc[a].fill(0);

    for (let k = 0; k < 24; k++) {
      const h = d * 24 + k;
      const ta = temperatureC[h];
      const precip = precipitationMm[h];
      const cosZ = cosZenith[h];
      const sx = sinZenithCosAzimuth[h];
      const sy = sinZenithSinAzimuth[h];
      const exponent = beamExponent[h];
      const sunFactor = albedoSunFactor[h];
      const cloud = cloudFactor[h];
      const clearScale = clearSkyEmissivityScale[h];
      const overcast = overcastEmissivity[h];
      const windScale = sensibleScale[h];

      for (let b = 0; b < nb; b++) {
        const tb = ta + temperatureOffsetC[b];
        const pb = precip * precipitationFactor[b];
        if (pb > 0) {
          const share = snowWidth > 0 ? (snowTop - tb) / snowWidth : tb < snowTop ? 1 : 0;
          const snow = pb * (share < 0 ? 0 : share > 1 ? 1 : share);
          if (snow > 0) {
            grain[b] = swe[b] > 0 ? (grain[b] * p.snowSurfaceLayerMm + p.freshGrainRadiusUm * snow) / (p.snowSurfaceLayerMm + snow) : p.freshGrainRadiusUm;
            swe[b] += snow;
            snowfall[b] += snow;
          }
          rain[b] += pb - snow;
        }

        let global = 0;
        if (cosZ > 0) {
          const beam = topNormal * Math.exp(exponent * pressureRatio[b]);
          const beamHorizontal = beam * cosZ;
          const cosI = cosSlope[b] * cosZ + sinSlopeCosAspect[b] * sx + sinSlopeSinAspect[b] * sy;
          const diffuse = beamHorizontal * diffuseRatio;
          global = ((cosI > 0 ? beam * cosI : 0) + diffuse * skyView[b] + p.terrainAlbedo * (beamHorizontal + diffuse) * groundView[b]) * cloud;
        }
        const tk = tb + ZERO_CELSIUS_K;
        const tk2 = tk * tk;
        const longIn = (readEmissivity(emissivity, tb) * clearScale + overcast) * STEFAN_BOLTZMANN * tk2 * tk2;
        const sensibleCoef = (pressurePa[b] / tk) * windScale;

        const sweStart = swe[b];
        let exposure = 1;
        if (sweStart > 0) {
          const pos = tablePosition(grain[b]);
          const clean = readTable(snowTable.clean, pos);
          const alb = clean + 0.53 * clean * (1 - clean) * sunFactor + readTable(snowTable.impurity, pos);
          const absorbed = global * (1 - alb);
          let melt: number;
          if (modelCode === 0) {
            const lw = longIn - MELTING_SURFACE_LONGWAVE_WM2;
            const qh = sensibleCoef * tb;
            melt = spendSurplus(absorbed + lw + qh, coldContent, b, sweStart, tb) * MM_PER_JOULE;
            lwNet[b] += lw;
            sensible[b] += qh;
          } else if (modelCode === 1) {
            melt = tb > 0 ? ddfSnowHour * tb : 0;
          } else {
            melt = tb > p.etiThresholdC ? p.etiTemperatureFactor * tb + p.etiShortwaveFactor * absorbed : 0;
          }
          if (melt >= sweStart) {
            snowMelt[b] += sweStart;
            exposure = (melt - sweStart) / melt;
            swe[b] = 0;
          } else {
            snowMelt[b] += melt;
            swe[b] = sweStart - melt;
            exposure = 0;
            const r = grain[b];
            const grown = r + (tb > 0 || melt > 0 ? wetGrowth : dryGrowth) / (r * r);
            grain[b] = grown < maxGrain ? grown : maxGrain;
          }
          coverHours[b] += 1;
          swIn[b] += global;
          swAbs[b] += absorbed;
          albedoSum[b] += alb * global;
        }
        if (exposure <= 0) continue;

        const cleanShare = cleanIceShare[b];
        if (cleanShare > 0) {
          const absorbed = global * (1 - iceAlbedo);
          let melt: number;
          if (modelCode === 0) {
            const lw = longIn - MELTING_SURFACE_LONGWAVE_WM2;
            const qh = sensibleCoef * tb;
            const q = absorbed + lw + qh;
            melt = (exposure < 1 ? (q > 0 ? q * SECONDS_PER_HOUR * exposure : 0) : spendSurplus(q, coldContent, b, p.iceSurfaceLayerMm, tb)) * MM_PER_JOULE;
            if (exposure === 1) { lwNet[b] += cleanShare * lw; sensible[b] += cleanShare * qh; }
          } else if (modelCode === 1) {
            melt = tb > 0 ? ddfIceHour * tb * exposure : 0;
          } else {
            melt = tb > p.etiThresholdC ? (p.etiTemperatureFactor * tb + p.etiShortwaveFactor * absorbed) * exposure : 0;
          }
          iceMelt[b] += cleanShare * melt;
          if (exposure === 1) {
            coverHours[b] += cleanShare;
            swIn[b] += cleanShare * global;
            swAbs[b] += cleanShare * absorbed;
            albedoSum[b] += cleanShare * iceAlbedo * global;
          }
        }
        const debrisPart = debrisShare[b];
        if (debrisPart > 0) {
          const absorbed = global * (1 - p.debrisAlbedo);
          let melt: number;
          if (modelCode === 0) {
            const conductance = debrisConductance[b];
            const ts = debrisSurfaceTemperature(absorbed, longIn, tb, sensibleCoef, conductance, p.debrisEmissivity);
            melt = ts > 0 ? conductance * ts * SECONDS_PER_HOUR * MM_PER_JOULE * exposure : 0;
            if (exposure === 1) {
              const tsk = ts + ZERO_CELSIUS_K;
              const tsk2 = tsk * tsk;
              lwNet[b] += debrisPart * (longIn - debrisEmission * tsk2 * tsk2);
              sensible[b] += debrisPart * sensibleCoef * (tb - ts);
            }
          } else if (modelCode === 1) {
            melt = tb > 0 ? ddfIceHour * tb * debrisFactor[b] * exposure : 0;
          } else {
            melt = tb > p.etiThresholdC ? (p.etiTemperatureFactor * tb + p.etiShortwaveFactor * global * (1 - iceAlbedo)) * debrisFactor[b] * exposure : 0;
          }
          debrisMelt[b] += debrisPart * melt;
          if (exposure === 1) {
            coverHours[b] += debrisPart;
            swIn[b] += debrisPart * global;
            swAbs[b] += debrisPart * absorbed;
            albedoSum[b] += debrisPart * p.debrisAlbedo * global;
          }
        }
      }
    }
    writeDay(out, d, nd, nb, acc, swe);
    if (onProgress && (d === nd - 1 || (d + 1 < nd && timeline.months[d + 1] !== month))) {
      onProgress({ day: d + 1, dayCount: nd, fraction: (d + 1) / nd });
    }
  }
}

/** Moves one day's accumulators into the band-major output arrays. */
function writeDay(out: SimulationResult['bandDay'], d: number, nd: number, nb: number, acc: Float64Array[], swe: Float64Array): void {
  const snowMelt = acc[0], iceMelt = acc[1], debrisMelt = acc[2], rain = acc[3], snowfall = acc[4], coverHours = acc[5];
  const swIn = acc[6], swAbs = acc[7], lwNet = acc[8], sensible = acc[9], albedoSum = acc[10];
  for (let b = 0; b < nb; b++) {
    const i = b * nd + d;
    const cover = coverHours[b];
    out.snowMeltMm[i] = snowMelt[b];
    out.iceMeltMm[i] = iceMelt[b];
    out.debrisIceMeltMm[i] = debrisMelt[b];
    out.rainMm[i] = rain[b];
    out.snowfallMm[i] = snowfall[b];
    out.sweMm[i] = swe[b];
    out.incomingShortwaveWm2[i] = cover > 0 ? swIn[b] / cover : 0;
    out.netShortwaveWm2[i] = cover > 0 ? swAbs[b] / cover : 0;
    out.absorbedShortwaveWm2[i] = swAbs[b] / 24;
    out.netLongwaveWm2[i] = cover > 0 ? lwNet[b] / cover : 0;
    out.sensibleHeatWm2[i] = cover > 0 ? sensible[b] / cover : 0;
    out.albedo[i] = swIn[b] > 0 ? albedoSum[b] / swIn[b] : 0;
  }
}
