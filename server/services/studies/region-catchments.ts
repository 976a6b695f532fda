import { conflict } from '../../errors';
import { insertBaseline } from '../catchments/baseline-scenario';
import { insertReferenceStation } from '../stations/reference-station';
import { drivingDatasets } from '../stations/station-rows';
import type { TenantScope } from '../tenant-scope';

/** The catchment whose reference station's record the catchments made in bulk share (the region's station). */
export interface ClimateSource {
  id: number;
  time_zone: string;
  station_name: string;
  station_elevation_m: number;
  background_black_carbon_ng_g: number;
  background_dust_ug_g: number;
}

/** What a catchment made in bulk is given; its background loads and climate come from the source. */
export interface RegionCatchmentFields {
  name: string;
  latitudeDeg: number;
  longitudeDeg: number;
  timeZone: string;
  stationName: string;
  stationElevationM: number;
  description: string;
}

export const climateSource = (scope: TenantScope, id: number): Promise<ClimateSource> => scope.findOr404<ClimateSource>('catchments', id, 'Catchment');

/** The names among `names` that catchments of the organisation already have, in lower case (the unique key compares names without letter case). */
export async function takenNames(scope: TenantScope, names: string[]): Promise<Set<string>> {
  if (names.length === 0) return new Set();
  const rows: { name: string }[] = await scope.from('catchments').whereIn('name', names).select('name');
  return new Set(rows.map((r) => r.name.toLowerCase()));
}

export async function assertNamesFree(scope: TenantScope, names: string[], field: string): Promise<void> {
  const taken = await takenNames(scope, names);
  const clash = names.find((n) => taken.has(n.toLowerCase()));
  if (clash) throw conflict(`A catchment called "${clash}" already exists.`, field);
}

/**
 * Makes one catchment of a region (call inside the transaction that makes them all): the
 * catchment with its baseline, its reference station, and the source's reference-station record
 * copied to it. Its band table is the caller's.
 */
export async function insertRegionCatchment(s: TenantScope, fields: RegionCatchmentFields, source: ClimateSource, userId: number): Promise<number> {
  const id = await s.insert('catchments', {
    name: fields.name, latitude_deg: fields.latitudeDeg, longitude_deg: fields.longitudeDeg, time_zone: fields.timeZone,
    station_name: fields.stationName, station_elevation_m: fields.stationElevationM, description: fields.description, outlet_description: '',
    background_black_carbon_ng_g: source.background_black_carbon_ng_g, background_dust_ug_g: source.background_dust_ug_g, created_by: userId,
  });
  await insertBaseline(s, id, userId);
  const stationId = await insertReferenceStation(s, id, fields.stationName, fields.stationElevationM);
  await copyClimate(s, source.id, id, stationId);
  return id;
}

/** Adds catchments to a study (inside the transaction that made them). */
export async function addToStudy(s: TenantScope, studyId: number, catchmentIds: number[]): Promise<void> {
  await s.db('study_catchments').insert(catchmentIds.map((catchment_id) => ({ organisation_id: s.organisationId, study_id: studyId, catchment_id })));
}

/** Copies the series of a catchment's reference station with their values to another catchment's reference station (same organisation), set-based. */
async function copyClimate(s: TenantScope, fromId: number, toId: number, toStationId: number): Promise<void> {
  const datasets: { id: number }[] = await drivingDatasets(s, fromId);
  const columns = 'variable, kind, unit, original_unit, time_step, time_zone, source, accuracy, file_name, uploaded_by, uploaded_by_name, first_at, last_at, value_count';
  for (const d of datasets) {
    await s.db.raw(`INSERT INTO datasets (organisation_id, catchment_id, station_id, ${columns}) SELECT organisation_id, ?, ?, ${columns} FROM datasets WHERE id = ? AND organisation_id = ?`,
      [toId, toStationId, d.id, s.organisationId]);
    const [[{ id: newId }]] = (await s.db.raw('SELECT LAST_INSERT_ID() AS id')) as [[{ id: number }]];
    await s.db.raw('INSERT INTO dataset_values (dataset_id, organisation_id, t, value) SELECT ?, organisation_id, t, value FROM dataset_values WHERE dataset_id = ? AND organisation_id = ?',
      [newId, d.id, s.organisationId]);
  }
}
