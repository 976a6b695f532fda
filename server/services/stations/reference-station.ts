import type { TenantScope } from '../tenant-scope';

/**
 * The catchment's station_name and station_elevation_m are its reference station's name and
 * elevation (the station whose series drive the engine). These two helpers keep the stations
 * table in step with them; call them in the transaction that writes the catchment.
 */
export async function insertReferenceStation(scope: TenantScope, catchmentId: number, name: string, elevationM: number): Promise<number> {
  return scope.insert('stations', { catchment_id: catchmentId, name, elevation_m: elevationM, accuracy: '[]', is_reference: true });
}

export async function syncReferenceStation(scope: TenantScope, catchmentId: number, name: string, elevationM: number): Promise<void> {
  await scope.from('stations').where({ catchment_id: catchmentId, is_reference: true }).update({ name, elevation_m: elevationM, updated_at: scope.db.fn.now() });
}
