import type { Knex } from 'knex';
import type { BandMonthRow, SimulationSummary } from '../../../shared/analysis/simulation-summary';
import { isTransientSummary, type MemberSummary } from '../../../shared/analysis/simulate-summary';
import type { TransientSummary, TransientYearRow } from '../../../shared/analysis/transient-member';
import type { MemberPlan } from '../../../shared/analysis/run-plan';
import { SOURCES, type Source } from '../../../shared/melt/result';
import { isUniqueViolation } from '../../db-errors';
import type { TenantScope } from '../tenant-scope';
import type { ShortwaveSource } from '../../../shared/melt/schema';
import type { StartReport } from '../../../shared/melt/spin-up';

/**
 * Rows per INSERT: MySQL allows 65,535 placeholders per statement, and building one statement
 * runs on the worker's event loop, so chunks stay small enough to keep it renewing its job locks.
 */
const CHUNK = 500;

const DAILY_COLUMN: Record<Source, string> = { snow: 'snow_m3', ice: 'ice_m3', debrisIce: 'debris_ice_m3', rain: 'rain_m3' };
const ROUTED_COLUMN: Record<Source, string> = { snow: 'routed_snow_m3', ice: 'routed_ice_m3', debrisIce: 'routed_debris_ice_m3', rain: 'routed_rain_m3' };

async function insertChunked(db: Knex | Knex.Transaction, table: string, rows: Record<string, unknown>[]): Promise<void> {
  for (let i = 0; i < rows.length; i += CHUNK) await db(table).insert(rows.slice(i, i + CHUNK));
}

/** What storing one member did: stored it now, found it stored already, or found the run closed. */
export type MemberStored = { outcome: 'stored' | 'already-stored'; finished: boolean } | { outcome: 'run-closed'; finished: false };

/**
 * Stores one member of a run in one transaction: its row, band × month totals and daily series
 * (or a multi-decade member's years), keyed by run and member (a member retried after a fault is
 * never stored twice), then moves the run's progress on, or marks it done when this was its last
 * member. The run row is locked first, so members finishing at once on different workers count
 * correctly and exactly one finishes the run.
 * Without a summary it only counts (the member was found stored before simulating).
 */
export async function storeMember(scope: TenantScope, runId: number, plan: MemberPlan, summary: MemberSummary | null): Promise<MemberStored> {
  return scope.transaction(async (s) => {
    const run = await s.from<{ status: string; simulation_count: number }>('runs').where('id', runId).forUpdate().first('status', 'simulation_count');
    if (!run || (run.status !== 'queued' && run.status !== 'running')) return { outcome: 'run-closed', finished: false };
    // The member's key is unique within its run: a member stored before (a retry after a fault) is refused by it and counted, not stored twice.
    const existing = !summary || !(await insertMemberOnce(s, runId, plan, summary));
    const { stored } = (await s.from('run_members').where('run_id', runId).count({ stored: '*' }).first()) as { stored: number };
    const finished = Number(stored) >= run.simulation_count;
    await s.from('runs').where('id', runId).update(finished
      ? { status: 'done', progress: 1, error_message: null, finished_at: s.db.fn.now(3) }
      // Never backwards: members still simulating may have moved it further (see queue/run-progress.ts).
      : { status: 'running', progress: s.db.raw('GREATEST(progress, ?)', [Number(stored) / run.simulation_count]), started_at: s.db.raw('COALESCE(started_at, NOW(3))') });
    return { outcome: existing ? 'already-stored' : 'stored', finished };
  });
}

/** A multi-decade member's years, one row each. */
function yearRows(organisation_id: number, member_id: number, summary: TransientSummary): Record<string, unknown>[] {
  return summary.years.map((y) => ({
    organisation_id, member_id, year: y.year, record_year: y.recordYear, temperature_delta_c: y.temperatureDeltaC, precipitation_factor: y.precipitationFactor,
    glacier_area_km2: y.glacierAreaKm2, glacier_volume_km3: y.glacierVolumeKm3, mass_balance_mm: y.massBalanceMm, volume_change_m3: y.volumeChangeM3,
    snow_m3: y.runoffM3.snow, ice_m3: y.runoffM3.ice, debris_ice_m3: y.runoffM3.debrisIce, rain_m3: y.runoffM3.rain,
    glacier_runoff_m3: y.glacierRunoffM3, band_glacier_area_km2: JSON.stringify(y.bandGlacierAreaKm2),
  }));
}

