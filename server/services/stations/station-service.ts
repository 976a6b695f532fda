import type { Station, StationFields } from '../../../shared/schemas/stations';
import { conflict, validationFailed } from '../../errors';
import type { BandService } from '../catchments/band-service';
import type { TenantScope } from '../tenant-scope';
import { stationColumns, stationOfCatchment, toStation, type StationRow } from './station-rows';

/**
 * The stations of a catchment. The reference station (made with the catchment) drives the
 * engine; its name and elevation are also the catchment's, so editing one edits the other.
 * A station above the catchment's highest band cannot stand for any band and is refused.
 */
export class StationService {
  constructor(private readonly bands: BandService) {}

  async list(scope: TenantScope, catchmentId: number): Promise<Station[]> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const rows = await scope.from<StationRow>('stations')
      .select('stations.*', scope.db('datasets').count('*').whereRaw('datasets.station_id = stations.id').as('dataset_count'))
      .where('stations.catchment_id', catchmentId)
      .orderBy([{ column: 'stations.is_reference', order: 'desc' }, { column: 'stations.elevation_m' }, { column: 'stations.id' }]);
    return rows.map(toStation);
  }

  async get(scope: TenantScope, catchmentId: number, stationId: number): Promise<Station> {
    await stationOfCatchment(scope, catchmentId, stationId);
    return (await this.list(scope, catchmentId)).find((s) => s.id === stationId)!;
  }

  async create(scope: TenantScope, catchmentId: number, fields: StationFields): Promise<Station> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    await this.check(scope, catchmentId, fields);
    const id = await scope.insert('stations', { catchment_id: catchmentId, ...stationColumns(fields), is_reference: false });
    return this.get(scope, catchmentId, id);
  }

  async update(scope: TenantScope, catchmentId: number, stationId: number, fields: StationFields): Promise<Station> {
    const row = await stationOfCatchment(scope, catchmentId, stationId);
    await this.check(scope, catchmentId, fields, stationId);
    await scope.transaction(async (s) => {
      await s.from('stations').where('id', stationId).update({ ...stationColumns(fields), updated_at: s.db.fn.now() });
      if (row.is_reference) {
        await s.from('catchments').where('id', catchmentId).update({ station_name: fields.name, station_elevation_m: fields.elevationM, updated_at: s.db.fn.now() });
      }
    });
    return this.get(scope, catchmentId, stationId);
  }

  /** Deletes a station without datasets; the reference station stays as long as the catchment does. */
  async remove(scope: TenantScope, catchmentId: number, stationId: number): Promise<void> {
    const row = await stationOfCatchment(scope, catchmentId, stationId);
    if (row.is_reference) throw conflict('This is the catchment’s reference station, whose series drive the model; it cannot be deleted.');
    const [{ count }] = await scope.from('datasets').where('station_id', stationId).count({ count: '*' });
    if (Number(count) > 0) throw conflict(`This station still has ${count} dataset(s); move them to another station or delete them first.`);
    await scope.from('stations').where('id', stationId).delete();
  }

  private async check(scope: TenantScope, catchmentId: number, fields: StationFields, exceptId?: number): Promise<void> {
    const clash = await scope.from('stations').where({ catchment_id: catchmentId, name: fields.name }).whereNot('id', exceptId ?? 0).first('id');
    if (clash) throw conflict('This catchment already has a station with this name.', 'name');
    const bands = await this.bands.list(scope, catchmentId);
    if (bands.length === 0) return;
    const top = Math.max(...bands.map((b) => b.upperM));
    if (fields.elevationM > top) {
      throw validationFailed(`elevationM: the station at ${fields.elevationM} m lies above the catchment's highest band (${top} m), so it cannot stand for any band.`, 'elevationM');
    }
  }
}
