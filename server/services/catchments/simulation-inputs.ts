import { z } from 'zod';
import { addDays, daysBetween, isIsoDate } from '../../../shared/melt/calendar';
import { fillShortGaps } from '../../../shared/melt/fill-gaps';
import type { SimulationInput } from '../../../shared/melt/schema';
import { DAYS_PER_YEAR, hydrologicalYearStartBefore } from '../../../shared/melt/spin-up';
import type { TimeStep, Variable } from '../../../shared/schemas/dataset-variables';
import { validationFailed } from '../../errors';
import { parseWith } from '../../middleware/validate';
import type { BandService } from './band-service';
import type { CatchmentRow } from './catchment-service';
import { formatMinutes, parseTimestamp, STEP_MINUTES } from './csv/timestamps';
import type { DatasetRow } from './dataset-service';
import { readDatasetValues } from './dataset-values';
import { valuesOnGrid } from './series-grid';
import { climateRecord } from '../runs/climate-record';
import { drivingDatasets } from '../stations/station-rows';
import type { TenantScope } from '../tenant-scope';

const isoDate = z.string().refine(isIsoDate, { message: 'must be a real date written YYYY-MM-DD' });
export const simulationPeriodSchema = z.object({
  from: isoDate,
  to: isoDate,
  /** Longest run of missing values bridged by linear interpolation, in steps of the series. */
  maxBridgeHours: z.number().int().min(0).max(48).default(6),
  maxBridgeDays: z.number().int().min(0).max(7).default(2),
}).refine((p) => daysBetween(p.from, p.to) >= 0, { path: ['to'], message: 'must not be before from' })
  .refine((p) => daysBetween(p.from, p.to) < 366 * 30, { path: ['to'], message: 'the period may be at most 30 years' });
export type SimulationPeriod = z.input<typeof simulationPeriodSchema>;

export interface SeriesGap {
  variable: Variable;
  datasetId: number;
  /** First and last missing step, local station time. */
  from: string;
  to: string;
  steps: number;
  /** True when the gap was short enough to be filled by linear interpolation. */
  bridged: boolean;
}

export interface AssembledInputs {
  /** The engine's input; series still hold null where a gap could not be bridged. */
  input: SimulationInput;
  /** True when nothing is missing and every gap was bridged: the engine will accept `input`. */
  ready: boolean;
  missing: { variable: string; message: string }[];
  gaps: SeriesGap[];
  datasets: { variable: Variable; datasetId: number; timeStep: TimeStep }[];
  /** Things the caller should show but that do not stop a run (e.g. a dataset kept in another time zone). */
  notes: string[];
}

type Forcing = SimulationInput['forcing'];
const OPTIONAL_SERIES: [Variable, 'cloudiness' | 'windMs' | 'relativeHumidity'][] = [
  ['cloudiness', 'cloudiness'], ['wind', 'windMs'], ['humidity', 'relativeHumidity'],
];

/** How much record before the period the forcing reaches back for: the engine's spin-up (0: none). */
export interface ForcingSpan {
  spinUpYears: number;
}

/**
 * Builds the melt engine's `catchment` and `forcing` for a period from the stored bands and the
 * newest dataset of each variable: hourly temperature if there is one, otherwise daily minimum and
 * maximum (with the daily mean when stored); precipitation; cloudiness, wind and humidity when they
 * share the forcing's time step. Gaps up to the bridging limits are filled with the engine's
 * `fillShortGaps`; longer ones, and gaps at the ends, are reported so the caller can refuse.
 *
 * With a spin-up the forcing starts before the period, where the engine's spin-up wants it (the
 * start of a hydrological year `spinUpYears` before, see shared/melt/spin-up.ts) or where the
 * record starts; a gap too long to bridge before the period moves that start to the day after it
 * rather than refusing the run, and the notes say so.
 */
export async function buildSimulationInputs(
  scope: TenantScope,
  bands: BandService,
  catchmentId: number,
  period: SimulationPeriod,
  span: ForcingSpan = { spinUpYears: 0 },
): Promise<AssembledInputs> {
  const p = parseWith(simulationPeriodSchema, period);
  const catchment = await scope.findOr404<CatchmentRow>('catchments', catchmentId, 'Catchment');
  const from = span.spinUpYears > 0 ? await spinUpFrom(scope, catchmentId, p.from, catchment.latitude_deg, span.spinUpYears) : p.from;
  const assembled = await assemble(scope, bands, catchment, p, from);
  if (from === p.from) return assembled;
  const lastGapBefore = assembled.gaps.filter((g) => !g.bridged && g.to.slice(0, 10) < p.from).map((g) => g.to.slice(0, 10)).sort().at(-1);
  if (!lastGapBefore) return assembled;
  const after = addDays(lastGapBefore, 1);
  const rebuilt = await assemble(scope, bands, catchment, p, after);
  rebuilt.notes.push(`The spin-up starts on ${after}, after a gap too long to bridge that ends on ${lastGapBefore}.`);
  return rebuilt;
}

/** Where the forcing of a spun-up run starts: the spin-up's wanted start, or the record's when that is later (never after the period). */
async function spinUpFrom(scope: TenantScope, catchmentId: number, periodFrom: string, latitudeDeg: number, years: number): Promise<string> {
  const wanted = hydrologicalYearStartBefore(addDays(periodFrom, -years * DAYS_PER_YEAR + 1), latitudeDeg);
  const record = await climateRecord(scope, catchmentId);
  if (!record || record.from <= wanted) return wanted;
  return record.from < periodFrom ? record.from : periodFrom;
}