/** Stores the member with its rows; false (and nothing stored) when the run holds the member already. */
async function insertMemberOnce(s: TenantScope, runId: number, plan: MemberPlan, summary: MemberSummary): Promise<boolean> {
  const organisation_id = s.organisationId;
  let memberId: number;
  try {
    memberId = await s.insert('run_members', {
      run_id: runId, member_key: plan.key, kind: plan.kind, combination_mask: plan.combinationMask, ensemble_index: plan.ensembleIndex,
      parameters: JSON.stringify(plan.input.parameters), start_date: summary.startDate, day_count: isTransientSummary(summary) ? 0 : summary.dayCount,
      bands: JSON.stringify(summary.bands), start_report: summary.start ? JSON.stringify(summary.start) : null, shortwave_source: summary.shortwaveSource,
    });
  } catch (error) {
    // Only the refused statement is undone (InnoDB): the transaction goes on with the run row still locked.
    if (isUniqueViolation(error)) return false;
    throw error;
  }
  if (isTransientSummary(summary)) {
    await insertChunked(s.db, 'run_years', yearRows(organisation_id, memberId, summary));
    return true;
  }
  const months = summary.months.map((m) => ({
    organisation_id, member_id: memberId, band_index: m.bandIndex, month: m.month, days: m.days,
    snow_melt_mm: m.snowMeltMm, ice_melt_mm: m.iceMeltMm, debris_ice_melt_mm: m.debrisIceMeltMm, rain_mm: m.rainMm,
    snowfall_mm: m.snowfallMm, mean_albedo: m.meanAlbedo, absorbed_shortwave_wm2: m.absorbedShortwaveWm2,
    net_shortwave_wm2: m.netShortwaveWm2, net_longwave_wm2: m.netLongwaveWm2, sensible_heat_wm2: m.sensibleHeatWm2,
    rainfall_mm: m.rainfallMm, surface_melt_mm: m.surfaceMeltMm, refrozen_mm: m.refrozenMm, sublimation_mm: m.sublimationMm,
    evaporation_mm: m.evaporationMm, snow_cover_fraction: m.meanSnowCoverFraction, latent_heat_wm2: m.latentHeatWm2,
    wind_drift_mm: m.windDriftMm, avalanche_mm: m.avalancheMm,
  }));
  const daily: Record<string, unknown>[] = [];
  for (let d = 0; d < summary.dayCount; d++) {
    const row: Record<string, unknown> = { organisation_id, member_id: memberId, day_index: d };
    for (const source of SOURCES) row[DAILY_COLUMN[source]] = summary.dailyM3[source][d];
    if (summary.routedDailyM3) for (const source of SOURCES) row[ROUTED_COLUMN[source]] = summary.routedDailyM3[source][d];
    daily.push(row);
  }
  await insertChunked(s.db, 'run_band_months', months);
  await insertChunked(s.db, 'run_daily', daily);
  return true;
}

interface MemberRow {
  id: number;
  member_key: string;
  kind: MemberPlan['kind'];
  combination_mask: number | null;
  ensemble_index: number | null;
  start_date: string | Date;
  day_count: number;
  bands: string | { elevationM: number; areaM2: number }[];
  start_report: string | StartReport | null;
  shortwave_source: ShortwaveSource | null;
}

export interface StoredMember {
  key: string;
  kind: MemberPlan['kind'];
  combinationMask: number | null;
  ensembleIndex: number | null;
  summary: SimulationSummary;
}

const isoDate = (v: string | Date) => (v instanceof Date ? v.toISOString().slice(0, 10) : String(v).slice(0, 10));
const parsed = <T>(v: string | T): T => (typeof v === 'string' ? (JSON.parse(v) as T) : v);

