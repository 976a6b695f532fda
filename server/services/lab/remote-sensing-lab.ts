import type { CalibrationSet } from '../../../shared/lab/calibration-set';
import type { GeodeticComparison, GeodeticObservation } from '../../../shared/lab/geodetic-skill';
import type { Period } from '../../../shared/lab/site';
import type { SnowCoverComparison, SnowCoverObservation } from '../../../shared/lab/snow-cover-skill';
import type { CalibrationJobRequest } from '../../../shared/schemas/lab';
import type { RemoteSensingSkillRequest } from '../../../shared/schemas/lab-remote-sensing';
import { validationFailed } from '../../errors';
import type { RemoteSensingTask } from '../../workers/lab-remote-sensing';
import type { TenantScope } from '../tenant-scope';
import type { LabData } from './lab-data';
import type { LabRunner } from './lab-queue';

const day = (d: string | Date) => (typeof d === 'string' ? d.slice(0, 10) : d.toISOString().slice(0, 10));

/**
 * Calibration targets from remote sensing, beside discharge and stakes: snow-covered fraction per
 * band and map date against the engine's snow cover, and the geodetic balance profile against the
 * simulated glacier balance, from the observations stored with the catchment's geodata.
 */
export class RemoteSensingLab {
  constructor(private readonly data: LabData, private readonly pool: LabRunner, private readonly inForce: (scope: TenantScope, catchmentId: number) => Promise<CalibrationSet>) {}

  async snowCoverSkill(scope: TenantScope, catchmentId: number, request: RemoteSensingSkillRequest): Promise<{ set: CalibrationSet; comparison: SnowCoverComparison }> {
    const set = request.set ?? await this.inForce(scope, catchmentId);
    const { observed, span } = await this.snowCover(scope, catchmentId);
    const site = await this.data.site(scope, catchmentId, span, set);
    return { set, comparison: await this.pool.run<SnowCoverComparison>({ kind: 'snowCoverSkill', site, observed }, { organisationId: scope.organisationId }) };
  }

  async geodeticSkill(scope: TenantScope, catchmentId: number, request: RemoteSensingSkillRequest): Promise<{ set: CalibrationSet; comparison: GeodeticComparison }> {
    const set = request.set ?? await this.inForce(scope, catchmentId);
    const observed = await this.geodetic(scope, catchmentId);
    const site = await this.data.site(scope, catchmentId, await this.record(scope, catchmentId), set);
    return { set, comparison: await this.pool.run<GeodeticComparison>({ kind: 'geodeticSkill', site, observed }, { organisationId: scope.organisationId }) };
  }

  /** The worker task of an automatic calibration against snow cover (maps inside the period) or the geodetic balance (over the record). */
  async calibrationTask(scope: TenantScope, catchmentId: number, request: CalibrationJobRequest, start: CalibrationSet): Promise<RemoteSensingTask> {
    const search = { keys: request.keys, start, maxEvaluations: request.maxEvaluations, seed: request.seed };
    if (request.target === 'snowCover') {
      const { observed } = await this.snowCover(scope, catchmentId, request.period);
      return { kind: 'calibrateSnowCover', site: await this.data.site(scope, catchmentId, request.period, start), observed, ...search };
    }
    const observed = await this.geodetic(scope, catchmentId);
    return { kind: 'calibrateGeodetic', site: await this.data.site(scope, catchmentId, await this.record(scope, catchmentId), start), observed, ...search };
  }

  /** Snow-cover observations whose dates lie in the climate record (and in `within`, when given), and the span they cover. */
  private async snowCover(scope: TenantScope, catchmentId: number, within?: Period): Promise<{ observed: SnowCoverObservation[]; span: Period }> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const record = await this.record(scope, catchmentId);
    const from = within && within.from > record.from ? within.from : record.from;
    const to = within && within.to < record.to ? within.to : record.to;
    const rows: { observed_on: string | Date; lower_m: number; upper_m: number; snow_covered_fraction: number | null; valid_fraction: number }[] =
      await scope.from('snow_cover_observations').where('catchment_id', catchmentId).whereBetween('observed_on', [from, to]).orderBy(['observed_on', 'lower_m']);
    if (rows.length === 0) throw validationFailed(`No snow-cover map of the catchment is dated between ${from} and ${to}, inside the climate record. Upload snow-cover maps in the catchment's Geodata tab.`, 'snowCover');
    const observed = rows.map((r) => ({ date: day(r.observed_on), lowerM: r.lower_m, upperM: r.upper_m, snowCoveredFraction: r.snow_covered_fraction, validFraction: r.valid_fraction }));
    return { observed, span: { from: observed[0].date, to: observed.at(-1)!.date } };
  }

  /** The newest elevation change's bands. */
  private async geodetic(scope: TenantScope, catchmentId: number): Promise<GeodeticObservation[]> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const newest = await scope.from('elevation_change_observations').where('catchment_id', catchmentId).max({ id: 'upload_id' }).first();
    const rows: { from_date: string | Date; to_date: string | Date; lower_m: number; upper_m: number; glacier_area_km2: number; balance_mwe_per_year: number; balance_sigma_mwe_per_year: number }[] =
      newest?.id ? await scope.from('elevation_change_observations').where('upload_id', newest.id).orderBy('lower_m') : [];
    if (rows.length === 0) throw validationFailed('The catchment has no glacier elevation change. Upload one in the catchment\'s Geodata tab.', 'elevationChange');
    return rows.map((r) => ({
      fromDate: day(r.from_date), toDate: day(r.to_date), lowerM: r.lower_m, upperM: r.upper_m, glacierAreaKm2: r.glacier_area_km2,
      balanceMwePerYear: r.balance_mwe_per_year, sigmaMwePerYear: r.balance_sigma_mwe_per_year,
    }));
  }

  private async record(scope: TenantScope, catchmentId: number): Promise<Period> {
    const record = await this.data.recordRange(scope, catchmentId);
    if (!record) throw validationFailed('The catchment has no climate record (temperature and precipitation) to simulate with.', 'climate');
    return record;
  }
}
