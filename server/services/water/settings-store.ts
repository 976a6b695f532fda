import { checkProfile } from '../../../shared/hydrology/precipitation-profile';
import { initialGlacierOf } from '../../../shared/analysis/water-side-inputs';
import { DEFAULT_WATER_SETTINGS, waterSettingsSchema, type WaterSettings, type WaterSettingsReply } from '../../../shared/schemas/water-settings';
import type { BandRow } from '../../../shared/schemas/catchment-bands';
import { validationFailed } from '../../errors';
import type { UserRow } from '../auth/auth-service';
import type { BandService } from '../catchments/band-service';
import type { TenantScope } from '../tenant-scope';
import { refusingInput } from './hydrology-errors';

interface SettingsRow {
  settings: string | object;
  updated_at: Date;
  updated_by_name: string | null;
}

/**
 * A catchment's water settings (one JSON row per catchment; no row means the defaults). Saving
 * checks them against the catchment's bands, so a setting per band always has one value per band
 * when it is saved; a band table changed later is caught when a run starts.
 */
export class WaterSettingsStore {
  constructor(private readonly bands: BandService) {}

  async settings(scope: TenantScope, catchmentId: number): Promise<WaterSettings> {
    return (await this.get(scope, catchmentId)).settings;
  }

  async get(scope: TenantScope, catchmentId: number): Promise<WaterSettingsReply> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const row = await scope.from<SettingsRow>('catchment_water_settings')
      .leftJoin('users', 'users.id', 'catchment_water_settings.updated_by')
      .where('catchment_water_settings.catchment_id', catchmentId)
      .first('catchment_water_settings.settings', 'catchment_water_settings.updated_at', 'users.name as updated_by_name');
    if (!row) return { settings: DEFAULT_WATER_SETTINGS, updatedAt: null, updatedBy: null };
    const stored = typeof row.settings === 'string' ? JSON.parse(row.settings) : row.settings;
    return { settings: waterSettingsSchema.parse(stored), updatedAt: new Date(row.updated_at).toISOString(), updatedBy: row.updated_by_name };
  }

  /** Replaces the settings after checking them against the bands (and, through `check`, whatever else must hold). */
  async save(scope: TenantScope, user: UserRow, catchmentId: number, settings: WaterSettings, check: (settings: WaterSettings) => Promise<void>): Promise<WaterSettingsReply> {
    const catchment = await scope.findOr404<{ station_elevation_m: number }>('catchments', catchmentId, 'Catchment');
    const bands = await this.bands.list(scope, catchmentId);
    await checkAgainstBands(settings, bands, catchment.station_elevation_m);
    await check(settings);
    const json = JSON.stringify(settings);
    await scope.transaction(async (s) => {
      const updated = await s.from('catchment_water_settings').where('catchment_id', catchmentId).update({ settings: json, updated_by: user.id, updated_at: s.db.fn.now() });
      if (!updated) await s.insert('catchment_water_settings', { catchment_id: catchmentId, settings: json, updated_by: user.id });
    });
    return this.get(scope, catchmentId);
  }
}

/** Per-band settings need one value per band; hand-set profiles and fixed peaks must lie within the bands. */
export async function checkAgainstBands(settings: WaterSettings, bands: BandRow[], referenceElevationM: number): Promise<void> {
  const n = bands.length;
  const needsBands = settings.gradients.use || settings.redistribution.avalanche || settings.redistribution.windDrift || settings.glacier.method === 'thickness';
  if (needsBands && n === 0) throw validationFailed('bands: the catchment has no elevation bands yet; save its band table first.', 'bands');
  const factors = settings.redistribution.windDrift?.factors;
  if (factors && factors.length !== n) {
    throw validationFailed(`redistribution.windDrift.factors: ${factors.length} accumulation factor(s) for ${n} bands; give one per band, lowest first.`, 'redistribution.windDrift.factors');
  }
  if (settings.glacier.method === 'thickness' && settings.glacier.iceThicknessM.length !== n) {
    throw validationFailed(`glacier.iceThicknessM: ${settings.glacier.iceThicknessM.length} thickness(es) for ${n} bands; give one per band, lowest first.`, 'glacier.iceThicknessM');
  }
  if (n === 0) return;
  await refusingInput(() => initialGlacierOf(bands, settings.glacier), 'glacier');
  await refusingInput(() => settings.gradients.overrides.profiles.forEach((p, m) => p && checkProfile(p, bands, referenceElevationM, `profiles[${m}]`)), 'gradients.overrides');
  const peak = settings.gradients.fixed.peakElevationM;
  if (peak !== undefined) {
    await refusingInput(() => checkProfile({ kind: 'peaked', peakElevationM: peak, gradientBelowPerKm: 0.5, decreaseAbovePerKm: 0 }, bands, referenceElevationM, 'fixed'), 'gradients');
  }
}
