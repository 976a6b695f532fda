import { randomBytes } from 'node:crypto';
import { gunzipSync, gzipSync } from 'node:zlib';
import { STAKE_VARIABLE, variableSpec } from '../../../shared/schemas/dataset-variables';
import { datasetUploadFieldsSchema, type Dataset, type UploadPreview } from '../../../shared/schemas/datasets';
import type { z } from 'zod';
import { AppError, notFound, validationFailed } from '../../errors';
import { readSeriesFile, type SeriesFileOptions } from './csv/series-file';
import { readStakeFile } from './csv/stake-file';
import { decodeCsvText } from './csv/read-table';
import { datasetsWithStations, toDataset, type DatasetRow } from './dataset-service';
import { referenceStation, stationOfCatchment } from '../stations/station-rows';
import { insertDatasetValues, insertStakeReadings } from './dataset-values';
import type { TenantScope } from '../tenant-scope';

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
  content_gz: Buffer;
  expires_at: Date;
}

/**
 * Series uploads in two steps: `preview` reads and checks the file and keeps it as a pending
 * upload (organisation-scoped, expiring, known by a random token); `confirm` reads it again and
 * stores dataset and values in one transaction, or nothing at all.
 */
export class UploadService {
  async preview(scope: TenantScope, catchmentId: number, file: UploadedFile, fields: UploadFields, user: Uploader): Promise<UploadPreview> {
    await scope.findOr404('catchments', catchmentId, 'Catchment');
    if (fields.stationId !== undefined) await stationOfCatchment(scope, catchmentId, fields.stationId);
    const text = decodeCsvText(file.buffer);
    const read = readUpload(text, fields);
    await scope.from('pending_uploads').where('expires_at', '<', new Date()).delete();
    const token = randomBytes(24).toString('base64url');
    const expiresAt = new Date(Date.now() + PENDING_MINUTES * 60_000);
    await scope.insert('pending_uploads', {
      catchment_id: catchmentId,
      user_id: user.id,
      token,
      file_name: file.originalname.slice(0, 255),
      fields: JSON.stringify(fields),
      content_gz: gzipSync(text, { level: 1 }),
      expires_at: expiresAt,
    });
    return { token, expiresAt: expiresAt.toISOString(), fileName: file.originalname, ...read.preview };
  }

  /** Stores the previewed file as a dataset, all or nothing; refuses files with errors. */
  async confirm(scope: TenantScope, catchmentId: number, token: string, user: Uploader): Promise<Dataset> {
    const pending = await this.pending(scope, catchmentId, token);
    // Stored by `preview` after the same schema parsed them.
    const fields = datasetUploadFieldsSchema.parse(JSON.parse(pending.fields));
    const read = readUpload(gunzipSync(pending.content_gz).toString('utf8'), fields);
    if (!read.preview.canConfirm) {
      throw validationFailed('The file has problems that must be fixed before it can be stored; nothing was stored.', 'file', { problems: read.preview.problems });
    }
    const spec = variableSpec(fields.variable);
    // A climate series without a named station is the reference station's, as before stations existed.
    const stationId = fields.stationId ?? (spec.kind === 'climate' ? (await referenceStation(scope, catchmentId)).id : null);
    const datasetId = await scope.transaction(async (s) => {
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
      await s.from('pending_uploads').where('id', pending.id).delete();
      return id;
    });
    const row = await datasetsWithStations(scope).where('datasets.id', datasetId).first();
    return toDataset(row as DatasetRow);
  }

  async discard(scope: TenantScope, catchmentId: number, token: string): Promise<void> {
    const pending = await this.pending(scope, catchmentId, token);
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

/** Stake readings have their own columns; every other variable is a time series. */
function readUpload(text: string, fields: SeriesFileOptions) {
  if (fields.variable !== STAKE_VARIABLE) return { ...readSeriesFile(text, fields), stakes: undefined };
  const read = readStakeFile(text, fields.unit);
  return { ...read, stakes: read.readings };
}
