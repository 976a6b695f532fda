import type { BandRow } from '../../../shared/schemas/catchment-bands';
import type { DerivedBand, TerrainFields } from '../../../shared/geodata/terrain-fields';
import type { TenantScope } from '../tenant-scope';

/** Where a new table version comes from: typed or read from a file, or a derivation from geodata (with its terrain shading). */
export type BandTableOrigin = { source: 'entered' } | { source: 'derived'; derivationId: number; bands: DerivedBand[] };

/** The band table in use is the catchment's newest version: this subquery names it, for queries that join on bands. */
export const CURRENT_TABLE_SQL = 'band_table_id = (SELECT MAX(t.id) FROM band_tables t WHERE t.catchment_id = ?)';

/**
 * Stores `bands` as the next version of the catchment's band table (call inside a transaction).
 * `terrain(position)` gives each row's terrain fields (none for tables typed by hand). Returns the
 * new version's id. Used by the band service, the demo seed and test set-ups.
 */
export async function insertBandTable(
  scope: TenantScope, catchmentId: number, bands: readonly BandRow[],
  options: { origin?: BandTableOrigin; userId?: number | null; terrain?: (position: number) => TerrainFields } = {},
): Promise<number> {
  const origin = options.origin ?? { source: 'entered' };
  const last = await scope.from<{ version: number }>('band_tables').where('catchment_id', catchmentId).max({ v: 'version' }).first();
  const tableId = await scope.insert('band_tables', {
    catchment_id: catchmentId, version: Number((last as { v?: number } | undefined)?.v ?? 0) + 1, source: origin.source, band_count: bands.length,
    derivation_id: origin.source === 'derived' ? origin.derivationId : null, created_by: options.userId ?? null,
  });
  const terrain = options.terrain ?? ((position: number): TerrainFields => (origin.source === 'derived' ? origin.bands[position] : {}));
  await scope.db('elevation_bands').insert(bands.map((b, position) => {
    const t = terrain(position);
    return {
      organisation_id: scope.organisationId, catchment_id: catchmentId, band_table_id: tableId, position,
      lower_m: b.lowerM, upper_m: b.upperM, area_km2: b.areaKm2, slope_deg: b.slopeDeg, aspect_deg: b.aspectDeg,
      glacier_fraction: b.glacierFraction, debris_fraction: b.debrisFraction, debris_thickness_m: b.debrisThicknessM,
      aspect_class: b.aspectClass ?? null, sky_view_factor: t.skyViewFactor ?? null, horizon_deg: t.horizonDeg ? JSON.stringify(t.horizonDeg) : null,
    };
  }));
  return tableId;
}
