import { simulate } from '../melt/simulate';
import { daysBetween } from '../melt/calendar';
import { SOURCES, type SimulationResult, type Source } from '../melt/result';
import type { ShortwaveSource, SimulationInput } from '../melt/schema';
import type { StartReport } from '../melt/spin-up';
import type { EngineState } from '../melt/state-schema';
import { runTransient, type TransientYear, type YearSimulator } from '../hydrology/transient-run';
import { glacierVolumeOf, type GlacierState } from '../hydrology/glacier-volume';
import { bandGlacierBalanceMm, glacierWideBalanceMm } from './glacier-balance';
import { scaledFactor } from './water-side-inputs';

/** What a multi-decade member simulates beyond its engine input: the years, their weather and the glacier it starts with. */
export interface TransientMemberPlan {
  years: TransientYear[];
  periods: Record<number, { from: string; to: string }>;
  /** Glacier area (km²) and mean ice thickness (m) per band at the start. */
  glacier: { areaKm2: number[]; thicknessM: number[] };
}

/** One scenario year as a run stores it. */
export interface TransientYearRow extends TransientYear {
  /** Glacier area and volume at the start of the year. */
  glacierAreaKm2: number;
  glacierVolumeKm3: number;
  /** Glacier-wide balance over the year, mm w.e. over the year's glacier area. */
  massBalanceMm: number;
  /** Ice volume change from the balance, m³. */
  volumeChangeM3: number;
  /** Runoff by source over the year as it leaves the bands (unrouted), m³. */
  runoffM3: Record<Source, number>;
  /** Melt and rain from the initially glacierised area (Huss & Hock 2018), m³. */
  glacierRunoffM3: number;
  /** Glacier area per band during the year, km². */
  bandGlacierAreaKm2: number[];
}

export interface TransientSummary {
  kind: 'transient';
  startDate: string;
  bands: { elevationM: number; areaM2: number }[];
  start: StartReport | null;
  shortwaveSource: ShortwaveSource | null;
  years: TransientYearRow[];
  /** Glacier at the end of the last year. */
  finalGlacier: { areaKm2: number[]; thicknessM: number[]; volumeKm3: number };
}

/**
 * State fields that are amounts over the band (snow and its water, mm; a buried dirty horizon's
 * impurities and the snow above it): the glacier's share of them turns to firn and ice at the end of each year.
 */
const SNOW_FIELDS = ['sweMm', 'liquidMeltMm', 'liquidRainMm', 'peakSweMm', 'freshSweMm', 'horizonBlackCarbonNgM2', 'horizonDustUgM2', 'horizonDepthMm'] as const;

/**
 * Snow that outlasted the year on the glacier part of each band becomes part of the glacier
 * (firn turning to ice; already counted in that year's balance), so perennial snow does not pile
 * up in the snowpack year after year; snow beside the glacier stays (the band's snow lies evenly).
 */
function firnified(state: EngineState, glacierFraction: ArrayLike<number>): EngineState {
  const next: EngineState = { ...state };
  for (const field of SNOW_FIELDS) next[field] = state[field].map((v, b) => v * (1 - Math.min(1, Math.max(0, glacierFraction[b]))));
  return next;
}

function yearScenario(scenario: SimulationInput['scenario'], year: TransientYear): NonNullable<SimulationInput['scenario']> {
  const own = scenario ?? {};
  const delta = own.temperatureDeltaC ?? 0;
  return {
    ...own,
    temperatureDeltaC: Array.isArray(delta) ? delta.map((d) => d + year.temperatureDeltaC) : delta + year.temperatureDeltaC,
    precipitationFactor: scaledFactor(own.precipitationFactor ?? 1, year.precipitationFactor),
  };
}

const total = (series: Float64Array) => series.reduce((s, v) => s + v, 0);

const STEP_SERIES = ['temperatureC', 'tMinC', 'tMaxC', 'tMeanC', 'cloudiness', 'windMs', 'relativeHumidity', 'globalRadiationWm2'] as const;

/**
 * The forcing of one record year alone: each year is then parsed and prepared (sun, shortwave,
 * snow-cover tables) for its own days rather than the whole record's.
 */
export function forcingOfPeriod(forcing: SimulationInput['forcing'], period: { from: string; to: string }): SimulationInput['forcing'] {
  const first = daysBetween(forcing.start, period.from);
  const days = daysBetween(period.from, period.to) + 1;
  const perDay = forcing.timeStep === 'hourly' ? 24 : 1;
  const cut = <T>(values: T[] | undefined, steps: number) => values?.slice(first * steps, (first + days) * steps);
  const out: Record<string, unknown> = { ...forcing, start: period.from };
  for (const key of STEP_SERIES) if (key in forcing) out[key] = cut((forcing as unknown as Record<string, (number | null)[] | undefined>)[key], perDay);
  out.precipitationMm = cut(forcing.precipitationMm, (forcing.precipitationStep ?? forcing.timeStep) === 'hourly' ? 24 : 1);
  return out as SimulationInput['forcing'];
}

