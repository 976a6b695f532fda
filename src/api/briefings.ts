import { z } from 'zod';
import {
  auditListSchema, briefingListSchema, commentListSchema, draftReplySchema, readingSchema,
  type CreateBriefingRequest, type SaveDraftRequest,
} from '@shared/schemas/briefings';
import { runListSchema } from '@shared/schemas/runs';
import { api } from './http';

const base = (id: number) => `/api/briefings/${id}`;
const versionBase = (id: number, version: number | 'latest') => `${base(id)}/versions/${version}`;

/** Typed calls for briefings: drafts, publishing, sharing, reading, comments, audit and downloads. */
export const briefingsApi = {
  list: () => api.get('/api/briefings', briefingListSchema),
  create: (request: CreateBriefingRequest) => api.post('/api/briefings', request, { schema: draftReplySchema, quiet: true }),
  draft: (id: number) => api.get(`${base(id)}/draft`, draftReplySchema),
  save: (id: number, draft: SaveDraftRequest) => api.put(`${base(id)}/draft`, draft, { schema: draftReplySchema, quiet: true }),
  preview: (id: number) => api.get(`${base(id)}/preview`, readingSchema),
  publish: (id: number) => api.post(`${base(id)}/publish`, undefined, { schema: z.object({ version: z.number().int() }) }),
  share: (id: number, emails: string[]) => api.post(`${base(id)}/shares`, { emails }, { schema: draftReplySchema, quiet: true }),
  unshare: (id: number, userId: number) => api.delete(`${base(id)}/shares/${userId}`),
  audit: (id: number) => api.get(`${base(id)}/audit`, auditListSchema),
  read: (id: number, version: number | 'latest') => api.get(versionBase(id, version), readingSchema),
  comments: (id: number) => api.get(`${base(id)}/comments`, commentListSchema),
  comment: (id: number, body: string) => api.post(`${base(id)}/comments`, { body }, { schema: commentListSchema, quiet: true }),
  pdfUrl: (id: number, version: number) => `${versionBase(id, version)}/pdf`,
  csvUrl: (id: number, version: number) => `${versionBase(id, version)}/csv`,
  /** Finished runs of a catchment, to choose from. */
  runs: (catchmentId: number) => api.get(`/api/catchments/${catchmentId}/runs`, runListSchema),
};