/** Reads every member of a run back, with its band × month rows and daily series. */
export async function loadMembers(scope: TenantScope, runId: number): Promise<StoredMember[]> {
  const rows: MemberRow[] = await scope.from<MemberRow>('run_members').where('run_id', runId).orderBy('id');
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.id);
  const monthRows = await scope.from('run_band_months').whereIn('member_id', ids).orderBy(['member_id', 'band_index', 'month']);
  const dailyRows = await scope.from('run_daily').whereIn('member_id', ids).orderBy(['member_id', 'day_index']);
  const byMember = new Map<number, StoredMember>();
  const zeros = (n: number) => ({ snow: new Array<number>(n).fill(0), ice: new Array<number>(n).fill(0), debrisIce: new Array<number>(n).fill(0), rain: new Array<number>(n).fill(0) });
  // Routing is on or off for a whole member: its first day tells.
  const routed = new Set((dailyRows as Record<string, number | null>[]).filter((d) => d.day_index === 0 && d.routed_snow_m3 !== null).map((d) => d.member_id));
  for (const r of rows) {
    const summary: SimulationSummary = {
      startDate: isoDate(r.start_date), dayCount: r.day_count, bands: parsed(r.bands), months: [],
      dailyM3: zeros(r.day_count), routedDailyM3: routed.has(r.id) ? zeros(r.day_count) : null,
      start: r.start_report ? parsed(r.start_report) : null, shortwaveSource: r.shortwave_source,
    };
    byMember.set(r.id, { key: r.member_key, kind: r.kind, combinationMask: r.combination_mask, ensembleIndex: r.ensemble_index, summary });
  }
  for (const m of monthRows as Record<string, number & string>[]) {
    const row: BandMonthRow = {
      bandIndex: m.band_index, month: m.month, days: m.days, snowMeltMm: m.snow_melt_mm, iceMeltMm: m.ice_melt_mm,
      debrisIceMeltMm: m.debris_ice_melt_mm, rainMm: m.rain_mm, snowfallMm: m.snowfall_mm, meanAlbedo: m.mean_albedo,
      absorbedShortwaveWm2: m.absorbed_shortwave_wm2, netShortwaveWm2: m.net_shortwave_wm2, netLongwaveWm2: m.net_longwave_wm2,
      sensibleHeatWm2: m.sensible_heat_wm2,
      // Engine 1.x stored none of these; they read as 0 there.
      rainfallMm: m.rainfall_mm ?? 0, surfaceMeltMm: m.surface_melt_mm ?? 0, refrozenMm: m.refrozen_mm ?? 0, sublimationMm: m.sublimation_mm ?? 0,
      evaporationMm: m.evaporation_mm ?? 0, meanSnowCoverFraction: m.snow_cover_fraction ?? 0, latentHeatWm2: m.latent_heat_wm2 ?? 0,
      // Engine 2.0 and earlier moved no snow between bands.
      windDriftMm: m.wind_drift_mm ?? 0, avalancheMm: m.avalanche_mm ?? 0,
    };
    byMember.get(m.member_id)!.summary.months.push(row);
  }
  for (const d of dailyRows as Record<string, number>[]) {
    const { dailyM3, routedDailyM3 } = byMember.get(d.member_id)!.summary;
    for (const source of SOURCES) dailyM3[source][d.day_index] = d[DAILY_COLUMN[source]];
    if (routedDailyM3) for (const source of SOURCES) routedDailyM3[source][d.day_index] = d[ROUTED_COLUMN[source]];
  }
  return [...byMember.values()];
}

export interface StoredTransientMember {
  key: string;
  kind: MemberPlan['kind'];
  summary: Omit<TransientSummary, 'finalGlacier'>;
}

/** Reads a multi-decade run's members back with their years. */
export async function loadTransientMembers(scope: TenantScope, runId: number): Promise<StoredTransientMember[]> {
  const rows: MemberRow[] = await scope.from<MemberRow>('run_members').where('run_id', runId).orderBy('id');
  if (rows.length === 0) return [];
  const yearRows = await scope.from('run_years').whereIn('member_id', rows.map((r) => r.id)).orderBy(['member_id', 'year']);
  const byMember = new Map<number, TransientYearRow[]>(rows.map((r) => [r.id, []]));
  for (const y of yearRows as Record<string, number & string>[]) {
    byMember.get(y.member_id)!.push({
      year: y.year, recordYear: y.record_year, temperatureDeltaC: y.temperature_delta_c, precipitationFactor: y.precipitation_factor,
      glacierAreaKm2: y.glacier_area_km2, glacierVolumeKm3: y.glacier_volume_km3, massBalanceMm: y.mass_balance_mm, volumeChangeM3: y.volume_change_m3,
      runoffM3: { snow: y.snow_m3, ice: y.ice_m3, debrisIce: y.debris_ice_m3, rain: y.rain_m3 }, glacierRunoffM3: y.glacier_runoff_m3,
      bandGlacierAreaKm2: parsed<number[]>(y.band_glacier_area_km2),
    });
  }
  return rows.map((r) => ({
    key: r.member_key, kind: r.kind,
    summary: {
      kind: 'transient', startDate: isoDate(r.start_date), bands: parsed(r.bands), start: r.start_report ? parsed(r.start_report) : null,
      shortwaveSource: r.shortwave_source, years: byMember.get(r.id)!,
    },
  }));
}
