import { promisify } from 'node:util';
import { gzip } from 'node:zlib';
import type { Knex } from 'knex';
import { AppError } from '../../errors';
import { safeError, type Logger } from '../../logger';
import { BackgroundWork } from '../background-work';
import { cellsName, hillshadeName } from '../geodata/derivation-service';
import type { GeodataPool } from '../geodata/geodata-pool';
import { TenantScope } from '../tenant-scope';
import type { DeriveOutcome } from '../../workers/geodata-worker';
import { batchFiles, batchOptions, outlineSummaryOf, type BatchOptions, type BatchRow, type OutlineRow } from './outline-batch-rows';
import { cellsProblem } from './outline-problems';
import type { PendingBatchFiles, RegionFiles } from './pending-batch-files';

/** How long a preview waits for its confirm once read. */
const PENDING_MINUTES = 60;
const RESTART_MESSAGE = 'The server restarted while the outlines were being read; upload the files again.';
const SHUTDOWN = new Error(RESTART_MESSAGE);
const pack = promisify(gzip);

/**
 * The outlines of pending batches derived in the background: one geodata task per outline at
 * batch priority (behind the tasks a user waits for), as many at once as the thread budget has
 * threads, each outline's result or problem stored as it comes (the preview polls them), then the
 * batch marked ready, or failed. One batch of an organisation is read at a time, in this process.
 */
export class OutlineDerivation {
  private readonly deriving = new BackgroundWork<number>();
  private readonly readingFor = new Set<number>();

  constructor(private readonly db: Knex, private readonly pool: GeodataPool, private readonly files: PendingBatchFiles, private readonly logger: Logger) {}

  /** Whether the organisation has a batch being read here; else marks it as having one (until `release` or the derivation's end). */
  claim(organisationId: number): boolean {
    if (this.readingFor.has(organisationId)) return false;
    this.readingFor.add(organisationId);
    return true;
  }

  release(organisationId: number): void {
    this.readingFor.delete(organisationId);
  }

  start(row: BatchRow, organisationId: number): void {
    this.deriving.run(row.id, (signal) => this.deriveAll(new TenantScope(this.db, organisationId), row, signal).catch((error: unknown) => {
      this.logger.error({ err: safeError(error), batchId: row.id }, 'deriving a batch of outlines failed');
    }).finally(() => this.release(organisationId)));
  }

  /** Stops a batch's derivation (discarded): false when none runs here. */
  abort(batchId: number): Promise<boolean> {
    return this.deriving.abort(batchId, new Error('Discarded.'));
  }

  /** Marks batches an earlier process left reading as failed (their derivation ran in that process). */
  async recover(): Promise<void> {
    await this.db('pending_outline_batches').where('status', 'reading').update({ status: 'failed', error_message: RESTART_MESSAGE });
  }

  /** Resolves when no batch is being derived (tests). */
  idle(): Promise<void> {
    return this.deriving.idle();
  }

  /** Shutdown within a deadline: waits up to `graceMs`, then stops the batches still deriving as failed with the restart message. */
  stop(graceMs: number): Promise<void> {
    return this.deriving.stop(graceMs, SHUTDOWN);
  }

  /** Derives every outline of the batch, as many at once as the thread budget has threads, then marks it ready (or failed). */
  private async deriveAll(scope: TenantScope, row: BatchRow, signal: AbortSignal): Promise<void> {
    const files = batchFiles(row);
    const options = batchOptions(row);
    try {
      const queue: Pick<OutlineRow, 'id' | 'outline_geojson' | 'summary'>[] = await scope.from('pending_outlines').where('batch_id', row.id).whereNotNull('outline_geojson').orderBy('feature_number').select('id', 'outline_geojson', 'summary');
      const next = async (): Promise<void> => {
        for (let outline = queue.shift(); outline; outline = queue.shift()) {
          await this.deriveOne(scope, row.id, this.files.regionFiles(scope, files), options, outline, signal);
        }
      };
      await Promise.all(Array.from({ length: Math.min(this.pool.threads, Math.max(1, queue.length)) }, next));
      await scope.from('pending_outline_batches').where('id', row.id).update({ status: 'ready', expires_at: new Date(Date.now() + PENDING_MINUTES * 60_000) });
    } catch (error) {
      if (signal.aborted && signal.reason !== SHUTDOWN) return;
      const message = signal.aborted ? RESTART_MESSAGE : 'The outlines could not be derived (an error on our side); upload the files again.';
      await scope.from('pending_outline_batches').where('id', row.id).update({ status: 'failed', error_message: message });
      await this.files.removeFiles(scope, files, await this.files.mapPrefixes(scope, row.id));
      if (!signal.aborted) throw error;
    }
  }

  /** One outline: its bands, terrain shading and map derived (the map images kept), or the problem that stops it. */
  private async deriveOne(scope: TenantScope, batchId: number, files: RegionFiles, options: BatchOptions, row: Pick<OutlineRow, 'id' | 'outline_geojson' | 'summary'>, signal: AbortSignal): Promise<void> {
    const summary = outlineSummaryOf(row);
    const { climateFromCatchmentId: _source, ...deriveOptions } = options;
    const patch: Partial<Record<keyof OutlineRow, unknown>> = {};
    const started = performance.now();
    try {
      const { derived, map } = await this.pool.work<DeriveOutcome>(
        { kind: 'deriveOutline', files, outline: row.outline_geojson!, options: deriveOptions },
        { signal, priority: 'batch' },
      );
      const prefix = this.files.store.newName('');
      await this.files.store.write(scope.organisationId, hillshadeName(prefix), map!.hillshadePng);
      await this.files.store.write(scope.organisationId, cellsName(prefix), map!.cells);
      const cells = derived.units.reduce((n, u) => n + u.cells, 0);
      const few = cellsProblem(cells, derived.summary.areaKm2);
      summary.derived = {
        areaKm2: derived.summary.areaKm2, minElevationM: derived.summary.minElevationM, maxElevationM: derived.summary.maxElevationM,
        bandCount: derived.bands.length, glacierAreaKm2: derived.summary.glacierAreaKm2, cells,
      };
      summary.problems.push(...(few ? [few] : []));
      summary.notices = derived.notices.map((n) => n.message);
      Object.assign(patch, { stored_prefix: prefix, derived_gz: await pack(JSON.stringify({ derived, map: map!.geometry, seconds: (performance.now() - started) / 1000 })) });
    } catch (error) {
      // What the derivation refuses (outside the DEM, too much nodata, too coarse) is this outline's problem; anything else stops the batch.
      if (!(error instanceof AppError) || error.status >= 500 || signal.aborted) throw error;
      summary.problems.push(error.message);
      summary.refused = true;
    }
    await scope.from('pending_outlines').where('id', row.id).update({ ...patch, summary: JSON.stringify(summary) });
    await scope.from('pending_outline_batches').where('id', batchId).increment('done_count', 1);
  }

}
