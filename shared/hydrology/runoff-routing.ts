import type { ParameterSpec } from '../melt/parameters';
import { SOURCES, type Source } from '../melt/result';
import { HydrologyInputError, type HydrologyIssue } from './errors';
import { checkParameters, defaultsOf, type ValuesOf } from './parameter-specs';
import { reservoirCoefficients } from './linear-reservoir';

/**
 * Routing of daily runoff by source through linear reservoirs, in the manner of Hock & Noetzli
 * 1997 (Ann. Glaciol. 24:211) [memory]: melt of bare glacier ice drains fast through the glacier's
 * channels, snow melt and rain slower through the snowpack and soil, and a share of each
 * percolates to a slow groundwater store (the baseflow store of Himalayan rivers, Andermann et al.
 * 2012, Nature Geosci. 5:127 [memory]). Every source is routed through its own copy of the stores:
 * the stores are linear, so the routed sources add up to routing the total, and the routed
 * discharge keeps its split into snow, ice, debris-covered ice and rain.
 */

export const ROUTING_PARAMETERS = {
  iceStorageHours: { default: 16, min: 2, max: 60, unit: 'h', source: 'storage constant of bare-ice melt; ≈ 16 h on Storglaciären (Hock & Noetzli 1997) [memory]; a few hours to ≈ 2 days in glacier studies [memory]' },
  snowRainStorageHours: { default: 30, min: 10, max: 240, unit: 'h', source: 'storage constant of snow melt and rain; ≈ 30 h (Hock & Noetzli 1997) [memory]; slower where soils and moraines store water' },
  debrisIceStorageHours: { default: 30, min: 2, max: 240, unit: 'h', source: 'storage constant of melt under debris; drainage beneath debris is less efficient than on bare ice (e.g. Fyffe et al. 2019, Hydrol. Process.) [memory]; default as snow melt, an assumption' },
  groundwaterStorageDays: { default: 60, min: 10, max: 300, unit: 'd', source: 'storage constant of the groundwater (baseflow) store; Himalayan baseflow recedes over months (Andermann et al. 2012, Nature Geosci. 5:127) [memory]' },
  groundwaterShareSnow: { default: 0.2, min: 0, max: 0.8, unit: '-', source: 'share of snow melt percolating to groundwater; assumption' },
  groundwaterShareRain: { default: 0.2, min: 0, max: 0.8, unit: '-', source: 'share of rain percolating to groundwater; assumption' },
  groundwaterShareIce: { default: 0, min: 0, max: 0.8, unit: '-', source: 'share of bare-ice melt reaching groundwater; glacier melt drains mostly through the glacier; assumption' },
  groundwaterShareDebrisIce: { default: 0.1, min: 0, max: 0.8, unit: '-', source: 'share of melt under debris reaching groundwater; assumption' },
} as const satisfies Record<string, ParameterSpec>;

export type RoutingParameters = ValuesOf<typeof ROUTING_PARAMETERS>;

export const DEFAULT_ROUTING_PARAMETERS = defaultsOf(ROUTING_PARAMETERS);

const SURFACE_HOURS: Record<Source, keyof RoutingParameters> = { snow: 'snowRainStorageHours', rain: 'snowRainStorageHours', ice: 'iceStorageHours', debrisIce: 'debrisIceStorageHours' };
const GROUNDWATER_SHARE: Record<Source, keyof RoutingParameters> = { snow: 'groundwaterShareSnow', rain: 'groundwaterShareRain', ice: 'groundwaterShareIce', debrisIce: 'groundwaterShareDebrisIce' };

/** Daily runoff volumes by source, m³ per day (e.g. the engine's catchment daily volumes). */
export type RunoffBySource = Record<Source, ArrayLike<number>>;

/** Water in the stores, m³, per source: in its surface store and in groundwater. */
export interface RoutingState {
  surface: Record<Source, number>;
  groundwater: Record<Source, number>;
}

export interface RoutedRunoff {
  /** Outflow at the outlet per day, m³, by source and in total. */
  volumeM3: Record<Source | 'total', Float64Array>;
  /** Mean discharge per day, m³ s⁻¹, by source and in total. */
  dischargeM3s: Record<Source | 'total', Float64Array>;
  /** Stores at the end: pass to the next call to continue (e.g. year after year). */
  endState: RoutingState;
}

const perSource = (value: (s: Source) => number): Record<Source, number> => ({ snow: value('snow'), ice: value('ice'), debrisIce: value('debrisIce'), rain: value('rain') });

