import { randomBytes } from 'node:crypto';
import { promisify } from 'node:util';
import { gzip } from 'node:zlib';
import type { Knex } from 'knex';
import type { OutlineBatch, OutlineBatchFields, OutlineBatchLayer } from '../../../shared/schemas/outline-batches';
import type { Study } from '../../../shared/schemas/studies';
import { AppError, badRequest, conflict, notFound, tooManyRequests, validationFailed } from '../../errors';
import type { UserRow } from '../auth/auth-service';
import { cellsName, hillshadeName } from '../geodata/derivation-service';
import type { GeodataPool } from '../geodata/geodata-pool';
import type { GeodataStore } from '../geodata/geodata-store';
import type { OutlineBatchFiles, OutlineBatchRead } from '../geodata/outline-batch-reading';
import type { StoredFile } from '../geodata/read-inputs';
import type { TempFile } from '../geodata/upload-service';
import { safeError, type Logger } from '../../logger';
import { BackgroundWork } from '../background-work';
import { TenantScope } from '../tenant-scope';
import type { DeriveOutcome } from '../../workers/geodata-worker';
import { createOutlineCatchments } from './outline-catchments';
import { batchFiles, batchOptions, outlineLabel, outlineSummaryOf, PREVIEW_COLUMNS, toBatch, type BatchFile, type BatchFiles, type BatchOptions, type BatchRow, type OutlineRow, type OutlineSummary } from './outline-batch-rows';
import { cellsProblem, nameProblems, takenProblem } from './outline-problems';
import { climateSource, takenNames } from './region-catchments';
import type { StudyService } from './study-service';
import { draftStudy } from './study-store';

/** How long a preview waits for its confirm once read. */
const PENDING_MINUTES = 60;
/** Longest a batch may take to be read before it counts as expired. */
const READING_HOURS = 12;
const RESTART_MESSAGE = 'The server restarted while the outlines were being read; upload the files again.';
const SHUTDOWN = new Error(RESTART_MESSAGE);
const pack = promisify(gzip);

type RegionFiles = Omit<OutlineBatchFiles, 'catchmentOutline'>;

const alreadyMade = () => conflict('The catchments of these outlines have already been made (or are being made); reload the study to see them.');

/**
 * Many catchments over one DEM, in two steps. `read` checks the DEM and the outline file in a
 * worker thread as the single-catchment upload does, lists the outlines with what is wrong with
 * their names, answers, and derives every outline in the background (one geodata task each, behind
 * the tasks a user waits for) into a pending batch the preview polls. `confirm` claims the batch
 * and makes every catchment with its geodata, derivation and band table in one transaction, or
 * none. One batch of an organisation is read at a time.
 */
export class OutlineBatches {
  private readonly deriving = new BackgroundWork<number>();
  private readonly readingFor = new Set<number>();

  constructor(
    private readonly db: Knex,
    private readonly geodata: { store: GeodataStore; pool: GeodataPool },
    private readonly studies: StudyService,
    private readonly logger: Logger,
  ) {}

  async read(scope: TenantScope, user: UserRow, studyId: number, upload: Partial<Record<OutlineBatchLayer, TempFile>>, fields: OutlineBatchFields): Promise<OutlineBatch> {
    await draftStudy(scope, studyId);
    if (!upload.dem) throw badRequest('Choose the elevation model (GeoTIFF) the outlines lie on.', 'dem');
    if (!upload.catchmentOutline) throw badRequest('Choose the file of catchment outlines (GeoJSON or a zipped shapefile).', 'catchmentOutline');
    if (upload.debrisOutline && fields.debrisThicknessM === undefined) {
      throw validationFailed('Debris-cover outlines need a debris thickness: give one thickness in metres.', 'debrisThicknessM');
    }
    await climateSource(scope, fields.climateFromCatchmentId).catch(() => {
      throw validationFailed('The catchment chosen for the station record does not exist.', 'climateFromCatchmentId');
    });
    if (this.readingFor.has(scope.organisationId) || await scope.from('pending_outline_batches').where('status', 'reading').where('expires_at', '>', new Date()).first('id')) {
      throw tooManyRequests('too_many_uploads', 'Your organisation is already reading a file of outlines; wait until it is done (or discard it), then try again.', 10);
    }
    this.readingFor.add(scope.organisationId);
    let started = false;
    try {
      await this.removeExpired(scope);
      const files = await this.keep(scope, upload, fields);
      let read: OutlineBatchRead;
      try {
        const outlineFile = { path: upload.catchmentOutline.path, name: files.catchmentOutline.fileName };
        read = await this.geodata.pool.work<OutlineBatchRead>({ kind: 'readOutlines', files: { ...this.regionFiles(scope, files), catchmentOutline: outlineFile } });
      } catch (error) {
        await this.removeFiles(scope, files);
        throw error;
      }
      const batch = await this.insert(scope, user, studyId, files, read, fields);
      this.startDeriving(batch, scope.organisationId);
      started = true;
      return this.get(scope, studyId, batch.token);
    } finally {
      if (!started) this.readingFor.delete(scope.organisationId);
    }
  }

