import type { Station, StationFields } from '../../../shared/schemas/stations';
import { notFound } from '../../errors';
import type { TenantScope } from '../tenant-scope';

export interface StationRow {
  id: number;
  organisation_id: number;
  catchment_id: number;
  name: string;
  network: string;
  instrument: string;
  elevation_m: number;
  latitude_deg: number | null;
  longitude_deg: number | null;
  accuracy: string | { variable: string; statement: string }[];
  licence: string;
  is_reference: number | boolean;
  created_at: Date;
  updated_at: Date;
  dataset_count?: number;
}

export function toStation(row: StationRow): Station {
  return {
    id: row.id,
    catchmentId: row.catchment_id,
    name: row.name,
    network: row.network,
    instrument: row.instrument,
    elevationM: row.elevation_m,
    latitudeDeg: row.latitude_deg,
    longitudeDeg: row.longitude_deg,
    accuracy: typeof row.accuracy === 'string' ? JSON.parse(row.accuracy) : row.accuracy,
    licence: row.licence,
    isReference: Boolean(row.is_reference),
    datasetCount: Number(row.dataset_count ?? 0),
    createdAt: new Date(row.created_at).toISOString(),
    updatedAt: new Date(row.updated_at).toISOString(),
  };
}

export function stationColumns(fields: StationFields) {
  return {
    name: fields.name,
    network: fields.network,
    instrument: fields.instrument,
    elevation_m: fields.elevationM,
    latitude_deg: fields.latitudeDeg,
    longitude_deg: fields.longitudeDeg,
    accuracy: JSON.stringify(fields.accuracy),
    licence: fields.licence,
  };
}

/** A station of this catchment, or 404 (also for another catchment's or organisation's station). */
export async function stationOfCatchment(scope: TenantScope, catchmentId: number, stationId: number): Promise<StationRow> {
  const row = await scope.findOr404<StationRow>('stations', stationId, 'Station');
  if (row.catchment_id !== catchmentId) throw notFound('Station');
  return row;
}

/** The catchment's reference station: the one whose series drive the engine. */
export async function referenceStation(scope: TenantScope, catchmentId: number): Promise<StationRow> {
  const row = await scope.from<StationRow>('stations').where({ catchment_id: catchmentId, is_reference: true }).first();
  if (!row) throw notFound('Reference station');
  return row;
}

/**
 * The climate datasets that drive the engine: those of the catchment's reference station (other
 * stations feed the fitted gradients and comparisons, never the forcing itself).
 */
export function drivingDatasets(scope: TenantScope, catchmentId: number) {
  return scope.from('datasets')
    .join('stations', 'stations.id', 'datasets.station_id')
    .where({ 'datasets.catchment_id': catchmentId, 'datasets.kind': 'climate', 'stations.is_reference': true })
    .select('datasets.*');
}
