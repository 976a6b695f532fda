import { BAND_COLUMNS, type BandFileReply, type BandRow } from '../../../shared/schemas/catchment-bands';
import { csvDocument, safeFileName } from '../../../shared/csv/csv-writing';
import { csvFile, type DownloadFile } from '../download-file';
import type { TenantScope } from '../tenant-scope';
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
});

/** The band table of a catchment, read and replaced as a whole so it is always contiguous. */
export class BandService {
  async list(scope: TenantScope, catchmentId: number): Promise<BandRow[]> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const rows = await scope.from<BandDbRow>('elevation_bands').where('catchment_id', catchmentId).orderBy('position');
    return rows.map(toBand);
  }

  /** Replaces the stored table (checked whole, contiguity included, by the band table schema) in one transaction. */
  async replace(scope: TenantScope, catchmentId: number, bands: BandRow[]): Promise<BandRow[]> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    await scope.transaction(async (s) => {
      await s.from('elevation_bands').where('catchment_id', catchmentId).delete();
      await s.db('elevation_bands').insert(bands.map((b, position) => ({
        organisation_id: s.organisationId,
        catchment_id: catchmentId,
        position,
        lower_m: b.lowerM,
        upper_m: b.upperM,
        area_km2: b.areaKm2,
        slope_deg: b.slopeDeg,
        aspect_deg: b.aspectDeg,
        glacier_fraction: b.glacierFraction,
        debris_fraction: b.debrisFraction,
        debris_thickness_m: b.debrisThicknessM,
      })));
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
}
