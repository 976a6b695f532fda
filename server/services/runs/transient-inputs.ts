import { completeRecordYears, planTransient, type TransientPlan } from '../../../shared/analysis/transient-plan';
import { initialGlacierOf, type WaterInputs } from '../../../shared/analysis/water-side-inputs';
import type { TransientMemberPlan } from '../../../shared/analysis/transient-member';
import type { TransientOptions } from '../../../shared/schemas/runs';
import { validationFailed } from '../../errors';
import type { TenantScope } from '../tenant-scope';
import { refusingInput } from '../water/hydrology-errors';
import type { CatchmentInputs, CatchmentInputSource } from './catchment-inputs';
import { climateRecord } from './climate-record';

export interface TransientInputs {
  stored: CatchmentInputs;
  plan: TransientPlan;
  member: TransientMemberPlan;
}

/**
 * What a multi-decade run needs: the forcing of every complete mass-balance year of the record
 * (no spin-up stretch before it: the first scenario year spins up by itself), the scenario years
 * on the warming path, and the glacier it starts from (the catchment's glacier settings).
 * Refuses, naming the field, a record without a complete year, a path that cannot be planned, or
 * glacier settings that do not fit the bands.
 */
export async function transientInputs(scope: TenantScope, catchmentId: number, options: TransientOptions, inputs: CatchmentInputSource, water: WaterInputs): Promise<TransientInputs> {
  const catchment = await scope.findOr404<{ latitude_deg: number }>('catchments', catchmentId, 'Catchment');
  const record = await climateRecord(scope, catchmentId);
  if (!record) throw validationFailed('transient: the catchment has no climate record of temperature and precipitation at its reference station yet.', 'transient');
  const years = completeRecordYears(record, catchment.latitude_deg);
  const plan = await refusingInput(() => planTransient(options, years), 'transient');
  const stored = await inputs(scope, catchmentId, { from: years[0].from, to: years[years.length - 1].to }, { spinUpYears: 0 });
  const glacier = await refusingInput(() => initialGlacierOf(stored.catchment.bands, water.glacier), 'glacier');
  if (!glacier.areaKm2.some((a) => a > 0)) throw validationFailed('transient: the catchment\'s bands hold no glacier, so a multi-decade glacier run has nothing to follow; set glacier fractions in the band table.', 'transient');
  return { stored, plan, member: { years: plan.years, periods: plan.periods, glacier: { areaKm2: Array.from(glacier.areaKm2), thicknessM: Array.from(glacier.thicknessM) } } };
}