  async get(scope: TenantScope, studyId: number, token: string): Promise<OutlineBatch> {
    const row = await this.pending(scope, studyId, token);
    const outlines: Pick<OutlineRow, 'feature_number' | 'name' | 'summary'>[] = await scope.from('pending_outlines').where('batch_id', row.id).orderBy('feature_number').select(...PREVIEW_COLUMNS);
    return toBatch(row, outlines);
  }

  /** Makes one catchment per outline, all or none; of several confirms exactly one makes them, the others get 409. */
  async confirm(scope: TenantScope, user: UserRow, studyId: number, token: string): Promise<{ study: Study; created: { id: number; name: string }[] }> {
    const row = await this.pending(scope, studyId, token);
    if (row.claimed_at) throw alreadyMade();
    if (row.status === 'reading') throw conflict(`The outlines are still being derived (${row.done_count} of ${row.outline_count}); confirm once every one is done.`);
    if (row.status === 'failed') throw conflict(row.error_message ?? 'Reading the outlines failed; upload the files again.');
    await draftStudy(scope, studyId);
    const outlines: OutlineRow[] = await scope.from<OutlineRow>('pending_outlines').where('batch_id', row.id).orderBy('feature_number');
    // A catchment may have been given one of the names since the preview.
    const taken = await takenNames(scope, outlines.flatMap((o) => (o.name === null ? [] : [o.name])));
    const problems = outlines.flatMap((o) => {
      const own = [...outlineSummaryOf(o).problems, ...(o.name !== null && taken.has(o.name.toLowerCase()) ? [takenProblem(o.name)] : [])];
      return [...new Set(own)].map((message) => ({ feature: o.feature_number, name: o.name, message }));
    });
    if (problems.length > 0) {
      const [first] = problems;
      const more = problems.length > 1 ? ` (${problems.length - 1} more problem${problems.length > 2 ? 's' : ''} in the preview.)` : '';
      throw validationFailed(`Nothing was made. ${outlineLabel(first.feature, first.name)}: ${first.message}${more}`, 'catchmentOutline', { problems });
    }
    const options = batchOptions(row);
    const source = await climateSource(scope, options.climateFromCatchmentId).catch(() => {
      throw validationFailed('The catchment whose station record the new catchments were to use no longer exists; upload the outlines again and choose another.', 'climateFromCatchmentId');
    });
    const files = batchFiles(row);
    const created = await createOutlineCatchments(scope, this.geodata.store, { batchId: row.id, studyId, files, options, outlines, source, userId: user.id }, alreadyMade);
    // Each catchment keeps its own name for the files; the batch's own go.
    await this.removeFiles(scope, files);
    return { study: await this.studies.get(scope, studyId), created };
  }

  /** Drops a batch not yet made into catchments (its derivation stops) and its files. */
  async discard(scope: TenantScope, studyId: number, token: string): Promise<void> {
    const row = await this.pending(scope, studyId, token);
    if (row.claimed_at) throw alreadyMade();
    await this.deriving.abort(row.id, new Error('Discarded.'));
    await this.removeBatch(scope, row);
  }

  /** Marks batches an earlier process left reading as failed (their derivation ran in that process). */
  async recover(): Promise<void> {
    await this.db('pending_outline_batches').where('status', 'reading').update({ status: 'failed', error_message: RESTART_MESSAGE });
  }

