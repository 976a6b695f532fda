import type { DerivedBand } from '../../../shared/geodata/terrain-fields';
import type { deriveRequestSchema, Derivation } from '../../../shared/schemas/geodata';
import type { z } from 'zod';
import { conflict, notFound } from '../../errors';
import type { UserRow } from '../auth/auth-service';
import type { BandService } from '../catchments/band-service';
import type { TenantScope } from '../tenant-scope';
import type { DeriveOutcome, Derived } from '../../workers/geodata-worker';
import type { MapGeometry } from './map-layers';
import type { GeodataPool } from './geodata-pool';
import type { GeodataStore } from './geodata-store';
import { json, type GeodataUploads } from './upload-service';

export interface DerivationRow {
  id: number;
  catchment_id: number;
  options: string | z.output<typeof deriveRequestSchema>;
  upload_ids: string | Record<string, number>;
  result: string | Derived;
  map: string | MapGeometry;
  stored_prefix: string;
  seconds: number;
  created_at: Date;
}

export const hillshadeName = (prefix: string) => `${prefix}-hillshade.png`;
export const cellsName = (prefix: string) => `${prefix}-cells.bin`;

/**
 * Bands derived from the catchment's newest DEM and outlines, kept as previews beside the table
 * in use until one replaces it. Deriving runs in a worker thread (the horizon search takes a few
 * seconds on a large DEM) and also draws the map.
 */
export class Derivations {
  constructor(private readonly store: GeodataStore, private readonly pool: GeodataPool, private readonly uploads: GeodataUploads, private readonly bands: BandService) {}

  async derive(scope: TenantScope, user: UserRow, catchmentId: number, request: z.output<typeof deriveRequestSchema>): Promise<Derivation> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const { files, ids } = await this.uploads.derivationFiles(scope, catchmentId);
    const started = performance.now();
    const { derived, map } = await this.pool.work<DeriveOutcome>({ kind: 'derive', files, options: request, withMap: true });
    const seconds = (performance.now() - started) / 1000;
    const prefix = this.store.newName('');
    await this.store.write(scope.organisationId, hillshadeName(prefix), map!.hillshadePng);
    await this.store.write(scope.organisationId, cellsName(prefix), map!.cells);
    const id = await scope.insert('band_derivations', {
      catchment_id: catchmentId, options: JSON.stringify(request), upload_ids: JSON.stringify(ids), result: JSON.stringify(derived),
      map: JSON.stringify(map!.geometry), stored_prefix: prefix, seconds, created_by: user.id,
    });
    return this.get(scope, catchmentId, id);
  }

  async list(scope: TenantScope, catchmentId: number): Promise<Pick<Derivation, 'id' | 'createdAt' | 'seconds' | 'options' | 'inUse' | 'stale'>[]> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const rows: DerivationRow[] = await scope.from<DerivationRow>('band_derivations').where('catchment_id', catchmentId).orderBy('id', 'desc').limit(20)
      .select('id', 'catchment_id', 'options', 'upload_ids', 'seconds', 'created_at');
    const state = await this.state(scope, catchmentId);
    return rows.map((r) => ({ id: r.id, createdAt: new Date(r.created_at).toISOString(), seconds: r.seconds, options: json(r.options), ...state(r) }));
  }

  async get(scope: TenantScope, catchmentId: number, id: number): Promise<Derivation> {
    const row = await this.row(scope, catchmentId, id);
    const result = json<Derived>(row.result);
    return {
      id: row.id, createdAt: new Date(row.created_at).toISOString(), seconds: row.seconds, options: json(row.options),
      bands: result.bands.map(({ horizonDeg, ...band }) => ({ ...band, hasHorizon: horizonDeg !== undefined })),
      units: result.units.map((u) => ({ trueAreaKm2: u.trueAreaKm2, meanElevationM: u.meanElevationM, aspectConsistency: u.aspectConsistency, cells: u.cells })),
      hypsometry: result.hypsometry, summary: result.summary, notices: result.notices,
      ...(await this.state(scope, catchmentId))(row),
    };
  }

  async row(scope: TenantScope, catchmentId: number, id: number): Promise<DerivationRow> {
    const row = await scope.findOr404<DerivationRow>('band_derivations', id, 'Derivation');
    if (row.catchment_id !== catchmentId) throw notFound('Derivation');
    return row;
  }

  /** The newest derivation of the catchment, or null. */
  async newest(scope: TenantScope, catchmentId: number): Promise<DerivationRow | null> {
    return (await scope.from<DerivationRow>('band_derivations').where('catchment_id', catchmentId).orderBy('id', 'desc').first()) ?? null;
  }

  /**
   * Replaces the band table with the derived one, terrain shading included, as a new version in
   * one transaction; the old version stays for the runs made with it. Refused when a file it was
   * derived from has been replaced since (derive again).
   */
  async apply(scope: TenantScope, user: UserRow, catchmentId: number, id: number): Promise<Derivation> {
    const row = await this.row(scope, catchmentId, id);
    if ((await this.state(scope, catchmentId))(row).stale) {
      throw conflict('A file these bands were derived from has been replaced since; derive the bands again before using them.', 'derivation');
    }
    const bands: DerivedBand[] = json<Derived>(row.result).bands;
    await this.bands.replace(scope, catchmentId, bands.map(({ skyViewFactor: _s, horizonDeg: _h, ...band }) => band), { source: 'derived', derivationId: id, bands }, user.id);
    return this.get(scope, catchmentId, id);
  }

  async hillshade(scope: TenantScope, catchmentId: number, id: number): Promise<Buffer> {
    const row = await this.row(scope, catchmentId, id);
    return this.store.read(scope.organisationId, hillshadeName(row.stored_prefix));
  }

  /** Whether a derivation made the table in use, and whether its files were replaced since. */
  private async state(scope: TenantScope, catchmentId: number): Promise<(row: Pick<DerivationRow, 'id' | 'upload_ids'>) => { inUse: boolean; stale: boolean }> {
    const current = await this.bands.current(scope, catchmentId);
    const used = await this.uploads.inUse(scope, catchmentId);
    return (row) => {
      const ids = json<Record<string, number>>(row.upload_ids);
      const layers = new Set([...Object.keys(ids), ...Object.keys(used)]);
      return {
        inUse: current?.derivationId === row.id,
        stale: [...layers].some((layer) => ids[layer] !== used[layer as keyof typeof used]?.id),
      };
    };
  }
}
