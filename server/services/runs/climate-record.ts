import type { TenantScope } from '../tenant-scope';
import { drivingDatasets } from '../stations/station-rows';

const DRIVING = ['temperature', 'temperatureMin', 'temperatureMax', 'precipitation'];

/** Dates covered by every temperature and precipitation dataset of the catchment's reference station (their overlap), or null. */
export async function climateRecord(scope: TenantScope, catchmentId: number): Promise<{ from: string; to: string } | null> {
  const rows: { variable: string; first_at: string | null; last_at: string | null }[] = await drivingDatasets(scope, catchmentId)
    .whereIn('datasets.variable', DRIVING);
  const spans = rows.filter((r) => r.first_at && r.last_at);
  if (!spans.some((r) => r.variable === 'precipitation') || !spans.some((r) => r.variable !== 'precipitation')) return null;
  const from = spans.map((r) => r.first_at!.slice(0, 10)).sort().at(-1)!;
  const to = spans.map((r) => r.last_at!.slice(0, 10)).sort()[0];
  return from <= to ? { from, to } : null;
}
