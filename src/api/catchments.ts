import { z } from 'zod';
import {
  catchmentListSchema, catchmentReplySchema, type CATCHMENT_SORTS, type CatchmentFields,
} from '@shared/schemas/catchments';
import { bandFileReplySchema, bandTableReplySchema, type BandRow } from '@shared/schemas/catchment-bands';
import {
  datasetListSchema, datasetReplySchema, monthlySummarySchema, seriesSchema, uploadPreviewSchema, type DatasetUploadFields,
} from '@shared/schemas/datasets';
import { stakeReadingsSchema } from '@shared/schemas/stakes';
import { api } from './http';

export interface CatchmentListParams {
  page: number;
  perPage: number;
  sort: (typeof CATCHMENT_SORTS)[number];
  descending: boolean;
  search: string;
  archived: boolean;
}

const base = (id: number) => `/api/catchments/${id}`;

function query(params: Record<string, string | number | boolean | undefined>): string {
  const entries = Object.entries(params).filter(([, v]) => v !== undefined && v !== '').map(([k, v]) => [k, String(v)]);
  return new URLSearchParams(entries).toString();
}

function fileForm(file: File, fields: Record<string, string | undefined> = {}): FormData {
  const form = new FormData();
  for (const [key, value] of Object.entries(fields)) if (value) form.append(key, value);
  form.append('file', file);
  return form;
}

/** Typed calls for catchments, their bands and their datasets. */
export const catchmentsApi = {
  list: (params: CatchmentListParams) => api.get(`/api/catchments?${query({ ...params })}`, catchmentListSchema),
  get: (id: number) => api.get(base(id), catchmentReplySchema),
  create: (fields: CatchmentFields) => api.post('/api/catchments', fields, { schema: catchmentReplySchema, quiet: true }),
  update: (id: number, fields: CatchmentFields) => api.put(base(id), fields, { schema: catchmentReplySchema, quiet: true }),
  setArchived: (id: number, archived: boolean) => api.post(`${base(id)}/archive`, { archived }, { schema: catchmentReplySchema }),
  remove: (id: number) => api.delete(base(id), { schema: z.object({ outcome: z.enum(['archived', 'deleted']) }) }),

  bands: (id: number) => api.get(`${base(id)}/bands`, bandTableReplySchema),
  saveBands: (id: number, bands: BandRow[]) => api.put(`${base(id)}/bands`, { bands }, { schema: bandTableReplySchema, quiet: true }),
  readBandFile: (id: number, file: File) => api.post(`${base(id)}/bands/file`, undefined, { form: fileForm(file), schema: bandFileReplySchema }),
  bandsCsvUrl: (id: number) => `${base(id)}/bands.csv`,

  datasets: (id: number) => api.get(`${base(id)}/datasets`, datasetListSchema),
  series: (id: number, datasetId: number) => api.get(`${base(id)}/datasets/${datasetId}/series`, seriesSchema),
  monthly: (id: number, datasetId: number) => api.get(`${base(id)}/datasets/${datasetId}/monthly`, monthlySummarySchema),
  stakeReadings: (id: number, datasetId: number) => api.get(`${base(id)}/datasets/${datasetId}/readings`, stakeReadingsSchema),
  datasetCsvUrl: (id: number, datasetId: number) => `${base(id)}/datasets/${datasetId}/csv`,
  removeDataset: (id: number, datasetId: number) => api.delete(`${base(id)}/datasets/${datasetId}`),

  previewUpload: (id: number, file: File, fields: DatasetUploadFields) =>
    api.post(`${base(id)}/uploads`, undefined, { form: fileForm(file, fields as Record<string, string | undefined>), schema: uploadPreviewSchema, quiet: true }),
  confirmUpload: (id: number, token: string) => api.post(`${base(id)}/uploads/${token}/confirm`, undefined, { schema: datasetReplySchema, quiet: true }),
  discardUpload: (id: number, token: string) => api.delete(`${base(id)}/uploads/${token}`, { quiet: true }),
};