/** Melt and rain from the initially glacierised area of each band (snow melt and rain taken as even over the band), m³. */
function glacierRunoffM3(result: SimulationResult, initialFraction: readonly number[]): number {
  const t = result.bandTotals;
  let m3 = 0;
  for (let b = 0; b < result.bandCount; b++) {
    const g0 = initialFraction[b];
    if (!(g0 > 0)) continue;
    m3 += ((t.iceMeltMm[b] + t.debrisIceMeltMm[b] + g0 * (t.snowMeltMm[b] + t.rainMm[b])) * result.bands.areaM2[b]) / 1000;
  }
  return m3;
}

/**
 * A multi-decade member: year after year the engine runs one record year, warmed and wetted as
 * the path says, on that year's glacier, from the state the year before ended with (the first
 * year spins up as a season run does); the glacier is then updated from the year's balance
 * (shared/hydrology/transient-run.ts). Runoff by source is kept as it leaves the bands.
 */
export function simulateTransient(input: SimulationInput & { transient: TransientMemberPlan }, onProgress?: (fraction: number) => void): TransientSummary {
  const { transient, ...engine } = input;
  const bands = engine.catchment.bands;
  const initialFraction = bands.map((b) => b.glacierFraction);
  let state: EngineState | null = null;
  let first: SimulationResult | null = null;
  const bandAreas: number[][] = [];
  const forcings = new Map(Object.entries(transient.periods).map(([year, period]) => [Number(year), forcingOfPeriod(engine.forcing, period)]));
  const simulateYear: YearSimulator = (year, fraction) => {
    const catchment = { ...engine.catchment, bands: bands.map((b, i) => ({ ...b, glacierFraction: Math.min(1, Math.max(0, fraction[i])) })) };
    const result = simulate({
      ...engine, catchment, forcing: forcings.get(year.recordYear)!, scenario: yearScenario(engine.scenario, year), period: transient.periods[year.recordYear],
      start: state ? { method: 'state', state } : engine.start,
    });
    first ??= result;
    const g = catchment.bands.map((b) => b.glacierFraction);
    state = firnified(result.endState, g);
    bandAreas.push(bands.map((b, i) => b.areaKm2 * g[i]));
    const runoffM3 = Object.fromEntries(SOURCES.map((s) => [s, total(result.catchmentDaily.volumeM3[s])])) as Record<Source, number>;
    return { glacierMassBalanceMm: glacierWideBalanceMm(result, g, bandGlacierBalanceMm(result, g)) ?? 0, runoffM3, glacierRunoffM3: glacierRunoffM3(result, initialFraction) };
  };
  const glacier: GlacierState = { areaKm2: Float64Array.from(transient.glacier.areaKm2), thicknessM: Float64Array.from(transient.glacier.thicknessM) };
  const outcome = runTransient(bands, glacier, transient.years, simulateYear, { onYear: (_, i) => onProgress?.((i + 1) / transient.years.length) });
  const head = first as SimulationResult | null;
  return {
    kind: 'transient',
    startDate: transient.periods[transient.years[0].recordYear].from,
    bands: bands.map((b) => ({ elevationM: (b.lowerM + b.upperM) / 2, areaM2: b.areaKm2 * 1e6 })),
    start: head?.start ?? null,
    shortwaveSource: head?.shortwaveSource ?? null,
    years: outcome.rows.map((r, i) => ({
      year: r.year, recordYear: r.recordYear, temperatureDeltaC: r.temperatureDeltaC, precipitationFactor: r.precipitationFactor,
      glacierAreaKm2: r.glacierAreaKm2, glacierVolumeKm3: r.glacierVolumeKm3, massBalanceMm: r.glacierMassBalanceMm, volumeChangeM3: r.volumeChangeM3,
      runoffM3: r.runoffM3, glacierRunoffM3: r.glacierRunoffM3, bandGlacierAreaKm2: bandAreas[i],
    })),
    finalGlacier: { areaKm2: Array.from(outcome.finalGlacier.areaKm2), thicknessM: Array.from(outcome.finalGlacier.thicknessM), volumeKm3: glacierVolumeOf(outcome.finalGlacier) },
  };
}
