import { encodeUnitRuns } from '../../../shared/geodata/unit-runs';
import type { CatchmentMap } from '../../../shared/schemas/geodata';
import { crsFromEpsg, crsFromText } from '../../../shared/geodata/crs';
import { pointTransform } from '../../../shared/geodata/reproject';
import { notFound, validationFailed } from '../../errors';
import type { BandService } from '../catchments/band-service';
import type { CatchmentRow } from '../catchments/catchment-service';
import type { TenantScope } from '../tenant-scope';
import { cellsName, type Derivations } from './derivation-service';
import type { GeodataStore } from './geodata-store';
import type { MapGeometry } from './map-layers';
import { json } from './upload-service';

/** The map of a catchment: the derivation's hillshade and outlines, with the bands of the table in use (or of a run's table). */
export class CatchmentMaps {
  constructor(private readonly store: GeodataStore, private readonly derivations: Derivations, private readonly bands: BandService) {}

  async map(scope: TenantScope, catchmentId: number, query: { derivation?: number; run?: number }): Promise<CatchmentMap> {
    const catchment = await scope.findOr404<CatchmentRow>('catchments', catchmentId, 'Catchment');
    const row = query.derivation ? await this.derivations.row(scope, catchmentId, query.derivation) : await this.derivations.newest(scope, catchmentId);
    if (!row) throw validationFailed('There is no map yet: upload an elevation model and the catchment outline, then derive the bands.', 'derivation');
    const table = await this.table(scope, catchmentId, query.run);
    const bands = table ? await this.bands.rowsOf(scope, table.id) : [];
    const geometry = json<MapGeometry>(row.map);
    const cells = await this.store.read(scope.organisationId, cellsName(row.stored_prefix));
    const crs = crsFromText(geometry.crs.proj4, 'map');
    const [x, y] = pointTransform(crsFromEpsg(4326, 'map'), crs)(catchment.longitude_deg, catchment.latitude_deg);
    return {
      derivationId: row.id, ...geometry, units: encodeUnitRuns(cells, geometry.width, geometry.height, bands), bands,
      bandTable: table ? { id: table.id, version: table.version, source: table.source } : null,
      station: { name: catchment.station_name ?? 'Reference station', elevationM: catchment.station_elevation_m, x, y },
    };
  }

  private async table(scope: TenantScope, catchmentId: number, runId?: number): Promise<{ id: number; version: number; source: 'entered' | 'derived' } | null> {
    if (runId === undefined) return this.bands.current(scope, catchmentId);
    const run: { band_table_id: number | null } | undefined = await scope.from('runs').where('runs.id', runId).where('catchment_id', catchmentId).first('band_table_id');
    if (!run) throw notFound('Run');
    if (run.band_table_id === null) throw validationFailed('This run was made before its band table was recorded, so its bands cannot be drawn on the map.', 'run');
    const table: { id: number; version: number; source: 'entered' | 'derived' } | undefined = await scope.from('band_tables').where('band_tables.id', run.band_table_id).first('id', 'version', 'source');
    return table ?? null;
  }
}