async function assemble(scope: TenantScope, bands: BandService, catchment: CatchmentRow, p: z.output<typeof simulationPeriodSchema>, from: string): Promise<AssembledInputs> {
  const catchmentId = catchment.id;
  const bandRows = await bands.list(scope, catchmentId, { terrain: true });
  const rows: DatasetRow[] = await drivingDatasets(scope, catchmentId).orderBy('datasets.id', 'desc');
  const newest = (variable: Variable, step?: TimeStep) => rows.find((r) => r.variable === variable && (!step || r.time_step === step));

  const missing: AssembledInputs['missing'] = [];
  const gaps: SeriesGap[] = [];
  const used: AssembledInputs['datasets'] = [];
  if (bandRows.length === 0) missing.push({ variable: 'bands', message: 'The catchment has no elevation bands.' });

  const load = async (row: DatasetRow): Promise<(number | null)[]> => {
    const step = row.time_step;
    const first = `${from} 00:00`;
    const last = step === 'hourly' ? `${p.to} 23:00` : `${p.to} 00:00`;
    const values = await readDatasetValues(scope.db, { datasetId: row.id, organisationId: scope.organisationId }, { from: first, to: last });
    const grid = valuesOnGrid(values, step, first, last).values;
    const limit = step === 'hourly' ? p.maxBridgeHours : p.maxBridgeDays;
    const filled = fillShortGaps(grid, limit);
    gaps.push(...findGaps(grid, filled, row, first));
    used.push({ variable: row.variable, datasetId: row.id, timeStep: step });
    return filled;
  };

  const hourlyTemperature = newest('temperature', 'hourly');
  const tMin = newest('temperatureMin');
  const tMax = newest('temperatureMax');
  const precipitation = newest('precipitation');
  let forcing: Forcing;
  const precipitationMm = precipitation ? await load(precipitation) : [];
  if (!precipitation) missing.push({ variable: 'precipitation', message: 'No precipitation dataset is stored.' });
  const precipitationStep = precipitation?.time_step;
  if (hourlyTemperature) {
    forcing = { timeStep: 'hourly', start: from, temperatureC: await load(hourlyTemperature), precipitationMm, precipitationStep };
  } else if (tMin && tMax) {
    const dailyMean = newest('temperature', 'daily');
    forcing = {
      timeStep: 'daily', start: from, tMinC: await load(tMin), tMaxC: await load(tMax), precipitationMm, precipitationStep,
      ...(dailyMean ? { tMeanC: await load(dailyMean) } : {}),
    };
  } else {
    missing.push({ variable: 'temperature', message: 'No hourly air temperature, and no pair of daily minimum and maximum temperature datasets.' });
    forcing = { timeStep: 'daily', start: from, tMinC: [], tMaxC: [], precipitationMm };
  }
  for (const [variable, key] of OPTIONAL_SERIES) {
    const row = newest(variable, forcing.timeStep);
    if (row) Object.assign(forcing, { [key]: await load(row) });
  }

  const input: SimulationInput = {
    catchment: {
      latitudeDeg: catchment.latitude_deg,
      longitudeDeg: catchment.longitude_deg,
      timeZone: catchment.time_zone,
      stationElevationM: catchment.station_elevation_m,
      background: { blackCarbonSnowNgG: catchment.background_black_carbon_ng_g, dustSnowUgG: catchment.background_dust_ug_g },
      bands: bandRows,
    },
    forcing,
    period: { from: p.from, to: p.to },
  };
  const ready = missing.length === 0 && gaps.every((g) => g.bridged);
  // The engine reads forcing hours as the catchment's local standard time; a dataset logged in another zone is used as written.
  const notes = rows
    .filter((r) => used.some((u) => u.datasetId === r.id) && r.time_zone !== catchment.time_zone)
    .map((r) => `${r.variable} (dataset ${r.id}) is kept in ${r.time_zone}, the catchment in ${catchment.time_zone}; its times are used as written.`);
  return { input, ready, missing, gaps, datasets: used, notes };
}

/** The engine's input, or a 422 that lists what is missing and every gap too long to bridge. */
export function requireReadyInputs(assembled: AssembledInputs): SimulationInput {
  if (assembled.ready) return assembled.input;
  const open = assembled.gaps.filter((g) => !g.bridged);
  const lines = [
    ...assembled.missing.map((m) => m.message),
    ...open.map((g) => `${g.variable} (dataset ${g.datasetId}) has no values from ${g.from} to ${g.to} (${g.steps} steps).`),
  ];
  throw validationFailed(`The catchment's data cannot drive the engine for this period: ${lines.slice(0, 3).join(' ')}${lines.length > 3 ? ` (and ${lines.length - 3} more)` : ''}`, undefined, { missing: assembled.missing, gaps: open });
}

function findGaps(raw: (number | null)[], filled: (number | null)[], row: DatasetRow, first: string): SeriesGap[] {
  const size = STEP_MINUTES[row.time_step];
  const start = parseTimestamp(first)!;
  const gaps: SeriesGap[] = [];
  for (let i = 0; i < raw.length; i++) {
    if (raw[i] !== null) continue;
    let j = i;
    while (j + 1 < raw.length && raw[j + 1] === null) j++;
    gaps.push({
      variable: row.variable,
      datasetId: row.id,
      from: formatMinutes(start + i * size, row.time_step),
      to: formatMinutes(start + j * size, row.time_step),
      steps: j - i + 1,
      bridged: filled[i] !== null,
    });
    i = j;
  }
  return gaps;
}
