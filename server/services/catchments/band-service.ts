import { BAND_COLUMNS, type BandFileReply, type BandRow, type BandTableVersion } from '../../../shared/schemas/catchment-bands';
import type { TerrainFields } from '../../../shared/geodata/terrain-fields';
import { csvDocument, safeFileName } from '../../../shared/csv/csv-writing';
import { csvFile, type DownloadFile } from '../download-file';
import type { TenantScope } from '../tenant-scope';
import { insertBandTable, type BandTableOrigin } from './band-tables';
import { readBandFile } from './csv/band-file';
import { decodeCsvText } from './csv/read-table';

interface BandDbRow {
  lower_m: number;
  upper_m: number;
  area_km2: number;
  slope_deg: number;
  aspect_deg: number;
  glacier_fraction: number;
  debris_fraction: number;
  debris_thickness_m: number;
  aspect_class: BandRow['aspectClass'] | null;
  sky_view_factor: number | null;
  horizon_deg: string | number[][] | null;
}

interface TableDbRow {
  id: number;
  version: number;
  source: BandTableVersion['source'];
  derivation_id: number | null;
  /** How many bands the version holds (written with it). */
  band_count: number;
  created_at: Date;
}

const toBand = (r: BandDbRow): BandRow => ({
  lowerM: r.lower_m,
  upperM: r.upper_m,
  areaKm2: r.area_km2,
  slopeDeg: r.slope_deg,
  aspectDeg: r.aspect_deg,
  glacierFraction: r.glacier_fraction,
  debrisFraction: r.debris_fraction,
  debrisThicknessM: r.debris_thickness_m,
  ...(r.aspect_class ? { aspectClass: r.aspect_class } : {}),
});

function terrainOf(r: BandDbRow): TerrainFields {
  if (r.sky_view_factor === null) return {};
  const horizon = typeof r.horizon_deg === 'string' ? (JSON.parse(r.horizon_deg) as number[][]) : r.horizon_deg;
  return { skyViewFactor: r.sky_view_factor, ...(horizon ? { horizonDeg: horizon } : {}) };
}

const sameUnit = (a: BandRow, b: BandRow): boolean => a.lowerM === b.lowerM && a.upperM === b.upperM && (a.aspectClass ?? null) === (b.aspectClass ?? null);

/**
 * The band table of a catchment, read and replaced as a whole so it is always contiguous. Every
 * replacement is a new version; the newest is in use, older ones stay for the runs made with them.
 */
export class BandService {
  /**
   * The bands of the table in use (none before the first save). With `terrain`, derived bands
   * carry the engine's terrain fields (sky-view factor, horizons); the editor does without them.
   */
  async list(scope: TenantScope, catchmentId: number, options: { terrain?: boolean } = {}): Promise<(BandRow & TerrainFields)[]> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const table = await this.current(scope, catchmentId);
    return table ? this.rowsOf(scope, table.id, options) : [];
  }

  /** The bands of one version of the table. */
  async rowsOf(scope: TenantScope, bandTableId: number, options: { terrain?: boolean } = {}): Promise<(BandRow & TerrainFields)[]> {
    const rows: BandDbRow[] = await scope.from<BandDbRow>('elevation_bands').where('band_table_id', bandTableId).orderBy('position');
    return rows.map((r) => (options.terrain ? { ...toBand(r), ...terrainOf(r) } : toBand(r)));
  }

  /** The version in use, or null when the catchment has no bands yet. */
  async current(scope: TenantScope, catchmentId: number): Promise<BandTableVersion | null> {
    const row = await scope.from<TableDbRow>('band_tables').where('catchment_id', catchmentId).orderBy('version', 'desc').first();
    return row ? (await this.describe(scope, [row]))[0] : null;
  }

  /** Every saved version, newest first, with how many runs were made with each. */
  async versions(scope: TenantScope, catchmentId: number): Promise<BandTableVersion[]> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const rows = await scope.from<TableDbRow>('band_tables').where('catchment_id', catchmentId).orderBy('version', 'desc');
    return this.describe(scope, rows);
  }

  /**
   * Saves the bands as a new version in one transaction (the table is checked whole, contiguity
   * included, by the band table schema). Derived bands keep their terrain fields; a table typed by
   * hand keeps the terrain shading of every unit whose range and aspect class it leaves unchanged.
   */
  async replace(scope: TenantScope, catchmentId: number, bands: BandRow[], origin: BandTableOrigin = { source: 'entered' }, userId: number | null = null): Promise<BandRow[]> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    await scope.transaction(async (s) => {
      // The catchment row is locked first, so two saves at once get consecutive versions.
      await s.from('catchments').where('id', catchmentId).forUpdate().first('id');
      const previous = await this.current(s, catchmentId);
      const kept = origin.source === 'entered' && previous ? await this.rowsOf(s, previous.id, { terrain: true }) : [];
      const carried = (position: number): TerrainFields => kept.find((k) => sameUnit(k, bands[position])) ?? {};
      await insertBandTable(s, catchmentId, bands, { origin, userId, ...(origin.source === 'entered' ? { terrain: carried } : {}) });
      await s.from('catchments').where('id', catchmentId).update({ updated_at: s.db.fn.now() });
    });
    return bands;
  }

  /** The table as a CSV file named after the catchment, in the columns a band file is read with. */
  async csvFile(scope: TenantScope, catchmentId: number): Promise<DownloadFile> {
    const catchment = await scope.findOr404<{ name: string }>('catchments', catchmentId, 'Catchment');
    const bands = await this.list(scope, catchmentId);
    const text = csvDocument(BAND_COLUMNS.map((c) => c.field), bands.map((b) => BAND_COLUMNS.map((c) => b[c.field])));
    return csvFile(`${safeFileName(catchment.name)}-bands.csv`, text);
  }

  /** Reads an uploaded band file into rows and problems without storing it: the editor shows them, then saves. */
  readFile(file: { buffer: Buffer }): BandFileReply {
    return readBandFile(decodeCsvText(file.buffer));
  }

  private async describe(scope: TenantScope, rows: TableDbRow[]): Promise<BandTableVersion[]> {
    if (rows.length === 0) return [];
    const ids = rows.map((r) => r.id);
    const runs = await scope.from('runs').whereIn('band_table_id', ids).groupBy('band_table_id').select('band_table_id').count({ n: '*' });
    const runCount = (id: number) => Number(runs.find((x: Record<string, unknown>) => x.band_table_id === id)?.n ?? 0);
    return rows.map((r) => ({
      id: r.id, version: r.version, source: r.source, derivationId: r.derivation_id,
      bandCount: r.band_count, runCount: runCount(r.id), createdAt: new Date(r.created_at).toISOString(),
    }));
  }
}
