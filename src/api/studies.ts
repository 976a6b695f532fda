import { bulkCatchmentsReplySchema, regionalResultsReplySchema, studyListSchema, studyReplySchema, type StudyCreate } from '@shared/schemas/studies';
import { outlineBatchReplySchema, type OutlineBatchLayer } from '@shared/schemas/outline-batches';
import { queueStatusReplySchema } from '@shared/schemas/queue';
import { api } from './http';

const base = (id: number) => `/api/studies/${id}`;

/** Typed calls for regional studies and the queue page. */
export const studiesApi = {
  list: () => api.get('/api/studies', studyListSchema),
  get: (id: number, signal?: AbortSignal) => api.get(base(id), studyReplySchema, { signal }),
  create: (body: StudyCreate) => api.post('/api/studies', body, { schema: studyReplySchema, quiet: true }),
  addTable: (id: number, rows: Record<string, unknown>[], climateFromCatchmentId: number) =>
    api.post(`${base(id)}/catchment-table`, { rows, climateFromCatchmentId }, { schema: bulkCatchmentsReplySchema, quiet: true }),
  /** Many catchments over one DEM: the files and the derivation's fields sent, the outlines read and derived in the background. */
  readOutlines: (id: number, files: Partial<Record<OutlineBatchLayer, File>>, fields: Record<string, string>) => {
    const form = new FormData();
    for (const [key, value] of Object.entries(fields)) if (value !== '') form.append(key, value);
    for (const [layer, file] of Object.entries(files)) if (file) form.append(layer, file);
    return api.post(`${base(id)}/outline-batches`, undefined, { form, schema: outlineBatchReplySchema, quiet: true });
  },
  outlineBatch: (id: number, token: string, signal?: AbortSignal) => api.get(`${base(id)}/outline-batches/${token}`, outlineBatchReplySchema, { signal }),
  confirmOutlines: (id: number, token: string) => api.post(`${base(id)}/outline-batches/${token}/confirm`, undefined, { schema: bulkCatchmentsReplySchema, quiet: true }),
  discardOutlines: (id: number, token: string) => api.delete(`${base(id)}/outline-batches/${token}`, { quiet: true }),
  start: (id: number) => api.post(`${base(id)}/start`, undefined, { schema: studyReplySchema }),
  retry: (id: number) => api.post(`${base(id)}/retry`, undefined, { schema: studyReplySchema }),
  cancel: (id: number) => api.post(`${base(id)}/cancel`, undefined, { schema: studyReplySchema }),
  results: (id: number) => api.get(`${base(id)}/results`, regionalResultsReplySchema),
  csvUrl: (id: number) => `${base(id)}/export/regional.csv`,
  queue: (signal?: AbortSignal) => api.get('/api/queue', queueStatusReplySchema, { signal }),
};
