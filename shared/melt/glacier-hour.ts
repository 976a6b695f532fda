import { ICE, stepIce } from './ice-surface';
import { DEBRIS, DEBRIS_IN, stepDebrisFrom } from './debris-layers';
import { STEP_IN } from './surface-flux';
import { ACC, AIR_OVER_GLACIER, type LoopContext } from './loop-context';

/**
 * Hour k of band b's snow-free glacier (the share 1 − cover > 0 of the band's glacier, with the
 * hour's weather and snow cover in `c.hours`): clean ice, bare ice between debris patches, and
 * debris. Energy balance (surface temperatures, melt,
 * vapour exchange) or, for the reference models, their melt index; debris in the reference
 * models melts the clean-ice amount times H* / (H* + h) (Anderson & Anderson 2016).
 * Debris always takes the stability correction: midday debris is far warmer than the air, and the
 * free convection over it is what keeps its surface within measured temperatures (Reid & Brock
 * 2010; Collier et al. 2014) [memory]; the run's option applies to snow and ice.
 */
export function glacierHour(c: LoopContext, b: number, k: number, month: number): void {
  const run = c.run;
  const g = run.geometry;
  const p = run.params;
  const s = run.state;
  const a = c.acc;
  const w = c.hours;
  const out = c.scratch;
  const clean = g.cleanIceShare[b];
  const debris = g.debrisShare[b];
  const i = b * 12 + month;
  const exposed = 1 - w.cover[k];
  const global = w.globalWm2[k];
  // Where the band climate damps the air over snow-free ice, the glacier has an air of its own.
  const slot = g.glacierTemperatureDeltaK[i] === 0 ? k : AIR_OVER_GLACIER + k;
  const longIn = w.longInWm2[slot];
  const airC = w.airC[slot];
  if (slot !== k) {
    const air = c.air;
    air.airC = airC;
    air.vapourPa = w.vapourPa[slot];
    air.sensibleCoefficient = w.sensibleCoefficient[slot];
    air.vapourCoefficient = w.vapourCoefficient[slot];
  }
  const patch = g.debrisPatchShare[b];
  const iceAlbedo = run.tables.iceAlbedo[i];
  const bareShare = clean + (c.model === 0 ? debris * (1 - patch) : 0);
  if (bareShare > 0 || (c.model !== 0 && debris > 0)) {
    const absorbed = global * (1 - iceAlbedo);
    let melt: number;
    if (c.model === 0) {
      const input = c.iceInput;
      input[STEP_IN.absorbed] = absorbed;
      input[STEP_IN.longIn] = longIn;
      input[STEP_IN.surfaceC] = s.iceSurfaceC[b];
      input[STEP_IN.deepC] = s.iceDeepC[b];
      input[STEP_IN.drag] = c.snowIceDrag;
      input[STEP_IN.heightOverRoughness] = c.snowIceHeightOverRoughness;
      stepIce(out, input, run.surfaceVapour, c.air, c.stability);
      melt = out[ICE.melt];
      s.iceSurfaceC[b] = out[ICE.surfaceC];
      s.iceDeepC[b] = out[ICE.deepC];
      const vapour = exposed * bareShare * out[ICE.vapourLoss];
      a[ACC.iceVapour] += vapour;
      if (out[ICE.evaporating] > 0) a[ACC.evaporation] += vapour;
      else a[ACC.sublimation] += vapour;
      const weight = exposed * bareShare;
      a[ACC.longwaveNet] += weight * out[ICE.netLongwave];
      a[ACC.sensible] += weight * out[ICE.sensible];
      a[ACC.latent] += weight * out[ICE.latent];
    } else {
      melt = c.model === 1
        ? (airC > 0 ? (p.degreeDayIce / 24) * airC : 0)
        : (airC > p.etiThresholdC ? p.etiTemperatureFactor * airC + p.etiShortwaveFactor * absorbed : 0);
      if (melt < 0) melt = 0;
    }
    a[ACC.iceMelt] += exposed * clean * melt;
    if (c.model === 0) a[ACC.debrisMelt] += exposed * debris * (1 - patch) * melt;
    else a[ACC.debrisMelt] += exposed * debris * melt * (p.debrisHalfThicknessM / (p.debrisHalfThicknessM + g.debrisThicknessM[b]));
    const weight = exposed * bareShare;
    a[ACC.weight] += weight;
    a[ACC.shortwaveIn] += weight * global;
    a[ACC.shortwaveAbsorbed] += weight * absorbed;
    a[ACC.albedoWeighted] += weight * iceAlbedo * global;
  }
  if (debris > 0 && patch > 0 && c.model === 0) {
    const absorbed = global * (1 - p.debrisAlbedo);
    const column = c.columns[b];
    const input = c.debrisInput;
    column.sensibleCoefficient = (g.pressurePa[b] / w.airK[slot]) * c.cpOverRd * c.debrisExchange * w.windMs[k];
    input[DEBRIS_IN.absorbed] = absorbed;
    input[DEBRIS_IN.longIn] = p.debrisEmissivity * longIn;
    input[DEBRIS_IN.airC] = airC;
    input[DEBRIS_IN.windMs] = w.windMs[k];
    input[DEBRIS_IN.surfaceC] = s.debrisSurfaceC[b];
    input[DEBRIS_IN.upperC] = s.debrisUpperC[b];
    input[DEBRIS_IN.lowerC] = s.debrisLowerC[b];
    stepDebrisFrom(out, input, column, true);
    s.debrisSurfaceC[b] = out[DEBRIS.surfaceC];
    s.debrisUpperC[b] = out[DEBRIS.upperC];
    s.debrisLowerC[b] = out[DEBRIS.lowerC];
    const weight = exposed * debris * patch;
    a[ACC.debrisMelt] += weight * out[DEBRIS.melt];
    if (a[ACC.debrisSeen] === 0 || out[DEBRIS.surfaceC] > a[ACC.debrisMax]) a[ACC.debrisMax] = out[DEBRIS.surfaceC];
    a[ACC.debrisSeen] = 1;
    a[ACC.weight] += weight;
    a[ACC.shortwaveIn] += weight * global;
    a[ACC.shortwaveAbsorbed] += weight * absorbed;
    a[ACC.longwaveNet] += weight * out[DEBRIS.netLongwave];
    a[ACC.sensible] += weight * out[DEBRIS.sensible];
    a[ACC.albedoWeighted] += weight * p.debrisAlbedo * global;
  }
}
