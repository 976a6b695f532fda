import type { TenantScope } from '../tenant-scope';

const DRIVING = ['temperature', 'temperatureMin', 'temperatureMax', 'precipitation'];

/** Dates covered by every stored temperature and precipitation dataset of a catchment (their overlap), or null. */
export async function climateRecord(scope: TenantScope, catchmentId: number): Promise<{ from: string; to: string } | null> {
  const rows: { variable: string; first_at: string | null; last_at: string | null }[] = await scope.from('datasets')
    .where('catchment_id', catchmentId).whereIn('variable', DRIVING).select('variable', 'first_at', 'last_at');
  const spans = rows.filter((r) => r.first_at && r.last_at);
  if (!spans.some((r) => r.variable === 'precipitation') || !spans.some((r) => r.variable !== 'precipitation')) return null;
  const from = spans.map((r) => r.first_at!.slice(0, 10)).sort().at(-1)!;
  const to = spans.map((r) => r.last_at!.slice(0, 10)).sort()[0];
  return from <= to ? { from, to } : null;
}