  /** Resolves when no batch is being derived (tests). */
  async idle(): Promise<void> {
    await this.deriving.idle();
  }

  /** Shutdown within a deadline: waits up to `graceMs`, then stops the batches still deriving as failed with the restart message. */
  async stop(graceMs: number): Promise<void> {
    await this.deriving.stop(graceMs, SHUTDOWN);
  }

  private async pending(scope: TenantScope, studyId: number, token: string): Promise<BatchRow> {
    await scope.findOr404('studies', studyId, 'Study');
    const row = await scope.from<BatchRow>('pending_outline_batches').where({ token, study_id: studyId }).first();
    if (!row) throw notFound('Pending upload');
    if (new Date(row.expires_at).getTime() < Date.now()) {
      if (!row.claimed_at) await this.removeBatch(scope, row);
      throw new AppError(410, 'upload_expired', 'This preview has expired; upload the files again.');
    }
    return row;
  }

  /** Moves the DEM and the region's outlines into the geodata store (the outline file is split into its outlines instead). */
  private async keep(scope: TenantScope, upload: Partial<Record<OutlineBatchLayer, TempFile>>, fields: OutlineBatchFields): Promise<BatchFiles> {
    const files: Partial<BatchFiles> = {};
    for (const [layer, file] of Object.entries(upload) as [OutlineBatchLayer, TempFile][]) {
      const storedName = layer === 'catchmentOutline' ? null : this.geodata.store.nameFor(file.originalname);
      if (storedName) await this.geodata.store.keep(scope.organisationId, file.path, storedName);
      const verticalUnit = layer === 'dem' && fields.verticalUnit !== '' ? { verticalUnit: fields.verticalUnit } : {};
      files[layer] = { storedName, fileName: file.originalname.slice(0, 255), byteSize: file.size, summary: { system: '', facts: [], notices: [], ...verticalUnit } };
    }
    return files as BatchFiles;
  }

  /** Where the worker finds the DEM and the region's outlines of a batch. */
  private regionFiles(scope: TenantScope, files: BatchFiles): RegionFiles {
    const stored = (f: BatchFile | undefined): StoredFile | undefined => f?.storedName
      ? { path: this.geodata.store.path(scope.organisationId, f.storedName), name: f.fileName, verticalUnit: f.summary.verticalUnit }
      : undefined;
    return { dem: stored(files.dem)!, glacierOutline: stored(files.glacierOutline), debrisOutline: stored(files.debrisOutline) };
  }

  /** The batch and one row per outline, with the problems of their names and geometry. */
  private async insert(scope: TenantScope, user: UserRow, studyId: number, files: BatchFiles, read: OutlineBatchRead, fields: OutlineBatchFields): Promise<BatchRow> {
    for (const layer of ['dem', 'glacierOutline', 'debrisOutline'] as const) {
      const summary = read[layer];
      const file = files[layer];
      if (summary && file) file.summary = { ...summary, ...(file.summary.verticalUnit ? { verticalUnit: file.summary.verticalUnit } : {}) };
    }
    files.catchmentOutline.summary = { system: read.features.find((f) => f.summary)?.summary?.system ?? '', facts: [`${read.features.length} outline(s)`], notices: [] };
    const names = nameProblems(read.features, await takenNames(scope, read.features.flatMap((f) => (f.name === null ? [] : [f.name]))));
    const { verticalUnit: _unit, ...options } = fields;
    const token = randomBytes(24).toString('base64url');
    await scope.transaction(async (s) => {
      const batchId = await s.insert('pending_outline_batches', {
        study_id: studyId, user_id: user.id, token, status: 'reading', options: JSON.stringify(options satisfies BatchOptions), files: JSON.stringify(files),
        outline_count: read.features.length, done_count: read.features.filter((f) => f.geoJson === null).length,
        expires_at: new Date(Date.now() + READING_HOURS * 3600_000),
      });
      await s.db('pending_outlines').insert(read.features.map((f) => {
        const summary: OutlineSummary = { problems: [...(f.problem ? [f.problem] : []), ...(names.get(f.number) ?? [])], notices: [], upload: f.summary, derived: null, refused: f.geoJson === null };
        return { organisation_id: s.organisationId, batch_id: batchId, feature_number: f.number, name: f.name?.slice(0, 255) ?? null, outline_geojson: f.geoJson, summary: JSON.stringify(summary) };
      }));
    });
    return (await scope.from<BatchRow>('pending_outline_batches').where('token', token).first())!;
  }

