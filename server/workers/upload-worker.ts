import type { PooledTask } from '../services/thread-pool';
import { AppError } from '../errors';
import { packUpload, readUpload } from '../services/catchments/csv/read-upload';
import type { SeriesFileOptions } from '../services/catchments/csv/series-file';

export interface UploadTask {
  file: Uint8Array;
  fields: SeriesFileOptions;
}

/** A refusal crosses the thread boundary as data: an Error's class and fields would not. */
export type UploadOutcome =
  | { ok: true; preview: ReturnType<typeof readUpload>['preview']; packed: Uint8Array }
  | { ok: false; refusal: { status: number; code: string; message: string; field?: string; details?: unknown } };

/** Reads and checks an uploaded CSV file in a worker thread, so a large file never holds up the API. */
export default function readUploadTask({ task }: PooledTask<UploadTask>): UploadOutcome {
  try {
    const read = readUpload(Buffer.from(task.file.buffer, task.file.byteOffset, task.file.byteLength), task.fields);
    return { ok: true, preview: read.preview, packed: packUpload(read) };
  } catch (error) {
    if (!(error instanceof AppError)) throw error;
    return { ok: false, refusal: { status: error.status, code: error.code, message: error.message, field: error.field, details: error.details } };
  }
}