/** Empty stores. */
export function emptyRoutingState(): RoutingState {
  return { surface: perSource(() => 0), groundwater: perSource(() => 0) };
}

/**
 * Stores in equilibrium with a steady daily inflow (S = I k/Δt in each store), to start a run
 * without the spin-up an empty start needs.
 * @param meanDailyM3 mean daily runoff by source, m³ d⁻¹
 */
export function steadyRoutingState(meanDailyM3: Record<Source, number>, params: RoutingParameters = DEFAULT_ROUTING_PARAMETERS): RoutingState {
  return {
    surface: perSource((s) => meanDailyM3[s] * (1 - params[GROUNDWATER_SHARE[s]]) * (params[SURFACE_HOURS[s]] / 24)),
    groundwater: perSource((s) => meanDailyM3[s] * params[GROUNDWATER_SHARE[s]] * params.groundwaterStorageDays),
  };
}

function checkInput(input: RunoffBySource, params: RoutingParameters): number {
  checkParameters(ROUTING_PARAMETERS, params, 'routing');
  const days = input.snow.length;
  const issues: HydrologyIssue[] = [];
  for (const s of SOURCES) {
    const series = input[s];
    if (series.length !== days) issues.push({ path: `runoff.${s}`, message: `has ${series.length} days; the snow series has ${days}.` });
    for (let d = 0; d < series.length && issues.length < 20; d++) {
      if (!(series[d] >= 0 && Number.isFinite(series[d]))) issues.push({ path: `runoff.${s}[${d}]`, message: `${series[d]} m³ is not a volume ≥ 0.` });
    }
  }
  if (issues.length > 0) throw new HydrologyInputError(issues);
  return days;
}

/**
 * Routes daily runoff by source to the outlet. Volume is conserved: Σ outflow + end storage =
 * Σ inflow + start storage; after long enough the stores empty and the totals agree. The input is
 * not changed, so the unrouted split stays available beside the routed one.
 *
 * @param input daily runoff volume by source, m³ d⁻¹, all series the same length
 * @param start stores at the start (default empty)
 * @throws HydrologyInputError naming the series and day of a negative or missing volume, or a parameter out of range
 * @example routeRunoff({ snow: [0], ice: [86400], debrisIce: [0], rain: [0] }).dischargeM3s.ice[0] // ≈ 0.48 (52 % still stored at the end of the day)
 */
export function routeRunoff(input: RunoffBySource, params: RoutingParameters = DEFAULT_ROUTING_PARAMETERS, start: RoutingState = emptyRoutingState()): RoutedRunoff {
  const days = checkInput(input, params);
  const volumeM3 = { snow: new Float64Array(days), ice: new Float64Array(days), debrisIce: new Float64Array(days), rain: new Float64Array(days), total: new Float64Array(days) };
  const endState: RoutingState = { surface: { ...start.surface }, groundwater: { ...start.groundwater } };
  const ground = reservoirCoefficients(params.groundwaterStorageDays);
  for (const s of SOURCES) {
    const surface = reservoirCoefficients(params[SURFACE_HOURS[s]] / 24);
    const share = params[GROUNDWATER_SHARE[s]];
    const series = input[s];
    const out = volumeM3[s];
    let S = endState.surface[s];
    let G = endState.groundwater[s];
    for (let d = 0; d < days; d++) {
      const toGround = series[d] * share;
      const toSurface = series[d] - toGround;
      const S1 = S * surface.keep + toSurface * surface.storeInflow;
      const G1 = G * ground.keep + toGround * ground.storeInflow;
      out[d] = S + toSurface - S1 + (G + toGround - G1);
      S = S1;
      G = G1;
    }
    endState.surface[s] = S;
    endState.groundwater[s] = G;
    for (let d = 0; d < days; d++) volumeM3.total[d] += out[d];
  }
  const toDischarge = (v: Float64Array) => v.map((x) => x / 86400);
  return {
    volumeM3,
    dischargeM3s: { snow: toDischarge(volumeM3.snow), ice: toDischarge(volumeM3.ice), debrisIce: toDischarge(volumeM3.debrisIce), rain: toDischarge(volumeM3.rain), total: toDischarge(volumeM3.total) },
    endState,
  };
}

/** Water held in the stores, m³. */
export function storedVolumeM3(state: RoutingState): number {
  return SOURCES.reduce((sum, s) => sum + state.surface[s] + state.groundwater[s], 0);
}
