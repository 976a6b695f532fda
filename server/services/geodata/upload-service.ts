import { GEODATA_LIMITS } from '../../../shared/geodata/limits';
import { SINGLE_LAYERS, type GeodataLayer, type GeodataUpload, type GeodataUploadFields, type UploadSummary } from '../../../shared/schemas/geodata';
import type { ElevationRange } from '../../../shared/geodata/table-zones';
import { validationFailed } from '../../errors';
import type { UserRow } from '../auth/auth-service';
import type { BandService } from '../catchments/band-service';
import type { TenantScope } from '../tenant-scope';
import type { ElevationChangeOutcome, SnowCoverOutcome } from '../../workers/geodata-worker';
import type { GeodataPool } from './geodata-pool';
import type { GeodataStore } from './geodata-store';
import type { GeodataFiles, StoredFile } from './read-inputs';

/** A file multer wrote to the temporary folder. */
export interface TempFile {
  path: string;
  originalname: string;
  size: number;
}

export interface UploadRow {
  id: number;
  catchment_id: number;
  kind: GeodataLayer;
  file_name: string;
  byte_size: number;
  stored_name: string;
  observed_on: string | Date | null;
  summary: string | UploadSummary;
  created_at: Date;
}

const isoDay = (d: string | Date | null) => (d === null ? null : typeof d === 'string' ? d.slice(0, 10) : d.toISOString().slice(0, 10));
export const json = <T>(v: string | T): T => (typeof v === 'string' ? (JSON.parse(v) as T) : v);
/** The second DEM of an elevation change is kept beside the first under the same name. */
const afterName = (name: string) => `${name}.after.tif`;

export function toUpload(row: UploadRow): GeodataUpload {
  return {
    id: row.id, layer: row.kind, fileName: row.file_name, byteSize: Number(row.byte_size), observedOn: isoDay(row.observed_on),
    summary: json<UploadSummary>(row.summary), createdAt: new Date(row.created_at).toISOString(),
  };
}

/**
 * Geodata files of a catchment: each upload is read and checked in a worker thread before anything
 * is stored; snow-cover maps and elevation changes are reduced per band of the table in use and
 * stored with their observations in one transaction. Of the DEM, the outlines and the thickness
 * raster only the newest is kept.
 */
export class GeodataUploads {
  constructor(private readonly store: GeodataStore, private readonly pool: GeodataPool, private readonly bands: BandService) {}

