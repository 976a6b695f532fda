import type { ElevationChange, ObservationsReply, SnowCoverMap } from '../../../shared/schemas/geodata';
import type { TenantScope } from '../tenant-scope';
import { json, type UploadRow } from './upload-service';

interface SnowRow { upload_id: number; observed_on: string | Date; lower_m: number; upper_m: number; snow_covered_fraction: number | null; valid_fraction: number; cloud_fraction: number }
interface ChangeRow {
  upload_id: number; from_date: string | Date; to_date: string | Date; lower_m: number; upper_m: number; glacier_area_km2: number; covered_fraction: number;
  dhdt_m_per_year: number; dhdt_sigma_m_per_year: number; balance_mwe_per_year: number; balance_sigma_mwe_per_year: number; density_kg_m3: number;
}

const day = (d: string | Date) => (typeof d === 'string' ? d.slice(0, 10) : d.toISOString().slice(0, 10));

/** Remote-sensing observations of a catchment, per elevation range: snow cover by map date, geodetic balance by survey pair. */
export class RemoteSensingObservations {
  async list(scope: TenantScope, catchmentId: number): Promise<ObservationsReply> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const uploads: UploadRow[] = await scope.from<UploadRow>('geodata_uploads').where('catchment_id', catchmentId).whereIn('kind', ['snowCover', 'elevationChange']);
    const snow: SnowRow[] = await scope.from<SnowRow>('snow_cover_observations').where('catchment_id', catchmentId).orderBy(['observed_on', 'lower_m']);
    const change: ChangeRow[] = await scope.from<ChangeRow>('elevation_change_observations').where('catchment_id', catchmentId).orderBy(['upload_id', 'lower_m']);
    const snowCover: SnowCoverMap[] = uploads.filter((u) => u.kind === 'snowCover').map((u) => {
      const rows = snow.filter((r) => r.upload_id === u.id).map((r) => ({
        lowerM: r.lower_m, upperM: r.upper_m, snowCoveredFraction: r.snow_covered_fraction, validFraction: r.valid_fraction, cloudFraction: r.cloud_fraction,
      }));
      const { catchment } = json(u.summary) as unknown as { catchment: SnowCoverMap['catchment'] };
      return { uploadId: u.id, observedOn: day(u.observed_on ?? ''), fileName: u.file_name, catchment, rows };
    }).sort((a, b) => a.observedOn.localeCompare(b.observedOn));
    const elevationChange: ElevationChange[] = uploads.filter((u) => u.kind === 'elevationChange').map((u) => {
      const rows = change.filter((r) => r.upload_id === u.id);
      const summary = json<{ fromDate?: string; toDate?: string }>(u.summary);
      return {
        uploadId: u.id, fileName: u.file_name, fromDate: rows[0] ? day(rows[0].from_date) : summary.fromDate ?? '', toDate: rows[0] ? day(rows[0].to_date) : summary.toDate ?? '',
        densityKgM3: rows[0]?.density_kg_m3 ?? 850,
        rows: rows.map((r) => ({
          lowerM: r.lower_m, upperM: r.upper_m, glacierAreaKm2: r.glacier_area_km2, coveredFraction: r.covered_fraction, dhdtMPerYear: r.dhdt_m_per_year,
          dhdtSigmaMPerYear: r.dhdt_sigma_m_per_year, balanceMwePerYear: r.balance_mwe_per_year, balanceSigmaMwePerYear: r.balance_sigma_mwe_per_year,
        })),
      };
    });
    return { snowCover, elevationChange };
  }
}
