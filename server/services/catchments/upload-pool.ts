import type { UploadOutcome, UploadTask } from '../../workers/upload-worker';
import { AppError } from '../../errors';
import { ThreadPool } from '../thread-pool';
import type { ThreadBudget } from '../thread-budget';
import type { SeriesFileOptions } from './csv/series-file';

/** Worker threads that read uploaded CSV files (server/workers/upload-worker.ts); the user waits, so interactive. */
export class UploadPool extends ThreadPool<UploadTask, UploadOutcome> {
  constructor(budget: ThreadBudget) {
    super(new URL('../../workers/upload-worker.ts', import.meta.url), budget, 'interactive');
  }

  /** The preview and the packed values of a file, or its refusal rethrown as the AppError it was. */
  async read(file: Buffer, fields: SeriesFileOptions) {
    const outcome = await this.run({ file, fields });
    if (!outcome.ok) {
      const r = outcome.refusal;
      throw new AppError(r.status, r.code, r.message, r.field, r.details);
    }
    return { preview: outcome.preview, packed: Buffer.from(outcome.packed) };
  }
}
