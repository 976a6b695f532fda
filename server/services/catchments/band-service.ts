import { BAND_COLUMNS, bandIssuesToProblems, bandTableSchema, type BandRow } from '../../../shared/schemas/catchment-bands';
import { validationFailed } from '../../errors';
import { csvDocument } from '../../../shared/csv/csv-writing';
import type { TenantScope } from '../tenant-scope';

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

  /** Checks the whole table (each band and contiguity) and replaces the stored one in one transaction. */
  async replace(scope: TenantScope, catchmentId: number, bands: unknown): Promise<BandRow[]> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const parsed = bandTableSchema.safeParse(bands);
    if (!parsed.success) {
      const problems = bandIssuesToProblems(parsed.error.issues);
      const first = problems[0];
      const where = first.row > 0 ? `Row ${first.row}, ${first.column}: ` : 'Band table: ';
      throw validationFailed(`${where}${first.message}`, first.row > 0 ? `bands.${first.row - 1}.${first.column}` : 'bands', { problems });
    }
    await scope.transaction(async (s) => {
      await s.from('elevation_bands').where('catchment_id', catchmentId).delete();
      await s.db('elevation_bands').insert(parsed.data.map((b, position) => ({
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
    return parsed.data;
  }

  async csv(scope: TenantScope, catchmentId: number): Promise<string> {
    const bands = await this.list(scope, catchmentId);
    return csvDocument(BAND_COLUMNS.map((c) => c.field), bands.map((b) => BAND_COLUMNS.map((c) => b[c.field])));
  }
}
