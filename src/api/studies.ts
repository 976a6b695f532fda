import { bulkCatchmentsReplySchema, regionalResultsReplySchema, studyListSchema, studyReplySchema, type StudyCreate } from '@shared/schemas/studies';
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
  start: (id: number) => api.post(`${base(id)}/start`, undefined, { schema: studyReplySchema }),
  retry: (id: number) => api.post(`${base(id)}/retry`, undefined, { schema: studyReplySchema }),
  cancel: (id: number) => api.post(`${base(id)}/cancel`, undefined, { schema: studyReplySchema }),
  results: (id: number) => api.get(`${base(id)}/results`, regionalResultsReplySchema),
  csvUrl: (id: number) => `${base(id)}/export/regional.csv`,
  queue: (signal?: AbortSignal) => api.get('/api/queue', queueStatusReplySchema, { signal }),
};