  private startDeriving(row: BatchRow, organisationId: number): void {
    this.deriving.run(row.id, (signal) => this.deriveAll(new TenantScope(this.db, organisationId), row, signal).catch((error: unknown) => {
      this.logger.error({ err: safeError(error), batchId: row.id }, 'deriving a batch of outlines failed');
    }).finally(() => this.readingFor.delete(organisationId)));
  }

  /** Derives every outline of the batch, as many at once as the thread budget has threads, then marks it ready (or failed). */
  private async deriveAll(scope: TenantScope, row: BatchRow, signal: AbortSignal): Promise<void> {
    const files = batchFiles(row);
    const options = batchOptions(row);
    try {
      const queue: Pick<OutlineRow, 'id' | 'outline_geojson' | 'summary'>[] = await scope.from('pending_outlines').where('batch_id', row.id).whereNotNull('outline_geojson').orderBy('feature_number').select('id', 'outline_geojson', 'summary');
      const next = async (): Promise<void> => {
        for (let outline = queue.shift(); outline; outline = queue.shift()) {
          await this.deriveOne(scope, row.id, this.regionFiles(scope, files), options, outline, signal);
        }
      };
      await Promise.all(Array.from({ length: Math.min(this.geodata.pool.threads, Math.max(1, queue.length)) }, next));
      await scope.from('pending_outline_batches').where('id', row.id).update({ status: 'ready', expires_at: new Date(Date.now() + PENDING_MINUTES * 60_000) });
    } catch (error) {
      if (signal.aborted && signal.reason !== SHUTDOWN) return;
      const message = signal.aborted ? RESTART_MESSAGE : 'The outlines could not be derived (an error on our side); upload the files again.';
      await scope.from('pending_outline_batches').where('id', row.id).update({ status: 'failed', error_message: message });
      await this.removeFiles(scope, files, await this.mapPrefixes(scope, row.id));
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
      const { derived, map } = await this.geodata.pool.work<DeriveOutcome>(
        { kind: 'deriveOutline', files, outline: row.outline_geojson!, options: deriveOptions },
        { signal, priority: 'batch' },
      );
      const prefix = this.geodata.store.newName('');
      await this.geodata.store.write(scope.organisationId, hillshadeName(prefix), map!.hillshadePng);
      await this.geodata.store.write(scope.organisationId, cellsName(prefix), map!.cells);
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

  private async mapPrefixes(scope: TenantScope, batchId: number): Promise<string[]> {
    const rows: { stored_prefix: string | null }[] = await scope.from('pending_outlines').where('batch_id', batchId).whereNotNull('stored_prefix').select('stored_prefix');
    return rows.map((r) => r.stored_prefix!);
  }

  private async removeFiles(scope: TenantScope, files: BatchFiles, mapPrefixes: string[] = []): Promise<void> {
    const names = Object.values(files).flatMap((f) => (f?.storedName ? [f.storedName] : []));
    await this.geodata.store.remove(scope.organisationId, [...names, ...mapPrefixes.flatMap((p) => [hillshadeName(p), cellsName(p)])]);
  }

  /** A batch never made into catchments: its row, its files and its map images go. */
  private async removeBatch(scope: TenantScope, row: BatchRow): Promise<void> {
    const prefixes = await this.mapPrefixes(scope, row.id);
    await scope.from('pending_outline_batches').where('id', row.id).delete();
    await this.removeFiles(scope, batchFiles(row), prefixes);
  }

  private async removeExpired(scope: TenantScope): Promise<void> {
    const rows: BatchRow[] = await scope.from<BatchRow>('pending_outline_batches').where('expires_at', '<', new Date());
    for (const row of rows) {
      if (row.claimed_at) await scope.from('pending_outline_batches').where('id', row.id).delete();
      else await this.removeBatch(scope, row);
    }
  }
}
