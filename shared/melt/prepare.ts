import { simulationInputSchema, type ParsedInput } from './schema';
import { DEFAULT_PARAMETERS, type Parameters } from './parameters';
import { forcingDayCount } from './forcing-checks';
import { buildTimeline, type Timeline } from './timeline';
import { expandForcing, type HourlyForcing } from './hourly-forcing';
import { buildBandGeometry, type BandGeometry } from './band-geometry';
import { buildSurfaceTables, type SurfaceTables } from './surface-tables';
import { buildEmissivityTable } from './longwave';

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

/** Everything the hour loop reads, computed once per run. */
export interface PreparedRun {
  input: ParsedInput;
  params: Parameters;
  timeline: Timeline;
  forcing: HourlyForcing;
  geometry: BandGeometry;
  tables: SurfaceTables;
  emissivity: Float64Array;
  initialSweMm: Float64Array;
}

export function prepareRun(raw: unknown): PreparedRun {
  const input = parseSimulationInput(raw);
  const params: Parameters = { ...DEFAULT_PARAMETERS, ...(input.parameters as Partial<Parameters>) };
  const { catchment, forcing, scenario } = input;
  const timeline = buildTimeline(forcing.start, forcingDayCount(forcing), catchment.timeZone, input.period);
  const bandCount = catchment.bands.length;
  return {
    input,
    params,
    timeline,
    forcing: expandForcing(forcing, scenario, params, timeline.months, timeline.firstDay, timeline.dayCount),
    geometry: buildBandGeometry(catchment.bands, catchment.stationElevationM, scenario, params),
    tables: buildSurfaceTables(scenario, params),
    emissivity: buildEmissivityTable(),
    initialSweMm: input.initialState ? Float64Array.from(input.initialState.sweMm) : new Float64Array(bandCount),
  };
}
