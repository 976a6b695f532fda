import type { Knex } from 'knex';
import type { Catchment, CatchmentFields, catchmentListQuerySchema } from '../../../shared/schemas/catchments';
import type { z } from 'zod';
import { conflict, notFound } from '../../errors';
import type { TenantScope } from '../tenant-scope';
import { insertBaseline } from './baseline-scenario';
import { insertReferenceStation, syncReferenceStation } from '../stations/reference-station';

export interface CatchmentRow {
  id: number;
  organisation_id: number;
  name: string;
  description: string;
  latitude_deg: number;
  longitude_deg: number;
  time_zone: string;
  station_name: string;
  station_elevation_m: number;
  outlet_description: string;
  background_black_carbon_ng_g: number;
  background_dust_ug_g: number;
  archived_at: Date | null;
  created_at: Date;
  updated_at: Date;
  band_count?: number;
  dataset_count?: number;
}

const SORT_COLUMNS = { name: 'name', stationElevationM: 'station_elevation_m', updatedAt: 'updated_at', createdAt: 'created_at' } as const;

function toColumns(fields: CatchmentFields) {
  return {
    name: fields.name,
    description: fields.description,
    latitude_deg: fields.latitudeDeg,
    longitude_deg: fields.longitudeDeg,
    time_zone: fields.timeZone,
    station_name: fields.stationName,
    station_elevation_m: fields.stationElevationM,
    outlet_description: fields.outletDescription,
    background_black_carbon_ng_g: fields.backgroundBlackCarbonNgG,
    background_dust_ug_g: fields.backgroundDustUgG,
  };
}

export function toCatchment(row: CatchmentRow): Catchment {
  return {
    id: row.id,
    name: row.name,
    description: row.description,
    latitudeDeg: row.latitude_deg,
    longitudeDeg: row.longitude_deg,
    timeZone: row.time_zone,
    stationName: row.station_name,
    stationElevationM: row.station_elevation_m,
    outletDescription: row.outlet_description,
    backgroundBlackCarbonNgG: row.background_black_carbon_ng_g,
    backgroundDustUgG: row.background_dust_ug_g,
    archived: row.archived_at !== null,
    bandCount: Number(row.band_count ?? 0),
    datasetCount: Number(row.dataset_count ?? 0),
    createdAt: new Date(row.created_at).toISOString(),
    updatedAt: new Date(row.updated_at).toISOString(),
  };
}

/** Catchments of one organisation: list, read, create, edit, archive or delete. */
export class CatchmentService {
  /** The row with its band and dataset counts, or 404. */
  async get(scope: TenantScope, id: number): Promise<Catchment> {
    const row = Number.isSafeInteger(id) && id > 0
      ? ((await withCounts(scope.from<CatchmentRow>('catchments'), scope.db).where('catchments.id', id).first()) as CatchmentRow | undefined)
      : undefined;
    if (!row) throw notFound('Catchment');
    return toCatchment(row);
  }

