import type { OutlineBatchFields, OutlineBatchLayer } from '../../../shared/schemas/outline-batches';
import { cellsName, hillshadeName } from '../geodata/derivation-service';
import type { GeodataStore } from '../geodata/geodata-store';
import type { OutlineBatchFiles } from '../geodata/outline-batch-reading';
import type { StoredFile } from '../geodata/read-inputs';
import type { TempFile } from '../geodata/upload-service';
import type { TenantScope } from '../tenant-scope';
import { batchFiles, type BatchFile, type BatchFiles, type BatchRow } from './outline-batch-rows';

/** Where the worker finds the DEM and the region's outlines of a batch. */
export type RegionFiles = Omit<OutlineBatchFiles, 'catchmentOutline'>;

/**
 * The files of pending batches in the geodata store: the DEM and region outlines kept from the
 * upload until the catchments are made, and each outline's map images once derived. A batch made
 * into catchments leaves its map images to their derivations; one that never is takes everything
 * with it.
 */
export class PendingBatchFiles {
  constructor(readonly store: GeodataStore) {}

  /** Moves the DEM and the region's outlines into the geodata store (the outline file is split into its outlines instead). */
  async keep(scope: TenantScope, upload: Partial<Record<OutlineBatchLayer, TempFile>>, fields: OutlineBatchFields): Promise<BatchFiles> {
    const files: Partial<BatchFiles> = {};
    for (const [layer, file] of Object.entries(upload) as [OutlineBatchLayer, TempFile][]) {
      const storedName = layer === 'catchmentOutline' ? null : this.store.nameFor(file.originalname);
      if (storedName) await this.store.keep(scope.organisationId, file.path, storedName);
      const verticalUnit = layer === 'dem' && fields.verticalUnit !== '' ? { verticalUnit: fields.verticalUnit } : {};
      files[layer] = { storedName, fileName: file.originalname.slice(0, 255), byteSize: file.size, summary: { system: '', facts: [], notices: [], ...verticalUnit } };
    }
    return files as BatchFiles;
  }

  /** Where the worker finds the DEM and the region's outlines of a batch. */
  regionFiles(scope: TenantScope, files: BatchFiles): RegionFiles {
    const stored = (f: BatchFile | undefined): StoredFile | undefined => f?.storedName
      ? { path: this.store.path(scope.organisationId, f.storedName), name: f.fileName, verticalUnit: f.summary.verticalUnit }
      : undefined;
    return { dem: stored(files.dem)!, glacierOutline: stored(files.glacierOutline), debrisOutline: stored(files.debrisOutline) };
  }

  /** The names the batch's map images were written under, one per outline derived. */
  async mapPrefixes(scope: TenantScope, batchId: number): Promise<string[]> {
    const rows: { stored_prefix: string | null }[] = await scope.from('pending_outlines').where('batch_id', batchId).whereNotNull('stored_prefix').select('stored_prefix');
    return rows.map((r) => r.stored_prefix!);
  }

  /** Removes the files a batch kept (and the map images under `mapPrefixes`). */
  async removeFiles(scope: TenantScope, files: BatchFiles, mapPrefixes: string[] = []): Promise<void> {
    const names = Object.values(files).flatMap((f) => (f?.storedName ? [f.storedName] : []));
    await this.store.remove(scope.organisationId, [...names, ...mapPrefixes.flatMap((p) => [hillshadeName(p), cellsName(p)])]);
  }

  /** A batch never made into catchments: its row, its files and its map images go. */
  async removeBatch(scope: TenantScope, row: BatchRow): Promise<void> {
    const prefixes = await this.mapPrefixes(scope, row.id);
    await scope.from('pending_outline_batches').where('id', row.id).delete();
    await this.removeFiles(scope, batchFiles(row), prefixes);
  }

  /** Removes the organisation's expired batches (what they kept too, unless they were made into catchments). */
  async removeExpired(scope: TenantScope): Promise<void> {
    const rows: BatchRow[] = await scope.from<BatchRow>('pending_outline_batches').where('expires_at', '<', new Date());
    for (const row of rows) {
      if (row.claimed_at) await scope.from('pending_outline_batches').where('id', row.id).delete();
      else await this.removeBatch(scope, row);
    }
  }
}