  async list(scope: TenantScope, catchmentId: number): Promise<{ uploads: GeodataUpload[]; limits: { rasterFileMb: number; rasterCellsMillion: number; outlineFileMb: number } }> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const rows: UploadRow[] = await scope.from<UploadRow>('geodata_uploads').where('catchment_id', catchmentId).orderBy('id', 'desc');
    return {
      uploads: rows.map((r) => toUpload(r)),
      limits: { rasterFileMb: GEODATA_LIMITS.rasterFileBytes / 1024 ** 2, rasterCellsMillion: GEODATA_LIMITS.rasterCells / 1e6, outlineFileMb: GEODATA_LIMITS.outlineFileBytes / 1024 ** 2 },
    };
  }

  /** The newest upload of each single layer, by layer. */
  async inUse(scope: TenantScope, catchmentId: number): Promise<Partial<Record<GeodataLayer, UploadRow>>> {
    const rows: UploadRow[] = await scope.from<UploadRow>('geodata_uploads').where('catchment_id', catchmentId).whereIn('kind', SINGLE_LAYERS).orderBy('id', 'desc');
    const newest: Partial<Record<GeodataLayer, UploadRow>> = {};
    for (const row of rows) newest[row.kind] ??= row;
    return newest;
  }

  /** The files bands are derived from, or a 422 naming what is missing. */
  async derivationFiles(scope: TenantScope, catchmentId: number): Promise<{ files: GeodataFiles; ids: Record<string, number> }> {
    const used = await this.inUse(scope, catchmentId);
    if (!used.dem) throw validationFailed('Upload an elevation model (GeoTIFF) of the catchment first.', 'dem');
    if (!used.catchmentOutline) throw validationFailed('Upload the catchment outline (GeoJSON or zipped shapefile) first.', 'catchmentOutline');
    const file = (row: UploadRow | undefined): StoredFile | undefined => row && {
      path: this.store.path(scope.organisationId, row.stored_name), name: row.file_name,
      verticalUnit: json<UploadSummary & { verticalUnit?: StoredFile['verticalUnit'] }>(row.summary).verticalUnit,
    };
    const ids = Object.fromEntries(Object.entries(used).map(([layer, row]) => [layer, row.id]));
    return {
      files: { dem: file(used.dem)!, catchmentOutline: file(used.catchmentOutline)!, glacierOutline: file(used.glacierOutline), debrisOutline: file(used.debrisOutline), debrisThickness: file(used.debrisThickness) },
      ids,
    };
  }

  async add(scope: TenantScope, user: UserRow, catchmentId: number, layer: GeodataLayer, upload: { file: TempFile; after?: TempFile }, fields: GeodataUploadFields): Promise<GeodataUpload> {
    checkFields(layer, fields, upload.after);
    const verticalUnit = layer === 'dem' && fields.verticalUnit !== '' ? fields.verticalUnit : undefined;
    const file: StoredFile = { path: upload.file.path, name: upload.file.originalname, verticalUnit };
    const after = upload.after && { path: upload.after.path, name: upload.after.originalname };
    const summary: UploadSummary & { verticalUnit?: string } = await this.pool.work<UploadSummary>({ kind: 'inspect', layer, file, after });
    if (verticalUnit) summary.verticalUnit = verticalUnit;
    const observations = await this.reduce(scope, catchmentId, layer, file, after, fields, summary);
    const storedName = this.store.nameFor(upload.file.originalname);
    await this.store.keep(scope.organisationId, upload.file.path, storedName);
    if (upload.after) await this.store.keep(scope.organisationId, upload.after.path, afterName(storedName));
    let replaced: UploadRow[] = [];
    try {
      const id = await scope.transaction(async (s) => {
        replaced = SINGLE_LAYERS.includes(layer) ? await s.from<UploadRow>('geodata_uploads').where({ catchment_id: catchmentId, kind: layer }) : [];
        const uploadId = await s.insert('geodata_uploads', {
          catchment_id: catchmentId, kind: layer, file_name: upload.file.originalname.slice(0, 255), byte_size: upload.file.size + (upload.after?.size ?? 0),
          stored_name: storedName, observed_on: layer === 'snowCover' ? fields.observedOn : null, summary: JSON.stringify(summary), uploaded_by: user.id,
        });
        if (replaced.length > 0) await s.from('geodata_uploads').whereIn('id', replaced.map((r) => r.id)).delete();
        await observations?.(s, uploadId);
        return uploadId;
      });
      await this.removeFiles(scope, replaced);
      return toUpload(await scope.findOr404<UploadRow>('geodata_uploads', id, 'Upload'));
    } catch (error) {
      await this.store.remove(scope.organisationId, [storedName, afterName(storedName)]);
      throw error;
    }
  }

  async remove(scope: TenantScope, catchmentId: number, uploadId: number): Promise<void> {
    const row = await scope.findOr404<UploadRow>('geodata_uploads', uploadId, 'Upload');
    if (row.catchment_id !== catchmentId) throw validationFailed('This upload belongs to another catchment.', 'uploadId');
    await scope.from('geodata_uploads').where('id', uploadId).delete();
    await this.removeFiles(scope, [row]);
  }

  private async removeFiles(scope: TenantScope, rows: UploadRow[]): Promise<void> {
    await this.store.remove(scope.organisationId, rows.flatMap((r) => [r.stored_name, afterName(r.stored_name)]));
  }

  /** Reduces a snow map or an elevation change per band of the table in use; returns how to store the rows. */
  private async reduce(
    scope: TenantScope, catchmentId: number, layer: GeodataLayer, file: StoredFile, after: StoredFile | undefined, fields: GeodataUploadFields,
    summary: UploadSummary,
  ): Promise<((s: TenantScope, uploadId: number) => Promise<void>) | null> {
    if (layer !== 'snowCover' && layer !== 'elevationChange') return null;
    const { files } = await this.derivationFiles(scope, catchmentId);
    const bands = await this.bands.list(scope, catchmentId);
    if (bands.length === 0) throw validationFailed('The catchment has no band table yet: derive or enter its bands first, so the observations can be reduced per band.', 'bands');
    const ranges: ElevationRange[] = bands.map((b) => ({ lowerM: b.lowerM, upperM: b.upperM }));
    if (layer === 'snowCover') {
      const codes = { snow: fields.snowCodes, noSnow: fields.noSnowCodes, cloud: fields.cloudCodes, nodata: fields.nodataCodes };
      const outcome = await this.pool.work<SnowCoverOutcome>({ kind: 'snowCover', files, ranges, map: file, codes });
      Object.assign(summary, { classCodes: codes, catchment: outcome.catchment });
      summary.notices.push(...outcome.notices);
      summary.facts.push(`snow-covered ${formatShare(outcome.catchment.snowCoveredFraction)} of the cloud-free catchment, ${formatShare(outcome.catchment.validFraction)} seen`);
      return async (s, uploadId) => {
        await s.db('snow_cover_observations').insert(outcome.rows.map((r) => ({
          organisation_id: s.organisationId, catchment_id: catchmentId, upload_id: uploadId, observed_on: fields.observedOn,
          lower_m: r.lowerM, upper_m: r.upperM, snow_covered_fraction: r.snowCoveredFraction, valid_fraction: r.validFraction, cloud_fraction: r.cloudFraction,
        })));
      };
    }
    const source = fields.changeKind === 'rate'
      ? { kind: 'rate' as const, dhdt: file }
      : { kind: 'two-dems' as const, before: file, after: after!, beforeDate: fields.fromDate, afterDate: fields.toDate };
    const outcome = await this.pool.work<ElevationChangeOutcome>({ kind: 'elevationChange', files, ranges, source, densityKgM3: fields.densityKgM3, densitySigmaKgM3: fields.densitySigmaKgM3 });
    const density = fields.densityKgM3 ?? 850;
    Object.assign(summary, { fromDate: fields.fromDate, toDate: fields.toDate, densityKgM3: density });
    summary.notices.push(...outcome.notices);
    const rows = outcome.rows.filter((r) => r.dhdtMPerYear !== null);
    if (rows.length === 0) throw validationFailed('No band of the glacier has elevation-change data.', 'elevationChange');
    return async (s, uploadId) => {
      await s.db('elevation_change_observations').insert(rows.map((r) => ({
        organisation_id: s.organisationId, catchment_id: catchmentId, upload_id: uploadId, from_date: fields.fromDate, to_date: fields.toDate,
        lower_m: r.lowerM, upper_m: r.upperM, glacier_area_km2: r.glacierAreaKm2, covered_fraction: r.coveredFraction,
        dhdt_m_per_year: r.dhdtMPerYear, dhdt_sigma_m_per_year: r.dhdtSigmaMPerYear, balance_mwe_per_year: r.balanceMwePerYear,
        balance_sigma_mwe_per_year: r.balanceSigmaMwePerYear, density_kg_m3: density,
      })));
    };
  }
}

const formatShare = (v: number | null) => (v === null ? '–' : `${(v * 100).toFixed(0)} %`);

/** What each layer needs besides its file. */
function checkFields(layer: GeodataLayer, fields: GeodataUploadFields, after: TempFile | undefined): void {
  if (layer === 'snowCover' && fields.observedOn === '') throw validationFailed('Give the date the snow-cover map shows.', 'observedOn');
  if (layer === 'elevationChange') {
    if (fields.fromDate === '' || fields.toDate === '') throw validationFailed('Give the dates of both surveys the elevation change spans.', fields.fromDate === '' ? 'fromDate' : 'toDate');
    if (fields.toDate <= fields.fromDate) throw validationFailed('The second survey must be dated after the first.', 'toDate');
    if (fields.changeKind === 'two-dems' && !after) throw validationFailed('Upload the second DEM too (field "after").', 'after');
  }
}