  async list(scope: TenantScope, query: z.output<typeof catchmentListQuerySchema>) {
    const base = scope.from('catchments').where((q) => {
      if (query.archived) q.whereNotNull('catchments.archived_at');
      else q.whereNull('catchments.archived_at');
    });
    if (query.search) {
      const like = `%${query.search.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
      base.where((q) => {
        q.where('catchments.name', 'like', like).orWhere('catchments.station_name', 'like', like).orWhere('catchments.description', 'like', like);
      });
    }
    const offset = (query.page - 1) * query.perPage;
    const rows = (await withListCounts(base.clone(), scope.db, scope.organisationId)
      .orderBy(`catchments.${SORT_COLUMNS[query.sort]}`, query.descending ? 'desc' : 'asc')
      .orderBy('catchments.id')
      .limit(query.perPage)
      .offset(offset)) as CatchmentRow[];
    // A page that is not full tells the total itself (most organisations have one page); only a full page, or one past the end, counts.
    // (A window count on every page made MariaDB sort the whole list in a temporary table, a fifth of the list's time.)
    const total = rows.length > 0 && rows.length < query.perPage ? offset + rows.length
      : query.page === 1 && rows.length === 0 ? 0
        : Number((await base.clone().count({ n: '*' }))[0]!.n);
    return { catchments: rows.map(toCatchment), total, page: query.page, perPage: query.perPage };
  }

  /** A new catchment with its baseline scenario and its reference station, in one transaction. */
  async create(scope: TenantScope, fields: CatchmentFields, userId: number): Promise<Catchment> {
    await this.assertNameFree(scope, fields.name);
    const id = await scope.transaction(async (s) => {
      const catchmentId = await s.insert('catchments', { ...toColumns(fields), created_by: userId });
      await insertBaseline(s, catchmentId, userId);
      await insertReferenceStation(s, catchmentId, fields.stationName, fields.stationElevationM);
      return catchmentId;
    });
    return this.get(scope, id);
  }

  async update(scope: TenantScope, id: number, fields: CatchmentFields): Promise<Catchment> {
    await scope.findOr404('catchments', id, 'Catchment');
    await this.assertNameFree(scope, fields.name, id);
    await this.assertStationNameFree(scope, id, fields.stationName);
    await scope.transaction(async (s) => {
      await s.from('catchments').where('id', id).update({ ...toColumns(fields), updated_at: s.db.fn.now() });
      await syncReferenceStation(s, id, fields.stationName, fields.stationElevationM);
    });
    return this.get(scope, id);
  }

  /** Archives (keeps) a catchment that runs refer to; deletes it with its bands and data otherwise. */
  async remove(scope: TenantScope, id: number): Promise<'archived' | 'deleted'> {
    await scope.findOr404('catchments', id, 'Catchment');
    if (await hasRuns(scope, id)) {
      await scope.from('catchments').where('id', id).update({ archived_at: scope.db.fn.now() });
      return 'archived';
    }
    await scope.from('catchments').where('id', id).delete();
    return 'deleted';
  }

  async setArchived(scope: TenantScope, id: number, archived: boolean): Promise<Catchment> {
    await scope.findOr404('catchments', id, 'Catchment');
    await scope.from('catchments').where('id', id).update({ archived_at: archived ? scope.db.fn.now() : null });
    return this.get(scope, id);
  }

  /** The reference station's new name must not be another station's of the catchment. */
  private async assertStationNameFree(scope: TenantScope, catchmentId: number, name: string): Promise<void> {
    const clash = await scope.from('stations').where({ catchment_id: catchmentId, name, is_reference: false }).first('id');
    if (clash) throw conflict('Another station of this catchment has this name.', 'stationName');
  }

  private async assertNameFree(scope: TenantScope, name: string, exceptId?: number): Promise<void> {
    const clash = await scope.from('catchments').where('name', name).whereNot('id', exceptId ?? 0).first('id');
    if (clash) throw conflict('A catchment with this name already exists.', 'name');
  }
}

function withCounts(query: Knex.QueryBuilder, db: Knex | Knex.Transaction): Knex.QueryBuilder {
  return query.select(
    'catchments.*',
    // The newest band table version's own count (kept with it): one index lookup per catchment.
    db('band_tables').select('band_tables.band_count').whereRaw('band_tables.catchment_id = catchments.id').orderBy('band_tables.version', 'desc').limit(1).as('band_count'),
    db('datasets').count('*').whereRaw('datasets.catchment_id = catchments.id').as('dataset_count'),
  );
}

/**
 * The same counts for a page of the list, from the organisation's newest band table versions and
 * dataset counts read once each: per-row subqueries cost MariaDB about twice as much on a page.
 */
function withListCounts(query: Knex.QueryBuilder, db: Knex | Knex.Transaction, organisationId: number): Knex.QueryBuilder {
  const newest = db('band_tables').where('organisation_id', organisationId).groupBy('catchment_id').select('catchment_id').max({ version: 'version' }).as('newest_bands');
  const datasets = db('datasets').where('organisation_id', organisationId).groupBy('catchment_id').select('catchment_id').count({ n: '*' }).as('dataset_counts');
  return query
    .leftJoin(newest, 'newest_bands.catchment_id', 'catchments.id')
    .leftJoin('band_tables as current_bands', (on) => on.on('current_bands.catchment_id', 'newest_bands.catchment_id').andOn('current_bands.version', 'newest_bands.version'))
    .leftJoin(datasets, 'dataset_counts.catchment_id', 'catchments.id')
    .select('catchments.*', 'current_bands.band_count', db.raw('COALESCE(dataset_counts.n, 0) AS dataset_count'));
}

async function hasRuns(scope: TenantScope, catchmentId: number): Promise<boolean> {
  const row = await scope.from('runs').where('catchment_id', catchmentId).first('id');
  return row !== undefined;
}
