import { simulationInputSchema, type ParsedInput } from './schema';
import { DEFAULT_PARAMETERS, type Parameters } from './parameters';
import { forcingDayCount } from './forcing-checks';
import { addDays, daysBetween } from './calendar';
import { buildTimeline, type Timeline } from './timeline';
import { expandForcing, type HourlyForcing } from './hourly-forcing';
import { buildBandGeometry, type BandGeometry } from './band-geometry';
import { buildSurfaceTables, type SurfaceTables } from './surface-tables';
import { buildEmissivityTable } from './longwave';
import { buildAirVapourTable, surfaceVapourTable, type SurfaceVapourTable } from './vapour';
import { snowAlbedoTable, type SnowAlbedoTable } from './albedo-table';
import { coverTableFor } from './snow-cover';
import { planDays, type Segment, type StartReport } from './spin-up';
import { initialState, stateFromJson, type BandState } from './state';
import { pressureAt } from './pressure';
import type { TemperatureTable } from './temperature-table';

/** A refused simulation input; `issues` names each field (with index for series) and the problem. */
export class SimulationInputError extends Error {
  constructor(readonly issues: { path: string; message: string }[]) {
    super(`Invalid simulation input: ${issues.map((i) => `${i.path}: ${i.message}`).join('; ')}`);
    this.name = 'SimulationInputError';
  }
}

/** Formats a zod path as catchment.bands[2].areaKm2. */
function formatPath(path: readonly PropertyKey[]): string {
  return path.reduce<string>((text, key) => (typeof key === 'number' ? `${text}[${key}]` : text ? `${text}.${String(key)}` : String(key)), '') || '(input)';
}

/** Validates a simulation input, throwing SimulationInputError that names every problem. */
export function parseSimulationInput(raw: unknown): ParsedInput {
  const parsed = simulationInputSchema.safeParse(raw);
  if (!parsed.success) {
    throw new SimulationInputError(parsed.error.issues.map((i) => ({ path: formatPath(i.path), message: i.message })));
  }
  return parsed.data;
}

/** Everything the hour loop reads, computed once per run. Day indices are relative to the timeline. */
export interface PreparedRun {
  input: ParsedInput;
  params: Parameters;
  /** Every simulated day: spin-up and period. */
  timeline: Timeline;
  segments: Segment[];
  startReport: StartReport;
  /** The recorded period: first day on the timeline, number of days, first date. */
  recordFirstDay: number;
  recordDays: number;
  recordStartDate: string;
  forcing: HourlyForcing;
  geometry: BandGeometry;
  tables: SurfaceTables;
  emissivity: TemperatureTable;
  airVapour: TemperatureTable;
  surfaceVapour: SurfaceVapourTable;
  albedo: SnowAlbedoTable;
  cover: Float64Array;
  stationPressurePa: number;
  state: BandState;
}

export function prepareRun(raw: unknown): PreparedRun {
  const input = parseSimulationInput(raw);
  const params: Parameters = { ...DEFAULT_PARAMETERS, ...(input.parameters as Partial<Parameters>) };
  const { catchment, forcing, scenario } = input;
  const days = forcingDayCount(forcing);
  const period = input.period ?? { from: forcing.start, to: addDays(forcing.start, days - 1) };
  const start = input.initialState && input.start.method === 'spin-up' ? { method: 'initial-swe' as const, sweMm: input.initialState.sweMm } : input.start;
  const plan = planDays(forcing.start, days, period, catchment.latitudeDeg, start);
  const spanFirst = Math.min(...plan.segments.map((s) => s.firstDay));
  const spanLast = Math.max(...plan.segments.map((s) => s.lastDay));
  const timeline = buildTimeline(forcing.start, days, catchment.timeZone, { from: addDays(forcing.start, spanFirst), to: addDays(forcing.start, spanLast) });
  const segments = plan.segments.map((s) => ({ ...s, firstDay: s.firstDay - spanFirst, lastDay: s.lastDay - spanFirst }));
  const background = { blackCarbonSnowNgG: catchment.background?.blackCarbonSnowNgG ?? 0, dustSnowUgG: catchment.background?.dustSnowUgG ?? 0 };
  const bandCount = catchment.bands.length;
  const tables = buildSurfaceTables(scenario, params, background, bandCount, input.impuritiesByBand);
  const firstMonth = timeline.months[0];
  const freshLoad = (table: Float64Array) => Float64Array.from({ length: bandCount }, (_, b) => table[b * 12 + firstMonth]);
  const state = start.method === 'state'
    ? stateFromJson(start.state)
    : initialState(start.method === 'initial-swe' ? start.sweMm : new Float64Array(bandCount), params.freshGrainRadiusUm, freshLoad(tables.freshBlackCarbonNgG), freshLoad(tables.freshDustUgG));
  if (state.sweMm.length !== bandCount) {
    const path = start.method === 'state' ? 'start.state' : 'start.sweMm';
    throw new SimulationInputError([{ path, message: `has ${state.sweMm.length} bands; one per band (${bandCount}) expected` }]);
  }
  return {
    input, params, timeline, segments, startReport: plan.report,
    recordFirstDay: daysBetween(timeline.startDate, period.from), recordDays: daysBetween(period.from, period.to) + 1, recordStartDate: period.from,
    forcing: expandForcing(forcing, scenario, params, timeline.months, timeline.firstDay, timeline.dayCount),
    geometry: buildBandGeometry(catchment.bands, catchment.stationElevationM, scenario, params, input.bandClimate),
    tables,
    emissivity: buildEmissivityTable(),
    airVapour: buildAirVapourTable(),
    surfaceVapour: surfaceVapourTable(),
    albedo: snowAlbedoTable(),
    cover: coverTableFor(params.snowCoverVariation),
    stationPressurePa: pressureAt(catchment.stationElevationM),
    state,
  };
}
