import { randomBytes } from 'node:crypto';
import type { OutlineBatch, OutlineBatchFields, OutlineBatchLayer } from '../../../shared/schemas/outline-batches';
import type { Study } from '../../../shared/schemas/studies';
import { AppError, badRequest, conflict, notFound, tooManyRequests, validationFailed } from '../../errors';
import type { UserRow } from '../auth/auth-service';
import type { GeodataPool } from '../geodata/geodata-pool';
import type { OutlineBatchRead } from '../geodata/outline-batch-reading';
import type { TempFile } from '../geodata/upload-service';
import type { TenantScope } from '../tenant-scope';
import { createOutlineCatchments } from './outline-catchments';
import { batchFiles, batchOptions, outlineLabel, outlineSummaryOf, PREVIEW_COLUMNS, toBatch, type BatchFiles, type BatchOptions, type BatchRow, type OutlineRow, type OutlineSummary } from './outline-batch-rows';
import type { OutlineDerivation } from './outline-derivation';
import { nameProblems, takenProblem } from './outline-problems';
import type { PendingBatchFiles } from './pending-batch-files';
import { climateSource, takenNames, type ClimateSource } from './region-catchments';
import type { StudyService } from './study-service';
import { draftStudy } from './study-store';

/** Longest a batch may take to be read before it counts as expired. */
const READING_HOURS = 12;

/** The catchment lending its station record, or a refusal of the field naming it (a body field, not the path: 422, not 404). */
async function stationSource(scope: TenantScope, id: number, missing: string): Promise<ClimateSource> {
  try {
    return await climateSource(scope, id);
  } catch (error) {
    if (error instanceof AppError && error.status === 404) throw validationFailed(missing, 'climateFromCatchmentId');
    throw error;
  }
}

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
  constructor(
    private readonly pool: GeodataPool,
    private readonly files: PendingBatchFiles,
    /** The background derivations (also what the context starts and stops). */
    readonly derivation: OutlineDerivation,
    private readonly studies: StudyService,
  ) {}

  async read(scope: TenantScope, user: UserRow, studyId: number, upload: Partial<Record<OutlineBatchLayer, TempFile>>, fields: OutlineBatchFields): Promise<OutlineBatch> {
    await draftStudy(scope, studyId);
    if (!upload.dem) throw badRequest('Choose the elevation model (GeoTIFF) the outlines lie on.', 'dem');
    if (!upload.catchmentOutline) throw badRequest('Choose the file of catchment outlines (GeoJSON or a zipped shapefile).', 'catchmentOutline');
    if (upload.debrisOutline && fields.debrisThicknessM === undefined) {
      throw validationFailed('Debris-cover outlines need a debris thickness: give one thickness in metres.', 'debrisThicknessM');
    }
    await stationSource(scope, fields.climateFromCatchmentId, 'The catchment chosen for the station record does not exist.');
    const busy = () => tooManyRequests('too_many_uploads', 'Your organisation is already reading a file of outlines; wait until it is done (or discard it), then try again.', 10);
    if (!this.derivation.claim(scope.organisationId)) throw busy();
    let started = false;
    try {
      if (await scope.from('pending_outline_batches').where('status', 'reading').where('expires_at', '>', new Date()).first('id')) throw busy();
      await this.files.removeExpired(scope);
      const files = await this.files.keep(scope, upload, fields);
      let read: OutlineBatchRead;
      try {
        const outlineFile = { path: upload.catchmentOutline.path, name: files.catchmentOutline.fileName };
        read = await this.pool.work<OutlineBatchRead>({ kind: 'readOutlines', files: { ...this.files.regionFiles(scope, files), catchmentOutline: outlineFile } });
      } catch (error) {
        await this.files.removeFiles(scope, files);
        throw error;
      }
      const batch = await this.insert(scope, user, studyId, files, read, fields);
      this.derivation.start(batch, scope.organisationId);
      started = true;
      return this.get(scope, studyId, batch.token);
    } finally {
      if (!started) this.derivation.release(scope.organisationId);
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
    const source = await stationSource(scope, options.climateFromCatchmentId,
      'The catchment whose station record the new catchments were to use no longer exists; upload the outlines again and choose another.');
    const files = batchFiles(row);
    const created = await createOutlineCatchments(scope, this.files.store, { batchId: row.id, studyId, files, options, outlines, source, userId: user.id }, alreadyMade);
    // Each catchment keeps its own name for the files; the batch's own go.
    await this.files.removeFiles(scope, files);
    return { study: await this.studies.get(scope, studyId), created };
  }

  /** Drops a batch not yet made into catchments (its derivation stops) and its files. */
  async discard(scope: TenantScope, studyId: number, token: string): Promise<void> {
    const row = await this.pending(scope, studyId, token);
    if (row.claimed_at) throw alreadyMade();
    await this.derivation.abort(row.id);
    await this.files.removeBatch(scope, row);
  }

  private async pending(scope: TenantScope, studyId: number, token: string): Promise<BatchRow> {
    await scope.findOr404('studies', studyId, 'Study');
    const row = await scope.from<BatchRow>('pending_outline_batches').where({ token, study_id: studyId }).first();
    if (!row) throw notFound('Pending upload');
    if (new Date(row.expires_at).getTime() < Date.now()) {
      if (!row.claimed_at) await this.files.removeBatch(scope, row);
      throw new AppError(410, 'upload_expired', 'This preview has expired; upload the files again.');
    }
    return row;
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
}
