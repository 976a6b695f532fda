import type { CalibrationSet } from '../../../shared/lab/calibration-set';
import type { DatedValue } from '../../../shared/lab/paired-series';
import type { LabSite, Period } from '../../../shared/lab/site';
import type { StakeObservation } from '../../../shared/lab/stake-balance';
import { validationFailed } from '../../errors';
import type { BandService } from '../catchments/band-service';
import type { DatasetRow } from '../catchments/dataset-service';
import { readDatasetValues, readStakeReadings } from '../catchments/dataset-values';
import { buildSimulationInputs, requireReadyInputs } from '../catchments/simulation-inputs';
import type { TenantScope } from '../tenant-scope';
import { drivingDatasets } from '../stations/station-rows';
import type { WaterInputSource } from '../water/water-inputs';

/** Stored data the lab computes from: the climate forcing with a spin-up, and observed discharge. */
export class LabData {
  constructor(private readonly bands: BandService, private readonly water: WaterInputSource) {}

  /** First and last dates on which both temperature and precipitation are recorded, or null without them. */
  async recordRange(scope: TenantScope, catchmentId: number): Promise<Period | null> {
    const rows: DatasetRow[] = await drivingDatasets(scope, catchmentId).orderBy('datasets.id', 'desc');
    const newest = (variables: string[]) => rows.find((r) => variables.includes(r.variable) && r.first_at && r.last_at);
    const temperature = newest(['temperature', 'temperatureMin']);
    const precipitation = newest(['precipitation']);
    if (!temperature || !precipitation) return null;
    const [t0, t1, p0, p1] = [temperature.first_at!, temperature.last_at!, precipitation.first_at!, precipitation.last_at!].map((t) => t.slice(0, 10));
    return { from: t0 > p0 ? t0 : p0, to: t1 < p1 ? t1 : p1 };
  }

  /** The catchment, its forcing from the engine's one-year spin-up (as far as the record allows) and the parameters in force. */
  async site(scope: TenantScope, catchmentId: number, period: Period, set: CalibrationSet): Promise<LabSite> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const start = (await this.recordRange(scope, catchmentId))?.from ?? null;
    if (start && period.from < start) {
      throw validationFailed(`The period starts on ${period.from}, before the climate record begins (${start}).`, 'from');
    }
    const input = requireReadyInputs(await buildSimulationInputs(scope, this.bands, catchmentId, period, { spinUpYears: 1 }));
    // The lab simulates as runs do: with the catchment's gradients, redistribution and routing, on the station precipitation.
    const water = await this.water.inputs(scope, catchmentId);
    return { catchment: input.catchment, forcing: input.forcing, parameters: set.parameters, precipitationFactor: set.precipitationFactor, water };
  }

  /** Stake readings of the newest stake dataset. */
  async observedStakes(scope: TenantScope, catchmentId: number): Promise<StakeObservation[]> {
    const row = await scope.from<DatasetRow>('datasets').where({ catchment_id: catchmentId, variable: 'pointBalance' }).orderBy('id', 'desc').first();
    if (!row) throw validationFailed('The catchment has no stake readings. Upload a stake file first.', 'stakes');
    return readStakeReadings(scope.db, { datasetId: row.id, organisationId: scope.organisationId });
  }

  /** Daily observed discharge (m³ s⁻¹) of the newest discharge record within the period. */
  async observedDischarge(scope: TenantScope, catchmentId: number, period: Period): Promise<DatedValue[]> {
    const row = await scope.from<DatasetRow>('datasets').where({ catchment_id: catchmentId, variable: 'discharge' }).orderBy('id', 'desc').first();
    if (!row) throw validationFailed('The catchment has no observed discharge. Upload a daily discharge record first.', 'discharge');
    const values = await readDatasetValues(scope.db, { datasetId: row.id, organisationId: scope.organisationId }, { from: `${period.from} 00:00`, to: `${period.to} 23:59` });
    if (values.length < 2) throw validationFailed(`The discharge record has ${values.length} value(s) between ${period.from} and ${period.to}; at least two are needed.`, 'period');
    return values.map((v) => ({ date: v.t.slice(0, 10), value: v.value }));
  }
}
