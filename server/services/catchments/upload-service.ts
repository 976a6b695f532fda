import { randomBytes } from 'node:crypto';
import { promisify } from 'node:util';
import { gunzip } from 'node:zlib';
import { variableSpec } from '../../../shared/schemas/dataset-variables';
import { datasetUploadFieldsSchema, type Dataset, type UploadPreview } from '../../../shared/schemas/datasets';
import type { z } from 'zod';
import { AppError, conflict, notFound, validationFailed } from '../../errors';
import type { ReadUpload } from './csv/read-upload';
import { datasetsWithStations, toDataset, type DatasetRow } from './dataset-service';
import { referenceStation, stationOfCatchment } from '../stations/station-rows';
import { insertDatasetValues, insertStakeReadings } from './dataset-values';
import type { TenantScope } from '../tenant-scope';
import type { UploadPool } from './upload-pool';

/** How long a preview waits for confirmation. */
const PENDING_MINUTES = 60;

export interface UploadedFile {
  originalname: string;
  buffer: Buffer;
}

export type UploadFields = z.output<typeof datasetUploadFieldsSchema>;

export interface Uploader {
  id: number;
  name: string;
}

interface PendingRow {
  id: number;
  catchment_id: number;
  user_id: number;
  token: string;
  file_name: string;
  fields: string;
  read_gz: Buffer;
  claimed_at: Date | null;
  expires_at: Date;
}

const alreadyStored = () => conflict('This upload is already being stored (or was stored a moment ago); reload the datasets to see it.');

const unzip = promisify(gunzip);

/**
 * Series uploads in two steps: `preview` reads and checks the file in a worker thread and keeps
 * what it read as a pending upload (organisation-scoped, expiring, known by a random token);
 * `confirm` claims the pending upload and stores dataset and values in one transaction, or
 * nothing at all. Of several confirms of one preview exactly one stores it; the others get 409.
 */
export class UploadService {
  constructor(readonly pool: UploadPool) {}

  async preview(scope: TenantScope, catchmentId: number, file: UploadedFile, fields: UploadFields, user: Uploader): Promise<UploadPreview> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    if (fields.stationId !== undefined) await stationOfCatchment(scope, catchmentId, fields.stationId);
    const read = await this.pool.read(file.buffer, fields);
    await scope.from('pending_uploads').where('expires_at', '<', new Date()).delete();
    const token = randomBytes(24).toString('base64url');
    const expiresAt = new Date(Date.now() + PENDING_MINUTES * 60_000);
    await scope.insert('pending_uploads', {
      catchment_id: catchmentId,
      user_id: user.id,
      token,
      file_name: file.originalname.slice(0, 255),
      fields: JSON.stringify(fields),
      read_gz: read.packed,
      expires_at: expiresAt,
    });
    return { token, expiresAt: expiresAt.toISOString(), fileName: file.originalname, ...read.preview };
  }

  /** Stores the previewed file as a dataset, all or nothing; refuses files with errors. */
  async confirm(scope: TenantScope, catchmentId: number, token: string, user: Uploader): Promise<Dataset> {
    const pending = await this.pending(scope, catchmentId, token);
    if (pending.claimed_at) throw alreadyStored();
    // Stored by `preview` after the same schema parsed them, with what the worker read from the file.
    const fields = datasetUploadFieldsSchema.parse(JSON.parse(pending.fields));
    const read = JSON.parse((await unzip(pending.read_gz)).toString('utf8')) as ReadUpload;
    if (!read.preview.canConfirm) {
      throw validationFailed('The file has problems that must be fixed before it can be stored; nothing was stored.', 'file', { problems: read.preview.problems });
    }
    const spec = variableSpec(fields.variable);
    // A climate series without a named station is the reference station's, as before stations existed.
    const stationId = fields.stationId ?? (spec.kind === 'climate' ? (await referenceStation(scope, catchmentId)).id : null);
    const datasetId = await scope.transaction(async (s) => {
      // The claim: only the confirm that marks the pending row goes on (the others wait on its row lock, then
      // find it marked); the mark goes if this transaction fails. What was read is no longer needed.
      const claimed = await s.from('pending_uploads').where('id', pending.id).whereNull('claimed_at').update({ claimed_at: new Date(), read_gz: Buffer.alloc(0) });
      if (claimed !== 1) throw alreadyStored();
      const id = await s.insert('datasets', {
        catchment_id: catchmentId,
        station_id: stationId,
        variable: fields.variable,
        kind: spec.kind,
        unit: spec.storedUnit,
        original_unit: read.preview.unit,
        time_step: read.preview.timeStep,
        time_zone: fields.timeZone,
        source: fields.source,
        accuracy: fields.accuracy,
        file_name: pending.file_name,
        uploaded_by: user.id,
        uploaded_by_name: user.name,
        first_at: read.stakes ? read.preview.first : read.times[0],
        last_at: read.stakes ? read.preview.last : read.times[read.times.length - 1],
        value_count: read.preview.valueCount,
      });
      const ids = { datasetId: id, organisationId: s.organisationId };
      if (read.stakes) await insertStakeReadings(s.db, ids, read.stakes);
      else await insertDatasetValues(s.db, ids, read.times, read.values);
      return id;
    });
    const row = await datasetsWithStations(scope).where('datasets.id', datasetId).first();
    return toDataset(row as DatasetRow);
  }

  async discard(scope: TenantScope, catchmentId: number, token: string): Promise<void> {
    const pending = await this.pending(scope, catchmentId, token);
    if (pending.claimed_at) throw alreadyStored();
    await scope.from('pending_uploads').where('id', pending.id).delete();
  }

  private async pending(scope: TenantScope, catchmentId: number, token: string): Promise<PendingRow> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    const row = await scope.from<PendingRow>('pending_uploads').where({ token, catchment_id: catchmentId }).first();
    if (!row) throw notFound('Pending upload');
    if (new Date(row.expires_at).getTime() < Date.now()) {
      await scope.from('pending_uploads').where('id', row.id).delete();
      throw new AppError(410, 'upload_expired', 'This preview has expired; upload the file again.');
    }
    return row;
  }
}
